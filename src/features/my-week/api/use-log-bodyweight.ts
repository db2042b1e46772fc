// Write the day's bodyweight (a second reading on the same day replaces the first). Without signal it is
// kept on the phone and sent later (see the offline queue).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Bodyweight, LogBodyweightBody } from '../../../../shared/schemas';
import { sendOrQueue } from '../../../lib/offline-queue';
import { historyKeys } from '../../../lib/query-keys';
import { currentAthleteId, myWeekKeys } from './queries';

export function useLogBodyweight() {
  const queryClient = useQueryClient();
  return useMutation({
    // Sent or kept by the offline queue: never held back while the browser says it is offline.
    networkMode: 'always',
    mutationFn: ({ measuredOn, ...body }: LogBodyweightBody & { measuredOn: string }) =>
      sendOrQueue<Bodyweight>({
        owner: currentAthleteId(queryClient) ?? 0,
        method: 'PUT',
        path: `/bodyweights/${encodeURIComponent(measuredOn)}`,
        body,
        label: `Bodyweight ${String(body.weight)} ${body.unit} on ${measuredOn}`,
      }),
    onSuccess: async (out) => {
      if (!out.sent) return;
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
        queryClient.invalidateQueries({ queryKey: historyKeys.mine() }),
      ]);
    },
  });
}
