// Log what was done of one session (sets done, back-off sets ticked, session done); the week page reads it
// back. Without signal it is kept on the phone and sent later (see the offline queue).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionLog, SessionLogBody } from '../../../../shared/schemas';
import { sendOrQueue } from '../../../lib/offline-queue';
import { currentAthleteId, myWeekKeys, type MyWeekAnswer } from './queries';

export function useLogSession() {
  const queryClient = useQueryClient();
  return useMutation({
    // Sent or kept by the offline queue: never held back while the browser says it is offline.
    networkMode: 'always',
    mutationFn: ({ sessionId, body, label }: { sessionId: string; body: SessionLogBody; label: string }) =>
      sendOrQueue<SessionLog>({
        owner: currentAthleteId(queryClient) ?? 0,
        method: 'PUT',
        path: `/my-week/sessions/${encodeURIComponent(sessionId)}`,
        body,
        label,
      }),
    onSuccess: async (out, { body }) => {
      if (!out.sent) return;
      // The new version at once, so the next tick made before the page is read again is not stale.
      const log = out.answer;
      queryClient.setQueriesData<MyWeekAnswer>({ queryKey: myWeekKeys.weeks() }, (week) =>
        week && week.week === body.week
          ? { ...week, sessions: week.sessions.map((s) => (s.id === log.sessionId ? { ...s, log } : s)) }
          : week,
      );
      await queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() });
    },
    // A conflict carries the stored log: the page is read again to show it.
    onError: () => queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
  });
}
