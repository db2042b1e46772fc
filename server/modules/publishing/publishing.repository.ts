// SQL for publishing a week: the publication row, who receives the weekly e-mail, their picks, and how
// far the e-mails of a publication have got.
import { and, asc, eq, inArray, isNull, like, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { isDuplicateKey } from '../../db/errors';
import {
  athleteWeekPublications,
  athletes,
  memberships,
  outbox,
  planEntries,
  users,
  variants,
  weekPublications,
  type PublishedPick,
} from '../../db/schema';

export async function findPublication(db: Queryable, teamId: number, week: string) {
  const [row] = await db
    .select({
      id: weekPublications.id,
      publishedAt: weekPublications.publishedAt,
      publishedByName: users.name,
    })
    .from(weekPublications)
    .leftJoin(users, eq(users.id, weekPublications.publishedBy))
    .where(and(eq(weekPublications.teamId, teamId), eq(weekPublications.week, week)))
    .limit(1);
  return row ?? null;
}

/** Records the publication; false when the week was already published (by anyone, at any time). */
export async function insertPublication(db: Queryable, teamId: number, week: string, userId: number) {
  try {
    await db.insert(weekPublications).values({ teamId, week, publishedBy: userId });
    return true;
  } catch (err) {
    if (isDuplicateKey(err)) return false;
    throw err;
  }
}

/** Athletes of the team with an account in it and the weekly e-mail switched on. */
export async function weeklyRecipients(db: Queryable, teamId: number) {
  return (await athleteAccounts(db, teamId)).filter((a) => a.userId !== null && a.member !== null && a.weeklyEmail);
}

/** The week's max-effort picks of these athletes, with the variant behind each. */
export async function weekPicks(db: Queryable, teamId: number, week: string, athleteIds: number[]) {
  if (athleteIds.length === 0) return [];
  return db
    .select({
      athleteId: planEntries.athleteId,
      slotId: planEntries.slotId,
      variantName: variants.name,
      scheme: variants.scheme,
      notes: variants.notes,
    })
    .from(planEntries)
    .innerJoin(variants, and(eq(variants.id, planEntries.variantId), eq(variants.teamId, teamId)))
    .where(and(eq(planEntries.teamId, teamId), eq(planEntries.week, week), inArray(planEntries.athleteId, athleteIds)));
}

export const weeklyDedupePrefix = (teamId: number, week: string) => `weekly:${teamId}:${week}:`;

/** Delivered and waiting e-mails of one publication. */
export async function deliveryCounts(db: Queryable, teamId: number, week: string) {
  const [row] = await db
    .select({
      sent: sql<number>`coalesce(sum(${outbox.sentAt} is not null), 0)`,
      queued: sql<number>`coalesce(sum(${outbox.sentAt} is null), 0)`,
    })
    .from(outbox)
    .where(and(eq(outbox.teamId, teamId), like(outbox.dedupeKey, `${weeklyDedupePrefix(teamId, week)}%`)));
  return { sent: Number(row?.sent ?? 0), queued: Number(row?.queued ?? 0) };
}

/** Each athlete of the team (not archived) with their account, if any, and whether weekly e-mails are on. */
export async function athleteAccounts(db: Queryable, teamId: number) {
  return db
    .select({
      athleteId: athletes.id,
      athleteName: athletes.name,
      userId: users.id,
      email: users.email,
      weeklyEmail: users.weeklyEmail,
      member: memberships.userId,
    })
    .from(athletes)
    .leftJoin(users, eq(users.id, athletes.userId))
    .leftJoin(
      memberships,
      and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')),
    )
    .where(and(eq(athletes.teamId, teamId), isNull(athletes.archivedAt)))
    .orderBy(asc(athletes.name), asc(athletes.id));
}

/** The week's publications per athlete; `lock` holds them until the transaction ends. */
export async function athletePublications(db: Queryable, teamId: number, week: string, lock = false) {
  const q = db
    .select()
    .from(athleteWeekPublications)
    .where(and(eq(athleteWeekPublications.teamId, teamId), eq(athleteWeekPublications.week, week)));
  return lock ? q.for('update') : q;
}

export async function insertAthletePublication(
  db: Queryable,
  row: { teamId: number; athleteId: number; week: string; picks: PublishedPick[]; publishedBy: number },
) {
  await db.insert(athleteWeekPublications).values({ ...row, version: 1 });
}

/** Publishes again over the version read; false when someone else published in between. */
export async function updateAthletePublication(
  db: Queryable,
  id: number,
  version: number,
  picks: PublishedPick[],
  publishedBy: number,
) {
  const [res] = await db
    .update(athleteWeekPublications)
    .set({ picks, publishedBy, version: version + 1 })
    .where(and(eq(athleteWeekPublications.id, id), eq(athleteWeekPublications.version, version)));
  return (res as unknown as { affectedRows: number }).affectedRows === 1;
}
