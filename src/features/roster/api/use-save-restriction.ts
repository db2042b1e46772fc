// Add, change or remove one of an athlete's restrictions; the athlete and the roster list refetch.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Restriction, RestrictionBody, RestrictionPatchBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys } from '../../../lib/query-keys';

function useRefresh(athleteId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: athleteKeys.detail(athleteId) }),
      queryClient.invalidateQueries({ queryKey: athleteKeys.lists() }),
    ]);
}

export function useAddRestriction(athleteId: number) {
  const refresh = useRefresh(athleteId);
  return useMutation({
    mutationFn: (body: RestrictionBody) =>
      api<Restriction>(`/athletes/${athleteId}/restrictions`, { method: 'POST', body }),
    onSuccess: refresh,
  });
}

export function useUpdateRestriction(athleteId: number) {
  const refresh = useRefresh(athleteId);
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: RestrictionPatchBody }) =>
      api<Restriction>(`/athletes/${athleteId}/restrictions/${id}`, { method: 'PATCH', body }),
    onSuccess: refresh,
  });
}

export function useRemoveRestriction(athleteId: number) {
  const refresh = useRefresh(athleteId);
  return useMutation({
    mutationFn: (id: number) => api<void>(`/athletes/${athleteId}/restrictions/${id}`, { method: 'DELETE' }),
    onSuccess: refresh,
  });
}
