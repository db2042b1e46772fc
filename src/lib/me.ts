// The signed-in user, read by the guards, the layout and every feature that words things by role or unit.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../../shared/schemas';
import { api } from './api-client';
import { authKeys } from './query-keys';

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
