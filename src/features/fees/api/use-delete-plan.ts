// Delete a plan nobody has used; the plan lists are refetched either way (a refusal means it changed).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FeePlan } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { feeKeys } from './queries';

export function useDeletePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (plan: FeePlan) => api<void>(`/fees/plans/${plan.id}?version=${plan.version}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: feeKeys.plans() }),
  });
}
