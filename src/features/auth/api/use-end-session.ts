// Sign out one other device from the list of signed-in devices.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export function useEndSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<{ ok: true }>(`/auth/sessions/${id}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: authKeys.sessions() }),
  });
}
