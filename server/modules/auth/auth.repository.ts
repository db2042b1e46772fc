// SQL for accounts and the team an account signs in to.
import { asc, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { memberships, users } from '../../db/schema';

export async function findUserByEmail(db: Queryable, email: string) {
  const [row] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return row ?? null;
}

/** The team a user signs in to: their oldest membership. */
export async function findDefaultMembership(db: Queryable, userId: number) {
  const [row] = await db
    .select({ teamId: memberships.teamId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt), asc(memberships.id))
    .limit(1);
  return row ?? null;
}
