// The line over My week when the week on screen is the copy kept on the phone: no signal, or no answer
// from Rackturn, and when that copy was last read from the server.
import { useOnline } from '../../../lib/use-online';

const timeFmt = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  hour: '2-digit',
  minute: '2-digit',
});

export function OfflineLine({ receivedAt, fromCache }: { receivedAt: string | null; fromCache: boolean }) {
  const online = useOnline();
  if (online && !fromCache) return null;
  const when = receivedAt ? timeFmt.format(new Date(receivedAt)) : 'unknown';
  return (
    <p
      role="status"
      className="rounded-md border border-ink-300 bg-chalk-200 px-3 py-2 font-semibold text-ink-900"
      data-testid="offline-line"
    >
      {online ? 'Rackturn cannot be reached' : 'Offline'} — last updated {when}
    </p>
  );
}
