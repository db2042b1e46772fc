// The signed-in account's devices; the session itself (useMe) and the key factory live in src/lib.
import { queryOptions } from '@tanstack/react-query';
import type { SessionList } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

/** The account's signed-in browsers and devices, most recently used first. */
export const sessionsQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.sessions(),
    queryFn: ({ signal }) => api<SessionList>('/auth/sessions', { signal }),
  });
