// Sending a message: the thread and the thread lists refresh.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Message, SendMessageInput } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { messageKeys } from './queries';

export function useSendMessage(athleteId: number, week: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SendMessageInput) =>
      api<Message>(`/messages/threads/${athleteId}/${week}`, { method: 'POST', body }),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: messageKeys.thread(athleteId, week) }),
        queryClient.invalidateQueries({ queryKey: messageKeys.lists() }),
      ]);
    },
  });
}

/** Marks a thread read by the caller. */
export function useMarkThreadRead(athleteId: number, week: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<{ unread: number }>(`/messages/threads/${athleteId}/${week}/read`, { method: 'PUT' }),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: messageKeys.thread(athleteId, week) }),
        queryClient.invalidateQueries({ queryKey: messageKeys.lists() }),
      ]);
    },
  });
}
