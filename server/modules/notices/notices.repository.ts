// SQL for coaches' notices and their daily e-mail setting. Every query is scoped to the team or the coach.
import { and, asc, count, desc, eq, inArray, isNull, lt, notExists, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import {
  athleteWeekPublications,
  athletes,
  memberships,
  noticeSettings,
  notices,
  planEntries,
  topSets,
  users,
  variants,
} from '../../db/schema';
import type { NoticeKind } from '../../../shared/schemas';

/** The team's coaches and head coaches. */
export async function teamCoachIds(db: Queryable, teamId: number): Promise<number[]> {
  const rows = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), inArray(memberships.role, ['head_coach', 'coach'])));
  return rows.map((r) => r.userId);
}

export async function athleteName(db: Queryable, teamId: number, athleteId: number): Promise<string | null> {
  const [row] = await db
    .select({ name: athletes.name })
    .from(athletes)
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return row?.name ?? null;
}

export interface NewNotice {
  teamId: number;
  kind: NoticeKind;
  athleteId: number;
  week: string;
  text: string;
  path: string;
  dedupeKey: string;
}

/** One notice per coach; an event already noticed (same key) is left as it is. */
export async function insertNotices(db: Queryable, userIds: number[], n: NewNotice): Promise<void> {
  if (userIds.length === 0) return;
  await db
    .insert(notices)
    .values(userIds.map((userId) => ({ ...n, text: n.text.slice(0, 300), userId })))
    .onDuplicateKeyUpdate({ set: { id: sql`${notices.id}` } });
}

export async function listNotices(db: Queryable, teamId: number, userId: number, q: { limit: number; offset: number }) {
  const mine = and(eq(notices.teamId, teamId), eq(notices.userId, userId));
  const [rows, [totals]] = await Promise.all([
    db.select().from(notices).where(mine).orderBy(desc(notices.id)).limit(q.limit).offset(q.offset),
    db
      .select({ total: count(), unread: sql<number>`SUM(${notices.readAt} IS NULL)`.mapWith(Number) })
      .from(notices)
      .where(mine),
  ]);
  return { rows, total: totals?.total ?? 0, unread: totals?.unread ?? 0 };
}

/** Marks the coach's notices read (all of them, or the ids given); returns how many changed. */
export async function markNoticesRead(db: Queryable, teamId: number, userId: number, ids: number[] | null) {
  const [res] = await db
    .update(notices)
    .set({ readAt: new Date() })
    .where(
      and(
        eq(notices.teamId, teamId),
        eq(notices.userId, userId),
        isNull(notices.readAt),
        ids ? inArray(notices.id, ids) : undefined,
      ),
    );
  return res.affectedRows;
}

export async function findNotice(db: Queryable, teamId: number, userId: number, id: number) {
  const [row] = await db
    .select({ id: notices.id })
    .from(notices)
    .where(and(eq(notices.teamId, teamId), eq(notices.userId, userId), eq(notices.id, id)))
    .limit(1);
  return row ?? null;
}

export async function findSettings(db: Queryable, userId: number) {
  const [row] = await db.select().from(noticeSettings).where(eq(noticeSettings.userId, userId)).limit(1);
  return row ?? null;
}

export async function saveDailyEmail(db: Queryable, userId: number, dailyEmail: boolean) {
  await db.insert(noticeSettings).values({ userId, dailyEmail }).onDuplicateKeyUpdate({ set: { dailyEmail } });
}

export async function setLastDigestOn(db: Queryable, userId: number, day: string) {
  await db
    .insert(noticeSettings)
    .values({ userId, lastDigestOn: day })
    .onDuplicateKeyUpdate({ set: { lastDigestOn: day } });
}

export async function findUser(db: Queryable, userId: number) {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  return row ?? null;
}

/**
 * Coaches due a summary on `day`: unread notices not yet in a summary, made before `before`, the daily
 * e-mail not turned off and no summary queued that day yet.
 */
export async function coachesDueDigest(db: Queryable, day: string, before: Date) {
  return db
    .selectDistinct({ userId: notices.userId, teamId: notices.teamId })
    .from(notices)
    .leftJoin(noticeSettings, eq(noticeSettings.userId, notices.userId))
    .where(
      and(
        isNull(notices.readAt),
        isNull(notices.digestedAt),
        lt(notices.createdAt, before),
        sql`COALESCE(${noticeSettings.dailyEmail}, TRUE)`,
        sql`(${noticeSettings.lastDigestOn} IS NULL OR ${noticeSettings.lastDigestOn} < ${day})`,
      ),
    )
    .orderBy(asc(notices.userId));
}

/** The unread notices a summary carries, oldest first, locked for the caller's transaction. */
export async function digestNotices(db: Queryable, teamId: number, userId: number, before: Date) {
  return db
    .select()
    .from(notices)
    .where(
      and(
        eq(notices.teamId, teamId),
        eq(notices.userId, userId),
        isNull(notices.readAt),
        isNull(notices.digestedAt),
        lt(notices.createdAt, before),
      ),
    )
    .orderBy(asc(notices.id))
    .for('update');
}

export async function markDigested(db: Queryable, ids: number[], at: Date) {
  if (ids.length === 0) return;
  await db.update(notices).set({ digestedAt: at }).where(inArray(notices.id, ids));
}

/**
 * Published plan entries of `week` with a variant and no top set logged against them: the top sets the
 * athlete missed, once the week is over.
 */
export async function unloggedEntries(db: Queryable, week: string) {
  return db
    .select({
      teamId: planEntries.teamId,
      athleteId: planEntries.athleteId,
      entryId: planEntries.id,
      slotId: planEntries.slotId,
      athleteName: athletes.name,
      variantName: variants.name,
    })
    .from(planEntries)
    .innerJoin(athletes, and(eq(athletes.id, planEntries.athleteId), isNull(athletes.archivedAt)))
    .innerJoin(variants, eq(variants.id, planEntries.variantId))
    .innerJoin(
      athleteWeekPublications,
      and(
        eq(athleteWeekPublications.teamId, planEntries.teamId),
        eq(athleteWeekPublications.athleteId, planEntries.athleteId),
        eq(athleteWeekPublications.week, planEntries.week),
      ),
    )
    .where(
      and(
        eq(planEntries.week, week),
        sql`${planEntries.variantId} IS NOT NULL`,
        notExists(
          db
            .select({ one: sql`1` })
            .from(topSets)
            .where(and(eq(topSets.planEntryId, planEntries.id), eq(topSets.teamId, planEntries.teamId))),
        ),
      ),
    );
}
