// Invite someone by e-mail; the list and the linkable roster entries change.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateInvitationInput, Invitation } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { invitationKeys } from './queries';

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationInput) => api<Invitation>('/invitations', { method: 'POST', body }),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: invitationKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: invitationKeys.linkable() }),
      ]),
  });
}
