// SQL for accounts and sessions.
import { and, asc, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, memberships, teams, users } from '../../db/schema';

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

/** Everything a request needs to know about its caller, in one query. */
export async function findSessionUser(db: Queryable, userId: number, teamId: number) {
  const [row] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      unit: users.unit,
      passwordChangedAt: users.passwordChangedAt,
      role: memberships.role,
      teamId: teams.id,
      teamName: teams.name,
      athleteId: athletes.id,
    })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId)))
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .leftJoin(athletes, and(eq(athletes.userId, users.id), eq(athletes.teamId, teamId)))
    .where(eq(users.id, userId))
    .limit(1);
  return row ?? null;
}
