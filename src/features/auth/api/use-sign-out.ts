// Sign out (this device, or every device of the account) and forget every cached answer of the previous user.
import { useEffect } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { SignOutEverywhereResponse } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { clearOfflineCache } from '../../../lib/offline-cache';

function useLeave() {
  const navigate = useNavigate();
  // The sign-in page forgets every cached answer once it is on screen (useForgetPreviousUser): cleared
  // here, while the signed-in page is still mounted, its queries would ask the server again and be refused.
  return () => navigate('/sign-in', { replace: true });
}

/** Called by the sign-in page when it mounts: nothing the previous user read stays in a cache. */
export function useForgetPreviousUser() {
  const queryClient = useQueryClient();
  useEffect(() => {
    void queryClient.cancelQueries();
    queryClient.clear();
    // And the service worker's copy of their week, kept for reading it offline.
    void clearOfflineCache();
  }, [queryClient]);
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
