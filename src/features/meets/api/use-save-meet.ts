// Add, change or delete a meet. Athletes' pages list their meets, so those refetch too.
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { Meet, MeetBody, MeetPatchBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys } from '../../../lib/query-keys';
import { meetKeys } from './queries';

async function refresh(queryClient: QueryClient, meet: Meet | null) {
  if (meet) queryClient.setQueryData(meetKeys.detail(meet.id), meet);
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: meetKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: athleteKeys.all }),
  ]);
}

export function useCreateMeet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MeetBody) => api<Meet>('/meets', { method: 'POST', body }),
    onSuccess: (m) => refresh(queryClient, m),
  });
}

export function useUpdateMeet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: MeetPatchBody }) =>
      api<Meet>(`/meets/${id}`, { method: 'PATCH', body }),
    onSuccess: (m) => refresh(queryClient, m),
  });
}

export function useDeleteMeet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<void>(`/meets/${id}`, { method: 'DELETE' }),
    onSuccess: (_r, id) => {
      queryClient.removeQueries({ queryKey: meetKeys.detail(id) });
      return refresh(queryClient, null);
    },
  });
}
