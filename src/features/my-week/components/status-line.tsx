// The one-line answer after a session write (saved, kept without signal, or why not), read out when it changes.

/** What the athlete is told when a write is kept on the phone for later. */
export const KEPT_WITHOUT_SIGNAL =
  'No signal: kept on this phone and sent when you are back online (see Waiting to send).';

export function StatusLine({ message }: { message: string | null }) {
  return message ? (
    <p role="status" className="text-sm font-semibold text-ink-800">
      {message}
    </p>
  ) : null;
}
