// Sign in, then refresh who-am-I.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: LoginBody) => api<{ ok: true }>('/auth/login', { method: 'POST', body }),
    onSuccess: async () => {
      queryClient.removeQueries();
      await queryClient.invalidateQueries({ queryKey: authKeys.all });
    },
  });
}
