// Ask for a reset link; the answer is the same whether or not the address has an account.
import { useMutation } from '@tanstack/react-query';
import type { ForgotPasswordBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export function useRequestReset() {
  return useMutation({
    mutationFn: (body: ForgotPasswordBody) =>
      api<{ ok: true; message: string }>('/auth/password-reset', { method: 'POST', body }),
  });
}
