// Log a top set; the week page and the history both change. Without signal it is kept on the phone and
// sent later (see the offline queue).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LogTopSetBody, LoggedTopSet } from '../../../../shared/schemas';
import { sendOrQueue } from '../../../lib/offline-queue';
import { historyKeys } from '../../../lib/query-keys';
import { currentAthleteId, myWeekKeys } from './queries';

export function useLogTopSet() {
  const queryClient = useQueryClient();
  return useMutation({
    // Sent or kept by the offline queue: never held back while the browser says it is offline.
    networkMode: 'always',
    mutationFn: ({ label, ...body }: LogTopSetBody & { label: string }) =>
      sendOrQueue<LoggedTopSet>({
        owner: currentAthleteId(queryClient) ?? 0,
        method: 'POST',
        path: '/top-sets',
        body,
        label,
      }),
    onSuccess: async (out) => {
      if (!out.sent) return;
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
        queryClient.invalidateQueries({ queryKey: historyKeys.all }),
      ]);
    },
  });
}
