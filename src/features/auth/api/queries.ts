// Who is signed in and where: the key factory and query options for the session and the account's devices.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me, SessionList } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  sessions: () => [...authKeys.all, 'sessions'] as const,
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

/** The account's signed-in browsers and devices, most recently used first. */
export const sessionsQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.sessions(),
    queryFn: ({ signal }) => api<SessionList>('/auth/sessions', { signal }),
  });
