// Fill next week, Plan to meet and Reshuffle: the server plans and writes; the board then reloads.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GenerateBody, GenerateResult } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { planKeys } from './queries';

export function useGeneratePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: GenerateBody) => api<GenerateResult>('/plans/generate', { method: 'POST', body }),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: planKeys.boards() }),
        queryClient.invalidateQueries({ queryKey: planKeys.histories() }),
      ]);
    },
  });
}
