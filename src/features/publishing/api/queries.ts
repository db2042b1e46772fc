// Publishing: the key factory, the state of one week's publication (who gets it, what was sent) and the
// check a publish runs first (a dry run: nothing is stored or sent).
import { queryOptions } from '@tanstack/react-query';
import { publishCheckSchema, type Publication } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const publishingKeys = {
  all: ['publishing'] as const,
  week: (week: string) => [...publishingKeys.all, 'week', week] as const,
  checks: () => [...publishingKeys.all, 'check'] as const,
  check: (week: string) => [...publishingKeys.checks(), week] as const,
};

export const publicationQueryOptions = (week: string) =>
  queryOptions({
    queryKey: publishingKeys.week(week),
    queryFn: ({ signal }) => api<Publication>(`/weeks/${encodeURIComponent(week)}/publication`, { signal }),
  });

/** The board may have changed since the last look: the check is run afresh every time it is shown. */
export const publishCheckQueryOptions = (week: string) =>
  queryOptions({
    queryKey: publishingKeys.check(week),
    queryFn: async ({ signal }) =>
      publishCheckSchema.parse(
        await api<unknown>(`/weeks/${encodeURIComponent(week)}/publish`, {
          method: 'POST',
          body: { dryRun: true },
          signal,
        }),
      ),
    staleTime: 0,
    gcTime: 0,
  });
