// The transaction helper: a deadlock victim is run again and succeeds, other errors are not retried,
// and the back-off stays small and spread out.
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { teams } from '../../server/db/schema';
import { inTransaction, lockRetryDelayMs } from '../../server/db/transaction';
import { useTestApp } from '../support/app';
import { createTeam } from '../support/factories';

const t = useTestApp();

/** Two bodies that lock two rows in opposite orders, meeting in the middle: InnoDB must pick a victim. */
async function crossedLocks(run: typeof inTransaction | 'plain') {
  const db = t.ctx.database.db;
  const a = (await createTeam(db)).teamId;
  const b = (await createTeam(db)).teamId;
  let arrived = 0;
  const meet = async () => {
    arrived++;
    for (let i = 0; i < 200 && arrived < 2; i++) await new Promise((r) => setTimeout(r, 5));
  };
  let runs = 0;
  const body = (first: number, second: number) => async (tx: Parameters<Parameters<typeof inTransaction>[1]>[0]) => {
    runs++;
    await tx
      .update(teams)
      .set({ name: sql`concat(${teams.name}, '')` })
      .where(eq(teams.id, first));
    await meet();
    await tx
      .update(teams)
      .set({ name: sql`concat(${teams.name}, '')` })
      .where(eq(teams.id, second));
    return 'done';
  };
  const go = (first: number, second: number) =>
    run === 'plain' ? db.transaction(body(first, second)) : run(db, body(first, second));
  const results = await Promise.allSettled([go(a, b), go(b, a)]);
  return { results, runs };
}

describe('inTransaction', () => {
  it('runs a deadlock victim again, so both writers succeed', async () => {
    const plain = await crossedLocks('plain');
    // Without the helper one of them fails with a deadlock: the situation is real.
    expect(plain.results.filter((r) => r.status === 'rejected')).toHaveLength(1);
    const retried = await crossedLocks(inTransaction);
    expect(retried.results.map((r) => r.status)).toEqual(['fulfilled', 'fulfilled']);
    expect(retried.runs).toBeGreaterThanOrEqual(3);
  });

  it('does not retry other errors', async () => {
    let runs = 0;
    await expect(
      inTransaction(t.ctx.database.db, async () => {
        runs++;
        throw new Error('not a lock conflict');
      }),
    ).rejects.toThrow('not a lock conflict');
    expect(runs).toBe(1);
  });

  it('waits a little, more each time, with jitter, never over 200 ms', () => {
    expect(lockRetryDelayMs(1, () => 0)).toBe(5);
    expect(lockRetryDelayMs(1, () => 1)).toBe(10);
    expect(lockRetryDelayMs(3, () => 0.5)).toBe(30);
    expect(lockRetryDelayMs(20, () => 1)).toBe(200);
  });
});
