// The one way to run a multi-row write: a transaction that is run again, after a short jittered pause,
// when InnoDB chose it as a deadlock victim or it waited too long for a lock. The body must have no
// effects outside the database (or only ones that are safe to repeat), since it may run more than once.
import type { Db, Tx } from './client';
import { isLockConflict } from './errors';

export interface TransactionOptions {
  isolationLevel?: 'read uncommitted' | 'read committed' | 'repeatable read' | 'serializable';
  /** Runs in all, the first included. */
  attempts?: number;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Back-off before run `attempt + 1`: about 10, 20, 40… ms with full jitter, so racers spread out. */
export function lockRetryDelayMs(attempt: number, random = Math.random): number {
  const ceiling = Math.min(10 * 2 ** (attempt - 1), 200);
  return Math.round(ceiling / 2 + random() * (ceiling / 2));
}

export async function inTransaction<T>(
  db: Db,
  body: (tx: Tx) => Promise<T>,
  opts: TransactionOptions = {},
): Promise<T> {
  const attempts = opts.attempts ?? 6;
  const config = opts.isolationLevel ? { isolationLevel: opts.isolationLevel } : undefined;
  for (let attempt = 1; ; attempt++) {
    try {
      return await db.transaction(body, config);
    } catch (err) {
      if (attempt >= attempts || !isLockConflict(err)) throw err;
      await sleep(lockRetryDelayMs(attempt));
    }
  }
}
