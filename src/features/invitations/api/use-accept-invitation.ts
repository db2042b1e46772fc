// Accept an invitation: the server signs the invitee in, so everything cached before is dropped.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptExistingAccountBody, AcceptNewAccountBody, Role } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptNewAccountBody | AcceptExistingAccountBody) =>
      api<{ ok: true; role: Role }>('/invitation-links/accept', { method: 'POST', body }),
    onSuccess: async () => {
      queryClient.removeQueries();
      await queryClient.invalidateQueries({ queryKey: authKeys.all });
    },
  });
}
