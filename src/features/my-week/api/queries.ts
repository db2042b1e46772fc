// The athlete's week: key factory and query options, shared by the route loader and the components.
import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { MyWeek } from '../../../../shared/schemas';
import { apiWithDate } from '../../../lib/api-client';

export const myWeekKeys = {
  all: ['my-week'] as const,
  weeks: () => [...myWeekKeys.all, 'week'] as const,
  week: (week: string | null) => [...myWeekKeys.weeks(), week ?? 'current'] as const,
};

/** An answer this old when it arrives came from the offline copy, not from the server just now. */
const FROM_CACHE_AFTER_MS = 2 * 60_000;

/** The week, with when the server gave it and whether it was read from the offline copy. */
export type MyWeekAnswer = MyWeek & { receivedAt: string | null; fromCache: boolean };

/** The week as the page keeps it, given when the server gave it (its Date; null when unknown). */
export function toMyWeekAnswer(data: MyWeek, date: Date | null): MyWeekAnswer {
  const fromCache = date !== null && Date.now() - date.getTime() > FROM_CACHE_AFTER_MS;
  return { ...data, receivedAt: date?.toISOString() ?? null, fromCache };
}

export const myWeekQueryOptions = (week: string | null = null) =>
  queryOptions({
    queryKey: myWeekKeys.week(week),
    queryFn: async ({ signal }): Promise<MyWeekAnswer> => {
      const { data, date } = await apiWithDate<MyWeek>(`/my-week${week ? `?week=${encodeURIComponent(week)}` : ''}`, {
        signal,
      });
      return toMyWeekAnswer(data, date);
    },
  });

export function useMyWeek(week: string | null = null) {
  return useQuery(myWeekQueryOptions(week));
}

/** The signed-in athlete, read from any week already loaded (the owner of writes kept offline). */
export function currentAthleteId(queryClient: QueryClient): number | null {
  for (const [, week] of queryClient.getQueriesData<MyWeekAnswer>({ queryKey: myWeekKeys.weeks() })) {
    if (week) return week.athlete.id;
  }
  return null;
}
