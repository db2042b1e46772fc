// Idempotency keys in MariaDB, so a repeated write is answered once whichever app instance it reaches.
// The (caller, key) primary key decides which copy of a request runs: its insert is the claim. Times are
// the database's clock, the one every instance shares.
import { and, eq, isNull, lt, sql } from 'drizzle-orm';
import type { Db } from './client';
import { isDuplicateKey } from './errors';
import { idempotencyKeys } from './schema';

/** How long an answer is kept: a phone that comes back after two days sends its queue with new keys anyway. */
export const IDEMPOTENCY_KEEP_HOURS = 48;
/** A claim nobody finished within this long was left by an instance that stopped: another copy may take it. */
const STALE_CLAIM_MS = 30_000;
/** How long a copy that arrives while the first is still running waits for its answer. */
const WAIT_FOR_FIRST_MS = 5_000;
const POLL_MS = 50;
/** Old keys are swept about once per this many claims. */
const SWEEP_EVERY = 100;

export interface KeyClaim {
  userId: number;
  idemKey: string;
  route: string;
  fingerprint: string;
}

export type ClaimOutcome =
  | { kind: 'claimed' }
  | { kind: 'answered'; status: number; response: string }
  | { kind: 'mismatch'; route: string }
  | { kind: 'in_progress' };

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const now = sql`UTC_TIMESTAMP(3)`;
let claims = 0;

function pk(userId: number, idemKey: string) {
  return and(eq(idempotencyKeys.userId, userId), eq(idempotencyKeys.idemKey, idemKey));
}

/**
 * Takes the key for this request, or tells what became of the first request that took it. A copy that
 * arrives while the first is running waits (polling) for its answer, up to a few seconds.
 */
export async function claimIdempotencyKey(db: Db, claim: KeyClaim): Promise<ClaimOutcome> {
  if (++claims % SWEEP_EVERY === 0) await sweepIdempotencyKeys(db);
  const deadline = Date.now() + WAIT_FOR_FIRST_MS;
  for (;;) {
    try {
      await db.insert(idempotencyKeys).values({ ...claim, claimedAt: now, createdAt: now });
      return { kind: 'claimed' };
    } catch (err) {
      if (!isDuplicateKey(err)) throw err;
    }
    const [row] = await db
      .select({
        route: idempotencyKeys.route,
        fingerprint: idempotencyKeys.fingerprint,
        status: idempotencyKeys.status,
        response: idempotencyKeys.response,
        claimedAt: idempotencyKeys.claimedAt,
        expired: sql<number>`${idempotencyKeys.createdAt} < ${now} - INTERVAL ${IDEMPOTENCY_KEEP_HOURS} HOUR`,
        stale: sql<number>`${idempotencyKeys.claimedAt} < ${now} - INTERVAL ${STALE_CLAIM_MS * 1000} MICROSECOND`,
      })
      .from(idempotencyKeys)
      .where(pk(claim.userId, claim.idemKey));
    if (!row) continue; // released or swept in between: try the insert again
    if (Number(row.expired)) {
      await db
        .delete(idempotencyKeys)
        .where(and(pk(claim.userId, claim.idemKey), eq(idempotencyKeys.fingerprint, row.fingerprint)));
      continue;
    }
    if (row.fingerprint !== claim.fingerprint) return { kind: 'mismatch', route: row.route };
    if (row.status !== null) return { kind: 'answered', status: row.status, response: row.response ?? 'null' };
    if (Number(row.stale)) {
      // Only one copy can move the claim time it read: that one runs the request again.
      const [moved] = await db
        .update(idempotencyKeys)
        .set({ claimedAt: now })
        .where(
          and(
            pk(claim.userId, claim.idemKey),
            isNull(idempotencyKeys.status),
            eq(idempotencyKeys.claimedAt, row.claimedAt),
          ),
        );
      if (moved.affectedRows === 1) return { kind: 'claimed' };
      continue;
    }
    if (Date.now() >= deadline) return { kind: 'in_progress' };
    await sleep(POLL_MS);
  }
}

/** Keeps the answer the claimed request gave, for every later copy. */
export async function completeIdempotencyKey(
  db: Db,
  userId: number,
  idemKey: string,
  answer: { status: number; response: string },
): Promise<void> {
  await db
    .update(idempotencyKeys)
    .set(answer)
    .where(and(pk(userId, idemKey), isNull(idempotencyKeys.status)));
}

/** Gives the key back (the request failed on our side and wrote nothing): a later copy runs it again. */
export async function releaseIdempotencyKey(db: Db, userId: number, idemKey: string): Promise<void> {
  await db.delete(idempotencyKeys).where(and(pk(userId, idemKey), isNull(idempotencyKeys.status)));
}

/** Drops keys older than the keeping time. */
export async function sweepIdempotencyKeys(db: Db): Promise<number> {
  const [res] = await db
    .delete(idempotencyKeys)
    .where(lt(idempotencyKeys.createdAt, sql`${now} - INTERVAL ${IDEMPOTENCY_KEEP_HOURS} HOUR`));
  return res.affectedRows;
}
