// End a running fee now: the athlete's own, or (for the head coach) any athlete's in the team.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AthleteFee } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { feeKeys } from './queries';

export function useCancelFee() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (athleteId?: number) =>
      api<AthleteFee>(athleteId === undefined ? '/my-fee/cancel' : `/fees/athletes/${athleteId}/cancel`, {
        method: 'POST',
      }),
    onSuccess: (fee, athleteId) => {
      if (athleteId === undefined) queryClient.setQueryData(feeKeys.mine(), fee);
    },
    onSettled: (_fee, _err, athleteId) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: athleteId === undefined ? feeKeys.mine() : feeKeys.athletes() }),
        // Subscriber counts on the plans change too.
        queryClient.invalidateQueries({ queryKey: feeKeys.plans() }),
      ]),
  });
}
