// Who is signed in: the key factory and query options for the session.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => api<Me>('/auth/me', { signal }),
    staleTime: 5 * 60_000,
    retry: false,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
