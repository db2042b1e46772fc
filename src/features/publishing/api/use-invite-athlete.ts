// Invites an athlete on the roster who has no account yet: the new account takes over the roster entry.
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function useInviteAthlete() {
  return useMutation({
    mutationFn: (vars: { athleteId: number; email: string }) =>
      api<{ id: number; email: string }>('/invitations', {
        method: 'POST',
        body: { email: vars.email, role: 'athlete', athleteId: vars.athleteId },
      }),
  });
}
