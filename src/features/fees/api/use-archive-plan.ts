// Archive a plan (no longer offered) or bring it back; the plan lists and the athlete table, which
// shows each fee's plan, are refetched.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FeePlan } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { feeKeys } from './queries';

export function useArchivePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ plan, archived }: { plan: FeePlan; archived: boolean }) =>
      api<FeePlan>(`/fees/plans/${plan.id}/${archived ? 'archive' : 'restore'}`, {
        method: 'POST',
        body: { version: plan.version },
      }),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: feeKeys.plans() }),
        queryClient.invalidateQueries({ queryKey: feeKeys.athletes() }),
      ]),
  });
}
