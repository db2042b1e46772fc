// SQL for the roster: athletes, their restrictions, linked accounts, meets entered and training history.
import { and, asc, desc, eq, gte, inArray, isNull, like, lte, sql, type AnyColumn, type SQL } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import {
  athletes,
  bodyweights,
  meetEntries,
  meets,
  memberships,
  planEntries,
  restWeeks,
  restrictions,
  teamRules,
  topSets,
  users,
  variants,
} from '../../db/schema';
import { readSort } from '../../../shared/schemas';
import type { athleteSortKeys } from '../../../shared/schemas/roster';
import { mondayOf } from '../../../shared/engine/weeks';
import { containsPattern } from '../../db/patterns';
import { isoDay } from '../../lib/days';

const DAY = 86_400_000;

export type AthleteRow = typeof athletes.$inferSelect & {
  accountName: string | null;
  accountEmail: string | null;
};
export type AthleteValues = Partial<
  Omit<typeof athletes.$inferInsert, 'id' | 'teamId' | 'version' | 'createdAt' | 'updatedAt'>
>;
export type RestrictionRow = typeof restrictions.$inferSelect;

const athleteColumns = {
  id: athletes.id,
  teamId: athletes.teamId,
  userId: athletes.userId,
  name: athletes.name,
  sex: athletes.sex,
  birthYear: athletes.birthYear,
  division: athletes.division,
  maxRisk: athletes.maxRisk,
  equipment: athletes.equipment,
  ruleOverrides: athletes.ruleOverrides,
  notes: athletes.notes,
  archivedAt: athletes.archivedAt,
  version: athletes.version,
  createdAt: athletes.createdAt,
  updatedAt: athletes.updatedAt,
  accountName: users.name,
  accountEmail: users.email,
};

const SORT: Record<(typeof athleteSortKeys)[number], SQL | AnyColumn> = {
  name: athletes.name,
  // No ceiling sorts after the highest one.
  maxRisk: sql`coalesce(${athletes.maxRisk}, 4)`,
  division: athletes.division,
  createdAt: athletes.createdAt,
};

export async function listAthletes(
  db: Queryable,
  teamId: number,
  f: {
    q?: string | undefined;
    includeArchived: boolean;
    sort: Parameters<typeof readSort>[0];
    limit: number;
    offset: number;
  },
) {
  const where: (SQL | undefined)[] = [eq(athletes.teamId, teamId)];
  if (!f.includeArchived) where.push(isNull(athletes.archivedAt));
  if (f.q) where.push(like(athletes.name, containsPattern(f.q)));
  const cond = and(...where);
  const { key, desc: down } = readSort(f.sort as (typeof athleteSortKeys)[number]);
  const col = SORT[key];
  const [rows, [count]] = await Promise.all([
    db
      .select(athleteColumns)
      .from(athletes)
      .leftJoin(users, eq(users.id, athletes.userId))
      .where(cond)
      .orderBy(down ? desc(col) : asc(col), asc(athletes.name), asc(athletes.id))
      .limit(f.limit)
      .offset(f.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(athletes)
      .where(cond),
  ]);
  return { rows: rows as AthleteRow[], total: Number(count?.n ?? 0) };
}

export async function findAthlete(db: Queryable, teamId: number, id: number): Promise<AthleteRow | null> {
  const [row] = await db
    .select(athleteColumns)
    .from(athletes)
    .leftJoin(users, eq(users.id, athletes.userId))
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, id)))
    .limit(1);
  return (row as AthleteRow | undefined) ?? null;
}

export async function insertAthlete(
  db: Queryable,
  teamId: number,
  values: Omit<typeof athletes.$inferInsert, 'teamId'>,
): Promise<number> {
  const [res] = await db
    .insert(athletes)
    .values({ ...values, teamId })
    .$returningId();
  return res!.id;
}

export async function updateAthlete(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  values: AthleteValues,
): Promise<boolean> {
  const [res] = await db
    .update(athletes)
    .set({ ...values, version: sql`${athletes.version} + 1` })
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, id), eq(athletes.version, version)));
  return res.affectedRows > 0;
}

export async function gymEquipment(db: Queryable, teamId: number): Promise<string[]> {
  const [row] = await db
    .select({ equipment: teamRules.equipment })
    .from(teamRules)
    .where(eq(teamRules.teamId, teamId))
    .limit(1);
  return row?.equipment ?? [];
}

/** Team members with the athlete role, with the roster entry each is linked to. */
export async function athleteAccounts(db: Queryable, teamId: number) {
  return db
    .select({ id: users.id, name: users.name, email: users.email, athleteId: athletes.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(athletes, and(eq(athletes.userId, users.id), eq(athletes.teamId, teamId)))
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')))
    .orderBy(asc(users.name));
}

export async function findAthleteAccount(db: Queryable, teamId: number, userId: number) {
  const [row] = await db
    .select({ id: users.id, name: users.name, linkedTo: athletes.id, linkedName: athletes.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(athletes, and(eq(athletes.userId, users.id), eq(athletes.teamId, teamId)))
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'athlete'), eq(users.id, userId)))
    .limit(1);
  return row ?? null;
}

export async function restrictionsOf(db: Queryable, teamId: number, athleteIds: number[]): Promise<RestrictionRow[]> {
  if (athleteIds.length === 0) return [];
  return db
    .select()
    .from(restrictions)
    .where(and(eq(restrictions.teamId, teamId), inArray(restrictions.athleteId, athleteIds)))
    .orderBy(desc(restrictions.fromDate), asc(restrictions.id));
}

export async function meetsOf(db: Queryable, teamId: number, athleteIds: number[]) {
  if (athleteIds.length === 0) return [];
  return db
    .select({
      athleteId: meetEntries.athleteId,
      entryId: meetEntries.id,
      meetId: meets.id,
      name: meets.name,
      date: meets.date,
      weightClass: meetEntries.weightClass,
    })
    .from(meetEntries)
    .innerJoin(meets, eq(meets.id, meetEntries.meetId))
    .where(and(eq(meetEntries.teamId, teamId), inArray(meetEntries.athleteId, athleteIds)))
    .orderBy(asc(meets.date));
}

/** Each athlete's most recent bodyweight. */
export async function latestBodyweights(db: Queryable, teamId: number, athleteIds: number[]) {
  if (athleteIds.length === 0) return new Map<number, { weightKg: number; measuredOn: string }>();
  const latest = db
    .select({ athleteId: bodyweights.athleteId, day: sql<string>`max(${bodyweights.measuredOn})`.as('day') })
    .from(bodyweights)
    .where(and(eq(bodyweights.teamId, teamId), inArray(bodyweights.athleteId, athleteIds)))
    .groupBy(bodyweights.athleteId)
    .as('latest');
  const rows = await db
    .select({ athleteId: bodyweights.athleteId, weightKg: bodyweights.weightKg, measuredOn: bodyweights.measuredOn })
    .from(bodyweights)
    .innerJoin(latest, and(eq(latest.athleteId, bodyweights.athleteId), eq(latest.day, bodyweights.measuredOn)));
  return new Map(rows.map((r) => [r.athleteId, { weightKg: Number(r.weightKg), measuredOn: r.measuredOn }]));
}

export async function findRestriction(db: Queryable, teamId: number, athleteId: number, id: number) {
  const [row] = await db
    .select()
    .from(restrictions)
    .where(and(eq(restrictions.teamId, teamId), eq(restrictions.athleteId, athleteId), eq(restrictions.id, id)))
    .limit(1);
  return row ?? null;
}

export async function insertRestriction(db: Queryable, values: typeof restrictions.$inferInsert): Promise<number> {
  const [res] = await db.insert(restrictions).values(values).$returningId();
  return res!.id;
}

export async function updateRestriction(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  values: Partial<
    Pick<RestrictionRow, 'joint' | 'maxStress' | 'emphasis' | 'families' | 'fromDate' | 'toDate' | 'note'>
  >,
): Promise<boolean> {
  const [res] = await db
    .update(restrictions)
    .set({ ...values, version: sql`${restrictions.version} + 1` })
    .where(and(eq(restrictions.teamId, teamId), eq(restrictions.id, id), eq(restrictions.version, version)));
  return res.affectedRows > 0;
}

export async function deleteRestriction(db: Queryable, teamId: number, athleteId: number, id: number) {
  const [res] = await db
    .delete(restrictions)
    .where(and(eq(restrictions.teamId, teamId), eq(restrictions.athleteId, athleteId), eq(restrictions.id, id)));
  return res.affectedRows > 0;
}

export async function findRestWeek(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [row] = await db
    .select({ athleteId: restWeeks.athleteId, week: restWeeks.week, createdAt: restWeeks.createdAt })
    .from(restWeeks)
    .where(and(eq(restWeeks.teamId, teamId), eq(restWeeks.athleteId, athleteId), eq(restWeeks.week, week)))
    .limit(1);
  return row ?? null;
}

/** Marks the week; a second mark of it (even a concurrent one) leaves the one row the unique key allows. */
export async function insertRestWeek(
  db: Queryable,
  values: { teamId: number; athleteId: number; week: string; createdBy: number },
): Promise<void> {
  await db
    .insert(restWeeks)
    .values(values)
    .onDuplicateKeyUpdate({ set: { week: sql`${restWeeks.week}` } });
}

export async function deleteRestWeek(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [res] = await db
    .delete(restWeeks)
    .where(and(eq(restWeeks.teamId, teamId), eq(restWeeks.athleteId, athleteId), eq(restWeeks.week, week)));
  return res.affectedRows > 0;
}

/** Picks, top sets and bodyweights of one athlete, newest first for picks and sets, oldest first for weights. */
export async function athleteHistory(
  db: Queryable,
  teamId: number,
  athleteId: number,
  range: { from?: string | undefined; to?: string | undefined },
) {
  // ISO week strings sort in calendar order, so a text range is a week range.
  const within = (week: typeof planEntries.week | typeof topSets.week) => [
    range.from ? gte(week, range.from) : undefined,
    range.to ? lte(week, range.to) : undefined,
  ];
  const pickWhere = and(
    eq(planEntries.teamId, teamId),
    eq(planEntries.athleteId, athleteId),
    ...within(planEntries.week),
  );
  const setWhere = and(eq(topSets.teamId, teamId), eq(topSets.athleteId, athleteId), ...within(topSets.week));
  const [picks, sets, weights] = await Promise.all([
    db
      .select({
        id: planEntries.id,
        week: planEntries.week,
        slotId: planEntries.slotId,
        variantId: planEntries.variantId,
        variantName: variants.name,
        variantArchivedAt: variants.archivedAt,
        lift: variants.lift,
        family: variants.family,
        source: planEntries.source,
        pinned: planEntries.pinned,
        reason: planEntries.reason,
      })
      .from(planEntries)
      .leftJoin(variants, and(eq(variants.id, planEntries.variantId), eq(variants.teamId, teamId)))
      .where(pickWhere)
      .orderBy(desc(planEntries.week), asc(planEntries.slotId)),
    db
      .select({
        id: topSets.id,
        week: topSets.week,
        performedOn: topSets.performedOn,
        variantId: topSets.variantId,
        variantName: variants.name,
        lift: variants.lift,
        weightKg: topSets.weightKg,
        reps: topSets.reps,
        rpe: topSets.rpe,
        e1rmKg: topSets.e1rmKg,
      })
      .from(topSets)
      .innerJoin(variants, and(eq(variants.id, topSets.variantId), eq(variants.teamId, teamId)))
      .where(setWhere)
      .orderBy(desc(topSets.performedOn), desc(topSets.id)),
    db
      .select({ measuredOn: bodyweights.measuredOn, weightKg: bodyweights.weightKg })
      .from(bodyweights)
      .where(
        and(
          eq(bodyweights.teamId, teamId),
          eq(bodyweights.athleteId, athleteId),
          range.from ? gte(bodyweights.measuredOn, isoDay(mondayOf(range.from))) : undefined,
          range.to ? lte(bodyweights.measuredOn, isoDay(new Date(mondayOf(range.to).getTime() + 6 * DAY))) : undefined,
        ),
      )
      .orderBy(asc(bodyweights.measuredOn)),
  ]);
  return { picks, sets, weights };
}

/**
 * The roster entry behind an athlete page, with the linked account's unit: looked up inside the caller's
 * team only, so another team's athlete is simply not found.
 */
export async function findTeamAthlete(db: Queryable, teamId: number, athleteId: number) {
  const [row] = await db
    .select({
      id: athletes.id,
      teamId: athletes.teamId,
      name: athletes.name,
      sex: athletes.sex,
      division: athletes.division,
      userId: athletes.userId,
      unit: users.unit,
    })
    .from(athletes)
    .leftJoin(users, eq(users.id, athletes.userId))
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return row ? { ...row, unit: row.unit ?? 'kg' } : null;
}
