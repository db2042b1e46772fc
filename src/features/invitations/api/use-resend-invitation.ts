// Send an invitation again with a fresh link (the old link stops working).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Invitation } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { invitationKeys } from './queries';

export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<Invitation>(`/invitations/${id}/resend`, { method: 'POST' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationKeys.lists() }),
  });
}
