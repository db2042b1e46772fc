// What this phone logged without signal: each write waiting to be sent, sent once the browser is online
// again (and whenever My week opens online); one the server refused shows why, until it is discarded.
import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { discardQueued, flushQueue, useQueuedWrites } from '../../../lib/offline-queue';
import { useOnline } from '../../../lib/use-online';
import { historyKeys } from '../../../lib/query-keys';
import { myWeekKeys } from '../api/queries';

const RETRY_MS = 20_000;

export function WaitingToSend({ athleteId }: { athleteId: number }) {
  const writes = useQueuedWrites(athleteId);
  const online = useOnline();
  const queryClient = useQueryClient();
  const waiting = writes.filter((w) => w.state === 'waiting').length;

  // Sent when the browser comes online or something new waits, and tried again every so often while the
  // server cannot take it (no answer, or an error on its side).
  useEffect(() => {
    if (!online || waiting === 0) return;
    const send = () =>
      void flushQueue(athleteId).then(
        async (sent) => {
          if (sent === 0) return;
          await Promise.all([
            queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
            queryClient.invalidateQueries({ queryKey: historyKeys.all }),
          ]);
        },
        () => undefined,
      );
    send();
    const timer = setInterval(send, RETRY_MS);
    return () => clearInterval(timer);
  }, [online, waiting, athleteId, queryClient]);

  if (writes.length === 0) return null;
  return (
    <section aria-labelledby="waiting-to-send" className="rounded-md border border-ink-300 bg-chalk-50 p-3">
      <h2 id="waiting-to-send" className="text-lg font-bold text-ink-900">
        Waiting to send
      </h2>
      <p className="text-sm text-ink-700">
        {online ? 'Sending now.' : 'Kept on this phone; sent by itself once you are back online.'}
      </p>
      <ul className="mt-2 flex flex-col gap-2">
        {writes.map((w) => (
          <li key={w.id} className="flex flex-col gap-1 border-t border-ink-200 pt-2">
            <span className="font-semibold text-ink-900">{w.label}</span>
            {w.state === 'refused' ? (
              <>
                <span className="text-breach-700">Not saved: {w.error}</span>
                <span className="text-sm text-ink-700">Log it again with the right values, then discard this one.</span>
                <Button variant="secondary" className="self-start" onClick={() => void discardQueued(w.id)}>
                  Discard
                </Button>
              </>
            ) : (
              <span className="text-ink-700">
                Waiting to send · logged {new Date(w.queuedAt).toLocaleString('en-GB')}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
