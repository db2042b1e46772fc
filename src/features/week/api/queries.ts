// One athlete's training week (coaches): key factory and query options for the route loader and the editor.
import { queryOptions } from '@tanstack/react-query';
import type { AthleteWeek } from '../../../../shared/schemas';
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
