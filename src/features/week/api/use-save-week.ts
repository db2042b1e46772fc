// Save an athlete's week with the version it was read at; the answer (or, on 409, the current week) replaces the cache.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AthleteWeek, AthleteWeekBody } from '../../../../shared/schemas';
import { api, isApiError } from '../../../lib/api-client';
import { weekKeys } from './queries';

export function useSaveWeek(athleteId: number, week: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AthleteWeekBody) =>
      api<AthleteWeek>(`/athletes/${athleteId}/weeks/${encodeURIComponent(week)}`, { method: 'PUT', body }),
    onSuccess: (doc) => queryClient.setQueryData(weekKeys.week(athleteId, week), doc),
    onError: (err) => {
      if (isApiError(err, 409)) void queryClient.invalidateQueries({ queryKey: weekKeys.week(athleteId, week) });
    },
  });
}
