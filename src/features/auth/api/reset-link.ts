// Password reset: the key factory and the check of a reset link before a new password is asked for.
import { queryOptions } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const passwordResetKeys = {
  all: ['password-reset'] as const,
  check: (token: string) => [...passwordResetKeys.all, 'check', token] as const,
};

export const resetLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: passwordResetKeys.check(token),
    queryFn: ({ signal }) =>
      api<{ ok: true }>(`/auth/password-reset/check?token=${encodeURIComponent(token)}`, { signal }),
    retry: false,
    staleTime: Infinity,
  });
