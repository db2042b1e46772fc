// SQL for sign-in counters: one row per hashed key, counted atomically so every instance adds up.
import { and, gt, inArray, lt, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { signInLimits } from '../../db/schema';

/** The latest hold among these keys that has not passed yet, or null. */
export async function latestHold(db: Queryable, keyHashes: string[], now: Date): Promise<Date | null> {
  const rows = await db
    .select({ until: signInLimits.blockedUntil })
    .from(signInLimits)
    .where(and(inArray(signInLimits.keyHash, keyHashes), gt(signInLimits.blockedUntil, now)));
  const times = rows.flatMap((r) => (r.until ? [r.until.getTime()] : []));
  return times.length ? new Date(Math.max(...times)) : null;
}

/** Counts one failure (starting again after a quiet window) and returns the count. */
export async function countFailure(db: Queryable, keyHash: string, now: Date, windowStart: Date): Promise<number> {
  // The count is assigned before last_failure_at, so it still compares against the previous failure.
  await db.execute(sql`
    insert into ${signInLimits} (key_hash, failures, last_failure_at) values (${keyHash}, 1, ${now})
    on duplicate key update
      failures = if(last_failure_at < ${windowStart}, 1, failures + 1),
      last_failure_at = ${now}`);
  const [row] = await db
    .select({ failures: signInLimits.failures })
    .from(signInLimits)
    .where(sql`${signInLimits.keyHash} = ${keyHash}`);
  return row?.failures ?? 1;
}

export async function holdUntil(db: Queryable, keyHash: string, until: Date) {
  await db
    .update(signInLimits)
    .set({ blockedUntil: until })
    .where(sql`${signInLimits.keyHash} = ${keyHash}`);
}

export async function clearKey(db: Queryable, keyHash: string) {
  await db.delete(signInLimits).where(sql`${signInLimits.keyHash} = ${keyHash}`);
}

export async function deleteQuietSince(db: Queryable, before: Date) {
  await db.delete(signInLimits).where(lt(signInLimits.lastFailureAt, before));
}
