// My week's data, started by the router at once, beside the sign-in check and the page's code (kept out
// of the page module so the route table can hold it without pulling in the page).
import type { QueryClient } from '@tanstack/react-query';
import { isIsoWeek } from '../../../shared/engine/weeks';
import { myWeekQueryOptions } from '../../features/my-week/api/queries';

export function weekParam(search: URLSearchParams): string | null {
  const w = search.get('week');
  return w && isIsoWeek(w) ? w : null;
}

export function makeLoader(queryClient: QueryClient) {
  return async ({ request }: { request: Request }) => {
    await queryClient.ensureQueryData(myWeekQueryOptions(weekParam(new URL(request.url).searchParams)));
    return null;
  };
}
