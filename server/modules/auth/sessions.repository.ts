// SQL for session rows: start, find with everything a request needs about its caller, touch, end.
import { and, desc, eq, gt, lte } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, memberships, sessions, teams, users } from '../../db/schema';
import type { Role } from '../../../shared/schemas';

export async function insertSession(
  db: Queryable,
  values: {
    idHash: string;
    userId: number;
    teamId: number;
    role: Role;
    userAgent: string | null;
    now: Date;
    expiresAt: Date;
  },
): Promise<number> {
  const [row] = await db
    .insert(sessions)
    .values({
      idHash: values.idHash,
      userId: values.userId,
      teamId: values.teamId,
      role: values.role,
      userAgent: values.userAgent,
      createdAt: values.now,
      lastSeenAt: values.now,
      expiresAt: values.expiresAt,
    })
    .$returningId();
  return row!.id;
}

/**
 * The session with its account, team and the membership's current role (null when the membership is
 * gone), in one query.
 */
export async function findSessionByHash(db: Queryable, idHash: string) {
  const [row] = await db
    .select({
      id: sessions.id,
      userId: sessions.userId,
      teamId: sessions.teamId,
      role: sessions.role,
      createdAt: sessions.createdAt,
      lastSeenAt: sessions.lastSeenAt,
      expiresAt: sessions.expiresAt,
      memberRole: memberships.role,
      email: users.email,
      name: users.name,
      unit: users.unit,
      passwordChangedAt: users.passwordChangedAt,
      teamName: teams.name,
      athleteId: athletes.id,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .innerJoin(teams, eq(teams.id, sessions.teamId))
    .leftJoin(memberships, and(eq(memberships.userId, sessions.userId), eq(memberships.teamId, sessions.teamId)))
    .leftJoin(athletes, and(eq(athletes.userId, sessions.userId), eq(athletes.teamId, sessions.teamId)))
    .where(eq(sessions.idHash, idHash))
    .limit(1);
  return row ?? null;
}

export async function touchSession(db: Queryable, id: number, lastSeenAt: Date, expiresAt: Date) {
  await db.update(sessions).set({ lastSeenAt, expiresAt }).where(eq(sessions.id, id));
}

export async function deleteSessionByHash(db: Queryable, idHash: string) {
  await db.delete(sessions).where(eq(sessions.idHash, idHash));
}

export async function deleteSessionById(db: Queryable, id: number) {
  await db.delete(sessions).where(eq(sessions.id, id));
}

/** One of the user's own sessions; false when there is no such session of theirs. */
export async function deleteOwnSession(db: Queryable, userId: number, id: number): Promise<boolean> {
  const [res] = await db.delete(sessions).where(and(eq(sessions.id, id), eq(sessions.userId, userId)));
  return res.affectedRows > 0;
}

/** Every session of the user, or only those in one team; returns how many ended. */
export async function deleteUserSessions(db: Queryable, userId: number, teamId?: number): Promise<number> {
  const [res] = await db
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), teamId === undefined ? undefined : eq(sessions.teamId, teamId)));
  return res.affectedRows;
}

export async function deleteExpiredSessions(db: Queryable, userId: number, now: Date) {
  await db.delete(sessions).where(and(eq(sessions.userId, userId), lte(sessions.expiresAt, now)));
}

export async function listUserSessions(db: Queryable, userId: number, now: Date) {
  return db
    .select({
      id: sessions.id,
      userAgent: sessions.userAgent,
      createdAt: sessions.createdAt,
      lastSeenAt: sessions.lastSeenAt,
    })
    .from(sessions)
    .where(and(eq(sessions.userId, userId), gt(sessions.expiresAt, now)))
    .orderBy(desc(sessions.lastSeenAt), desc(sessions.id));
}
