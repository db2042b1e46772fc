// The next-day check-in on a week's connective-tissue work.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TissueCheckinBody, TissueCheckinRow } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { myWeekKeys } from './queries';

export function useSaveCheckin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TissueCheckinBody) => api<TissueCheckinRow>('/tissue/checkins', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
  });
}
