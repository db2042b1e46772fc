// Set the new password with the link's token; the server signs the account in afresh.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ResetPasswordBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';
import { passwordResetKeys } from './reset-link';

export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ResetPasswordBody) =>
      api<{ ok: true; signedIn: boolean }>('/auth/password-reset/complete', { method: 'POST', body }),
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: passwordResetKeys.all });
      queryClient.removeQueries({ queryKey: authKeys.all });
      await queryClient.invalidateQueries({ queryKey: authKeys.all });
    },
  });
}
