// Seeds the query cache with the first glance the server drew into the page, under the keys the guard and
// My week read, so the first render has the week at once and asks the server for nothing again.
import type { QueryClient } from '@tanstack/react-query';
import { myWeekKeys, toMyWeekAnswer } from '../features/my-week/api/queries';
import type { FirstGlance } from '../lib/first-glance';
import { authKeys } from '../lib/query-keys';

export function seedFirstGlance(queryClient: QueryClient, glance: FirstGlance | null): void {
  if (!glance) return;
  const at = new Date(glance.at);
  if (Number.isNaN(at.getTime())) return;
  // Read when the server drew the page: fresh for as long as any answer read at that moment.
  const updatedAt = Math.min(at.getTime(), Date.now());
  queryClient.setQueryData(authKeys.me(), glance.me, { updatedAt });
  queryClient.setQueryData(myWeekKeys.week(glance.week), toMyWeekAnswer(glance.myWeek, at), { updatedAt });
}
