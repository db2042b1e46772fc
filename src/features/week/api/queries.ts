// One athlete's training week (coaches): key factory and query options for the route loader and the editor.
import { queryOptions } from '@tanstack/react-query';
import type { AccessorySuggestion, AthleteWeek, LibraryAccessory, ListResponse } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const weekKeys = {
  all: ['athlete-week'] as const,
  athlete: (athleteId: number) => [...weekKeys.all, athleteId] as const,
  week: (athleteId: number, week: string) => [...weekKeys.athlete(athleteId), week] as const,
};

export const athleteWeekOptions = (athleteId: number, week: string) =>
  queryOptions({
    queryKey: weekKeys.week(athleteId, week),
    queryFn: ({ signal }) => api<AthleteWeek>(`/athletes/${athleteId}/weeks/${encodeURIComponent(week)}`, { signal }),
  });

/**
 * The team's accessory library for the editor's pickers, archived ones included (a week may still name one).
 * Under the accessory library's own list key, so its edits refresh this list too.
 */
export const weekAccessoryLibraryOptions = () =>
  queryOptions({
    queryKey: ['accessories', 'list', { q: '', category: '', includeArchived: true }] as const,
    queryFn: ({ signal }) =>
      api<ListResponse<LibraryAccessory>>('/accessories?limit=500&sort=category&includeArchived=true', { signal }),
  });

/** What the rotation suggests for the week's sessions (read on demand; nothing is saved). */
export const accessorySuggestionOptions = (athleteId: number, week: string) =>
  queryOptions({
    queryKey: [...weekKeys.week(athleteId, week), 'accessory-suggestion'] as const,
    queryFn: ({ signal }) =>
      api<AccessorySuggestion>(`/athletes/${athleteId}/weeks/${encodeURIComponent(week)}/accessories`, { signal }),
    staleTime: 0,
  });
