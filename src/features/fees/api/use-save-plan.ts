// Add a fee plan or change one; every plan list is refetched.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FeePlan, FeePlanValues } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { feeKeys } from './queries';

export function useSavePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, version, values }: { id?: number; version?: number; values: FeePlanValues }) =>
      id === undefined
        ? api<FeePlan>('/fees/plans', { method: 'POST', body: values })
        : api<FeePlan>(`/fees/plans/${id}`, { method: 'PATCH', body: { ...values, version } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: feeKeys.plans() }),
  });
}
