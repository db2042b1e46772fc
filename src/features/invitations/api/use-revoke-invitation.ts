// Withdraw an invitation; a roster entry it named can be invited again.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Invitation } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { invitationKeys } from './queries';

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<Invitation>(`/invitations/${id}/revoke`, { method: 'POST' }),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: invitationKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: invitationKeys.linkable() }),
      ]),
  });
}
