// The athlete's week: key factory and query options, shared by the route loader and the components.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyWeek } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const myWeekKeys = {
  all: ['my-week'] as const,
  weeks: () => [...myWeekKeys.all, 'week'] as const,
  week: (week: string | null) => [...myWeekKeys.weeks(), week ?? 'current'] as const,
};

export const myWeekQueryOptions = (week: string | null = null) =>
  queryOptions({
    queryKey: myWeekKeys.week(week),
    queryFn: ({ signal }) => api<MyWeek>(`/my-week${week ? `?week=${encodeURIComponent(week)}` : ''}`, { signal }),
  });

export function useMyWeek(week: string | null = null) {
  return useQuery(myWeekQueryOptions(week));
}
