// Write the day's bodyweight (a second reading on the same day replaces the first).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Bodyweight, LogBodyweightBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { historyKeys } from '../../history/api/queries';
import { myWeekKeys } from './queries';

export function useLogBodyweight() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ measuredOn, ...body }: LogBodyweightBody & { measuredOn: string }) =>
      api<Bodyweight>(`/bodyweights/${encodeURIComponent(measuredOn)}`, { method: 'PUT', body }),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
        queryClient.invalidateQueries({ queryKey: historyKeys.mine() }),
      ]);
    },
  });
}
