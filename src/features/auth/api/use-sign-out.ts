// Sign out (this device, or every device of the account) and forget every cached answer of the previous user.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { SignOutEverywhereResponse } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

function useLeave() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  // Leave first, then forget: cleared while the signed-in page is still mounted, its queries would
  // ask the server again (and be refused) before the page goes.
  return async () => {
    await navigate('/sign-in', { replace: true });
    queryClient.clear();
  };
}

export function useSignOut() {
  const leave = useLeave();
  return useMutation({
    mutationFn: () => api<{ ok: true }>('/auth/logout', { method: 'POST' }),
    onSettled: leave,
  });
}

export function useSignOutEverywhere() {
  const leave = useLeave();
  return useMutation({
    mutationFn: () => api<SignOutEverywhereResponse>('/auth/logout-everywhere', { method: 'POST' }),
    onSuccess: leave,
  });
}
