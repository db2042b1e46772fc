// SQL for invitations: the team's list, token look-ups, and the rows an acceptance creates.
import type { Sex } from '../../../shared/calc';
import { and, asc, desc, eq, gt, isNotNull, isNull, lte, notExists, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/mysql-core';
import type { Queryable } from '../../db/client';
import { athletes, invitations, memberships, teamRules, teams, users } from '../../db/schema';
import type { InvitationStatus, ListInvitationsParams } from '../../../shared/schemas';

const inviter = alias(users, 'inviter');

const columns = {
  id: invitations.id,
  teamId: invitations.teamId,
  email: invitations.email,
  role: invitations.role,
  athleteId: invitations.athleteId,
  athleteName: athletes.name,
  tokenHash: invitations.tokenHash,
  expiresAt: invitations.expiresAt,
  acceptedAt: invitations.acceptedAt,
  revokedAt: invitations.revokedAt,
  createdAt: invitations.createdAt,
  invitedByName: inviter.name,
};

export type InvitationRow = {
  id: number;
  teamId: number;
  email: string;
  role: 'head_coach' | 'coach' | 'athlete';
  athleteId: number | null;
  athleteName: string | null;
  tokenHash: string;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
  createdAt: Date;
  invitedByName: string | null;
};

/** Neither accepted nor revoked. */
const open = () => and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt));

function statusFilter(status: InvitationStatus | 'open' | 'all', now: Date): SQL | undefined {
  switch (status) {
    case 'all':
      return undefined;
    case 'open':
      return open();
    case 'pending':
      return and(open(), gt(invitations.expiresAt, now));
    case 'expired':
      return and(open(), lte(invitations.expiresAt, now));
    case 'accepted':
      return isNotNull(invitations.acceptedAt);
    case 'revoked':
      return and(isNull(invitations.acceptedAt), isNotNull(invitations.revokedAt));
  }
}

function baseSelect(db: Queryable) {
  return db
    .select(columns)
    .from(invitations)
    .leftJoin(athletes, and(eq(athletes.id, invitations.athleteId), eq(athletes.teamId, invitations.teamId)))
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy));
}

const SORT_COLUMNS = { createdAt: invitations.createdAt, email: invitations.email, expiresAt: invitations.expiresAt };

export async function listInvitations(
  db: Queryable,
  teamId: number,
  q: ListInvitationsParams,
  now = new Date(),
): Promise<{ items: InvitationRow[]; total: number }> {
  const where = and(
    eq(invitations.teamId, teamId),
    statusFilter(q.status, now),
    q.role ? eq(invitations.role, q.role) : undefined,
  );
  const desc_ = q.sort.startsWith('-');
  const col = SORT_COLUMNS[q.sort.replace('-', '') as keyof typeof SORT_COLUMNS];
  const [items, [count]] = await Promise.all([
    baseSelect(db)
      .where(where)
      .orderBy(desc_ ? desc(col) : asc(col), desc(invitations.id))
      .limit(q.limit)
      .offset(q.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(invitations)
      .where(where),
  ]);
  return { items, total: Number(count?.n ?? 0) };
}

export async function findInvitation(db: Queryable, teamId: number, id: number): Promise<InvitationRow | null> {
  const [row] = await baseSelect(db)
    .where(and(eq(invitations.teamId, teamId), eq(invitations.id, id)))
    .limit(1);
  return row ?? null;
}

/** The invitation behind a link, with the team's name; locked for the transaction when `lock` is set. */
export async function findByTokenHash(db: Queryable, tokenHash: string, lock = false) {
  const query = db
    .select({ ...columns, teamName: teams.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .leftJoin(athletes, and(eq(athletes.id, invitations.athleteId), eq(athletes.teamId, invitations.teamId)))
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  const [row] = lock ? await query.for('update') : await query;
  return row ?? null;
}

/** An invitation for this address that can still be accepted. */
export async function findPendingForEmail(db: Queryable, teamId: number, email: string, now = new Date()) {
  const [row] = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), eq(invitations.email, email), open(), gt(invitations.expiresAt, now)))
    .limit(1);
  return row ?? null;
}

/** Expired, never-used invitations for this address are closed when a fresh one is sent. */
export async function revokeExpiredForEmail(db: Queryable, teamId: number, email: string, now = new Date()) {
  await db
    .update(invitations)
    .set({ revokedAt: now })
    .where(and(eq(invitations.teamId, teamId), eq(invitations.email, email), open(), lte(invitations.expiresAt, now)));
}

export async function isMemberByEmail(db: Queryable, teamId: number, email: string): Promise<boolean> {
  const [row] = await db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, teamId), eq(users.email, email)))
    .limit(1);
  return Boolean(row);
}

/** Roster entries of the team without an account and not named by an invitation that is still pending. */
export async function listLinkableAthletes(db: Queryable, teamId: number, now = new Date()) {
  return db
    .select({ id: athletes.id, name: athletes.name })
    .from(athletes)
    .where(
      and(
        eq(athletes.teamId, teamId),
        isNull(athletes.userId),
        isNull(athletes.archivedAt),
        notExists(
          db
            .select({ one: sql`1` })
            .from(invitations)
            .where(and(eq(invitations.athleteId, athletes.id), open(), gt(invitations.expiresAt, now))),
        ),
      ),
    )
    .orderBy(asc(athletes.name));
}

export async function findTeamAthleteForLink(db: Queryable, teamId: number, athleteId: number) {
  const [row] = await db
    .select({ id: athletes.id, name: athletes.name, userId: athletes.userId, archivedAt: athletes.archivedAt })
    .from(athletes)
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return row ?? null;
}

export async function athleteHasPendingInvitation(db: Queryable, athleteId: number, now = new Date()) {
  const [row] = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(and(eq(invitations.athleteId, athleteId), open(), gt(invitations.expiresAt, now)))
    .limit(1);
  return Boolean(row);
}

/** A roster entry for an invited athlete who is not on the roster yet, with the gym's equipment. */
export async function insertRosterEntry(db: Queryable, teamId: number, name: string, sex: Sex) {
  const [rules] = await db
    .select({ equipment: teamRules.equipment })
    .from(teamRules)
    .where(eq(teamRules.teamId, teamId))
    .limit(1);
  const [row] = await db
    .insert(athletes)
    .values({ teamId, name, sex, equipment: rules?.equipment ?? [], ruleOverrides: {} })
    .$returningId();
  return row!.id;
}

export async function insertInvitation(db: Queryable, values: typeof invitations.$inferInsert): Promise<number> {
  const [row] = await db.insert(invitations).values(values).$returningId();
  return row!.id;
}

export async function replaceToken(db: Queryable, id: number, tokenHash: string, expiresAt: Date) {
  await db.update(invitations).set({ tokenHash, expiresAt }).where(eq(invitations.id, id));
}

export async function markRevoked(db: Queryable, id: number, now = new Date()) {
  await db.update(invitations).set({ revokedAt: now }).where(eq(invitations.id, id));
}

export async function markAccepted(db: Queryable, id: number, now = new Date()) {
  await db.update(invitations).set({ acceptedAt: now }).where(eq(invitations.id, id));
}

export async function insertUser(db: Queryable, values: { email: string; name: string; passwordHash: string }) {
  const [row] = await db.insert(users).values(values).$returningId();
  return row!.id;
}

export async function insertMembership(db: Queryable, teamId: number, userId: number, role: InvitationRow['role']) {
  await db.insert(memberships).values({ teamId, userId, role });
}

/** Links the roster entry to the account; false when someone else's account took it first. */
export async function linkAthlete(db: Queryable, teamId: number, athleteId: number, userId: number) {
  const [res] = await db
    .update(athletes)
    .set({ userId, version: sql`${athletes.version} + 1` })
    .where(and(eq(athletes.id, athleteId), eq(athletes.teamId, teamId), isNull(athletes.userId)));
  return res.affectedRows === 1;
}

export async function teamName(db: Queryable, teamId: number): Promise<string> {
  const [row] = await db.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId)).limit(1);
  return row?.name ?? '';
}
