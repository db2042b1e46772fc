// The next-day check-in on a week's connective-tissue work. Without signal it is kept on the phone and
// sent later (see the offline queue).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TissueCheckinBody, TissueCheckinRow } from '../../../../shared/schemas';
import { sendOrQueue } from '../../../lib/offline-queue';
import { currentAthleteId, myWeekKeys } from './queries';

export function useSaveCheckin() {
  const queryClient = useQueryClient();
  return useMutation({
    // Sent or kept by the offline queue: never held back while the browser says it is offline.
    networkMode: 'always',
    mutationFn: (body: TissueCheckinBody) =>
      sendOrQueue<TissueCheckinRow>({
        owner: currentAthleteId(queryClient) ?? 0,
        method: 'POST',
        path: '/tissue/checkins',
        body,
        label: `Check-in for ${body.week}`,
      }),
    onSuccess: (out) => (out.sent ? queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }) : undefined),
  });
}
