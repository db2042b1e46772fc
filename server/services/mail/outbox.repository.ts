// SQL for the outbox: queue a message inside the caller's transaction, claim due rows so that two app
// instances never send the same one, and record each send's outcome.
import { and, asc, eq, inArray, isNull, lte, sql } from 'drizzle-orm';
import type { Db, Queryable } from '../../db/client';
import { outbox } from '../../db/schema';
import { isDuplicateKey } from '../../db/errors';
import { inTransaction } from '../../db/transaction';
import { SECRET_KINDS, type MailKind, type OutgoingMail } from './outbox';

export type OutboxRow = typeof outbox.$inferSelect;

/** Queues a message; false when a message with that dedupe key already exists. */
export async function queueMail(db: Queryable, mail: OutgoingMail, now = new Date()): Promise<boolean> {
  try {
    await db.insert(outbox).values({
      kind: mail.kind,
      dedupeKey: mail.dedupeKey.slice(0, 191),
      teamId: mail.teamId ?? null,
      toEmail: mail.to,
      subject: mail.subject.slice(0, 200),
      textBody: mail.text,
      htmlBody: mail.html,
      headers: mail.headers ?? null,
      nextAttemptAt: now,
    });
    return true;
  } catch (err) {
    // The clash rolls back only this statement: the caller's transaction goes on.
    if (isDuplicateKey(err)) return false;
    throw err;
  }
}

/**
 * Claims up to `limit` due messages: locks them (skipping rows another instance holds), pushes their
 * next attempt `leaseMs` ahead so nobody else picks them while this instance sends, and returns them.
 * If this instance dies mid-send the lease runs out and another one retries.
 */
export async function claimDue(db: Db, limit: number, leaseMs: number, now = new Date()): Promise<OutboxRow[]> {
  // Read committed takes no gap locks, so claimers racing on the due index rarely collide; when they
  // still deadlock, the loser simply claims again.
  return inTransaction(
    db,
    async (tx) => {
      const rows = await tx
        .select()
        .from(outbox)
        .where(and(isNull(outbox.sentAt), lte(outbox.nextAttemptAt, now)))
        .orderBy(asc(outbox.nextAttemptAt), asc(outbox.id))
        .limit(limit)
        .for('update', { skipLocked: true });
      if (rows.length === 0) return [];
      await tx
        .update(outbox)
        .set({ nextAttemptAt: new Date(now.getTime() + leaseMs) })
        .where(
          inArray(
            outbox.id,
            rows.map((r) => r.id),
          ),
        );
      return rows;
    },
    { isolationLevel: 'read committed' },
  );
}

export async function markSent(db: Db, row: Pick<OutboxRow, 'id' | 'kind'>, now = new Date()): Promise<void> {
  const secret = SECRET_KINDS.has(row.kind as MailKind);
  await db
    .update(outbox)
    .set({
      sentAt: now,
      attempts: sql`${outbox.attempts} + 1`,
      lastError: null,
      ...(secret ? { textBody: '', htmlBody: '' } : {}),
    })
    .where(eq(outbox.id, row.id));
}

export async function markFailed(db: Db, id: number, error: string, retryAt: Date): Promise<void> {
  await db
    .update(outbox)
    .set({ attempts: sql`${outbox.attempts} + 1`, lastError: error.slice(0, 500), nextAttemptAt: retryAt })
    .where(eq(outbox.id, id));
}
