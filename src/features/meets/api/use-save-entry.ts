// Enter an athlete in a meet, change an entry (class, division, attempts), or withdraw them.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeetEntry, MeetEntryBody, MeetEntryPatchBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys } from '../../../lib/query-keys';
import { meetKeys } from './queries';

function useRefresh(meetId: number) {
  const queryClient = useQueryClient();
  return (athleteId: number) =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: meetKeys.detail(meetId) }),
      queryClient.invalidateQueries({ queryKey: meetKeys.lists() }),
      queryClient.invalidateQueries({ queryKey: athleteKeys.detail(athleteId) }),
      queryClient.invalidateQueries({ queryKey: athleteKeys.lists() }),
    ]);
}

export function useAddEntry(meetId: number) {
  const refresh = useRefresh(meetId);
  return useMutation({
    mutationFn: (body: MeetEntryBody) => api<MeetEntry>(`/meets/${meetId}/entries`, { method: 'POST', body }),
    onSuccess: (e) => refresh(e.athlete.id),
  });
}

export function useUpdateEntry(meetId: number) {
  const refresh = useRefresh(meetId);
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: MeetEntryPatchBody }) =>
      api<MeetEntry>(`/meets/${meetId}/entries/${id}`, { method: 'PATCH', body }),
    onSuccess: (e) => refresh(e.athlete.id),
  });
}

export function useRemoveEntry(meetId: number) {
  const refresh = useRefresh(meetId);
  return useMutation({
    mutationFn: ({ id }: { id: number; athleteId: number }) =>
      api<void>(`/meets/${meetId}/entries/${id}`, { method: 'DELETE' }),
    onSuccess: (_r, { athleteId }) => refresh(athleteId),
  });
}
