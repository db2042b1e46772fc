// Meet-day writes besides marks: the weigh-in, the usual jumps, taking back a mark, saving results.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { JumpsBody, MeetDay, WeighInBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys } from '../../../lib/query-keys';
import { meetKeys } from './queries';

function useSetDay(meetId: number) {
  const queryClient = useQueryClient();
  return (day: MeetDay) => queryClient.setQueryData(meetKeys.day(meetId), day);
}

export function useWeighIn(meetId: number) {
  const setDay = useSetDay(meetId);
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, body }: { entryId: number; body: WeighInBody }) =>
      api<MeetDay>(`/meets/${meetId}/day/entries/${entryId}/weigh-in`, { method: 'PUT', body }),
    onSuccess: (day) => {
      setDay(day);
      // The class may have changed: the Meets page shows it too.
      return queryClient.invalidateQueries({ queryKey: meetKeys.detail(meetId), exact: true });
    },
  });
}

export function useSaveJumps(meetId: number) {
  const setDay = useSetDay(meetId);
  return useMutation({
    mutationFn: ({ entryId, body }: { entryId: number; body: JumpsBody }) =>
      api<MeetDay>(`/meets/${meetId}/day/entries/${entryId}/jumps`, { method: 'PUT', body }),
    onSuccess: setDay,
  });
}

export function useUndoMark(meetId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, version }: { id: number; version: number }) =>
      api<void>(`/meets/${meetId}/day/marks/${id}?version=${version}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: meetKeys.day(meetId) }),
  });
}

export function useSaveResults(meetId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<{ saved: number; meet: MeetDay }>(`/meets/${meetId}/day/results`, { method: 'POST' }),
    onSuccess: async (out) => {
      queryClient.setQueryData(meetKeys.day(meetId), out.meet);
      // New top sets: every athlete's history and the meets' current maxes change.
      await queryClient.invalidateQueries({ queryKey: meetKeys.all });
      await queryClient.invalidateQueries({ queryKey: athleteKeys.all });
    },
  });
}
