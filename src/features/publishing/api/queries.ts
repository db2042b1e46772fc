// Publishing: the key factory and the state of one week's publication (who gets it, what was sent).
import { queryOptions } from '@tanstack/react-query';
import type { Publication } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const publishingKeys = {
  all: ['publishing'] as const,
  week: (week: string) => [...publishingKeys.all, 'week', week] as const,
};

export const publicationQueryOptions = (week: string) =>
  queryOptions({
    queryKey: publishingKeys.week(week),
    queryFn: ({ signal }) => api<Publication>(`/weeks/${encodeURIComponent(week)}/publication`, { signal }),
  });
