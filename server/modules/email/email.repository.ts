// SQL for the e-mail settings a link in an e-mail can change.
import { eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { users } from '../../db/schema';

/** Turns the weekly plan e-mail on or off; the account's address, or null when there is no such account. */
export async function setWeeklyEmail(db: Queryable, userId: number, on: boolean): Promise<string | null> {
  await db.update(users).set({ weeklyEmail: on }).where(eq(users.id, userId));
  const [row] = await db.select({ email: users.email }).from(users).where(eq(users.id, userId)).limit(1);
  return row?.email ?? null;
}
