// Log what was done of one session (sets done, session done); the week page reads it back.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionLog, SessionLogBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { myWeekKeys } from './queries';

export function useLogSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ sessionId, body }: { sessionId: string; body: SessionLogBody }) =>
      api<SessionLog>(`/my-week/sessions/${encodeURIComponent(sessionId)}`, { method: 'PUT', body }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
  });
}
