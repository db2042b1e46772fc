// Sign out (this device, or every device of the account) and forget every cached answer of the previous user.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { SignOutEverywhereResponse } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

function useLeave() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return () => {
    queryClient.clear();
    navigate('/sign-in', { replace: true });
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
