// What goes into the outbox: the kinds of mail, a queued message, which kinds hold a secret link, and the
// back-off between attempts. Its SQL is in outbox.repository.ts.

export type MailKind =
  'invitation' | 'password_reset' | 'password_changed' | 'weekly_plan' | 'fee_receipt' | 'notice_digest';

/** Kinds whose body holds a single-use sign-in link: the body is cleared once delivered. */
export const SECRET_KINDS: ReadonlySet<MailKind> = new Set(['invitation', 'password_reset']);

export interface OutgoingMail {
  kind: MailKind;
  /** One message per key, ever: queueing the same key again is a no-op. */
  dedupeKey: string;
  teamId?: number | null;
  to: string;
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
}

/** Delay before the next try after `failures` failed attempts: base, 2×base, 4×base … capped at max. */
export function retryDelayMs(failures: number, baseMs: number, maxMs: number): number {
  const exp = Math.min(Math.max(failures - 1, 0), 30);
  return Math.min(maxMs, baseMs * 2 ** exp);
}
