// SQL for plan entries, their history, and what planning reads: athletes, library, rules, restrictions, meets.
// Every function takes the caller's teamId and filters by it.
import { and, asc, count, desc, eq, gte, inArray, isNotNull, isNull, lte, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/mysql-core';
import type { Queryable } from '../../db/client';
import {
  athletes,
  meetEntries,
  meets,
  planEntries,
  planEntryHistory,
  restWeeks,
  restrictions,
  teamRules,
  users,
  variants,
} from '../../db/schema';
import type { PlanCell, PlanListQuery } from '../../../shared/schemas';

export type EntryRow = typeof planEntries.$inferSelect;
export type AthleteRow = Pick<typeof athletes.$inferSelect, 'id' | 'name' | 'equipment' | 'ruleOverrides' | 'maxRisk'>;

const athleteCols = {
  id: athletes.id,
  name: athletes.name,
  equipment: athletes.equipment,
  ruleOverrides: athletes.ruleOverrides,
  maxRisk: athletes.maxRisk,
};

/** The team's athletes on the board (not archived), by name; only `ids` when given. */
export async function listAthletes(db: Queryable, teamId: number, ids?: number[]): Promise<AthleteRow[]> {
  if (ids && ids.length === 0) return [];
  return db
    .select(athleteCols)
    .from(athletes)
    .where(and(eq(athletes.teamId, teamId), isNull(athletes.archivedAt), ids ? inArray(athletes.id, ids) : undefined))
    .orderBy(asc(athletes.name), asc(athletes.id));
}

/** Any athlete of the team, archived ones too (their history stays readable). */
export async function athleteExists(db: Queryable, teamId: number, id: number): Promise<boolean> {
  const [row] = await db
    .select({ id: athletes.id })
    .from(athletes)
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, id)))
    .limit(1);
  return !!row;
}

export async function readRulesRow(db: Queryable, teamId: number, lock = false) {
  const q = db.select().from(teamRules).where(eq(teamRules.teamId, teamId)).limit(1);
  const [row] = lock ? await q.for('update') : await q;
  return row ?? null;
}

export async function setSeed(db: Queryable, teamId: number, seed: string, userId: number): Promise<void> {
  await db
    .update(teamRules)
    .set({ seed, version: sql`${teamRules.version} + 1`, updatedBy: userId })
    .where(eq(teamRules.teamId, teamId));
}

/** The whole library, archived variants included (past picks still name them). */
export async function teamVariants(db: Queryable, teamId: number) {
  return db.select().from(variants).where(eq(variants.teamId, teamId)).orderBy(asc(variants.name));
}

/** Restrictions of these athletes that have not ended before `fromDay`. */
export async function restrictionsFor(db: Queryable, teamId: number, athleteIds: number[], fromDay: string) {
  if (athleteIds.length === 0) return [];
  return db
    .select()
    .from(restrictions)
    .where(
      and(
        eq(restrictions.teamId, teamId),
        inArray(restrictions.athleteId, athleteIds),
        or(isNull(restrictions.toDate), gte(restrictions.toDate, fromDay)),
      ),
    )
    .orderBy(asc(restrictions.fromDate), asc(restrictions.id));
}

/** Every rest week of these athletes, oldest first. */
export async function restWeeksFor(db: Queryable, teamId: number, athleteIds: number[]) {
  if (athleteIds.length === 0) return [];
  return db
    .select({ athleteId: restWeeks.athleteId, week: restWeeks.week })
    .from(restWeeks)
    .where(and(eq(restWeeks.teamId, teamId), inArray(restWeeks.athleteId, athleteIds)))
    .orderBy(asc(restWeeks.athleteId), asc(restWeeks.week));
}

/** Meets on or after `today` that these athletes are entered in, soonest first. */
export async function upcomingMeets(db: Queryable, teamId: number, athleteIds: number[], today: string) {
  if (athleteIds.length === 0) return [];
  return db
    .select({ athleteId: meetEntries.athleteId, id: meets.id, name: meets.name, date: meets.date })
    .from(meetEntries)
    .innerJoin(meets, and(eq(meets.id, meetEntries.meetId), eq(meets.teamId, teamId)))
    .where(and(eq(meetEntries.teamId, teamId), inArray(meetEntries.athleteId, athleteIds), gte(meets.date, today)))
    .orderBy(asc(meets.date), asc(meets.id));
}

/** Every plan entry of these athletes; `lock` holds them (and the gaps between) until the transaction ends. */
export async function entriesOfAthletes(
  db: Queryable,
  teamId: number,
  athleteIds: number[],
  lock = false,
): Promise<EntryRow[]> {
  if (athleteIds.length === 0) return [];
  const q = db
    .select()
    .from(planEntries)
    .where(and(eq(planEntries.teamId, teamId), inArray(planEntries.athleteId, athleteIds)))
    .orderBy(asc(planEntries.athleteId), asc(planEntries.week), asc(planEntries.slotId));
  return lock ? q.for('update') : q;
}

export async function findCell(db: Queryable, teamId: number, cell: PlanCell, lock = false) {
  const q = db
    .select()
    .from(planEntries)
    .where(
      and(
        eq(planEntries.teamId, teamId),
        eq(planEntries.athleteId, cell.athleteId),
        eq(planEntries.week, cell.week),
        eq(planEntries.slotId, cell.slotId),
      ),
    )
    .limit(1);
  const [row] = lock ? await q.for('update') : await q;
  return row ?? null;
}

export type EntryWrite = Pick<
  typeof planEntries.$inferInsert,
  'variantId' | 'source' | 'pinned' | 'reason' | 'reasons' | 'updatedBy'
>;

export async function insertEntry(db: Queryable, teamId: number, cell: PlanCell, values: EntryWrite): Promise<number> {
  const [res] = await db
    .insert(planEntries)
    .values({ teamId, athleteId: cell.athleteId, week: cell.week, slotId: cell.slotId, ...values, version: 1 })
    .$returningId();
  return res!.id;
}

/** Writes only when the row still has the version the caller read; false when it did not. */
export async function updateEntry(db: Queryable, id: number, version: number, values: EntryWrite): Promise<boolean> {
  const [res] = await db
    .update(planEntries)
    .set({ ...values, version: version + 1 })
    .where(and(eq(planEntries.id, id), eq(planEntries.version, version)));
  return (res as unknown as { affectedRows: number }).affectedRows === 1;
}

export async function entriesByIds(db: Queryable, teamId: number, ids: number[]): Promise<EntryRow[]> {
  if (ids.length === 0) return [];
  return db
    .select()
    .from(planEntries)
    .where(and(eq(planEntries.teamId, teamId), inArray(planEntries.id, ids)));
}

export type HistoryInsert = typeof planEntryHistory.$inferInsert;

export async function appendHistory(db: Queryable, rows: HistoryInsert[]): Promise<void> {
  if (rows.length) await db.insert(planEntryHistory).values(rows);
}

export async function userNames(db: Queryable, ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((x): x is number => x !== null))];
  if (wanted.length === 0) return new Map();
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, wanted));
  return new Map(rows.map((r) => [r.id, r.name]));
}

const SORTS: Record<string, SQL[]> = {
  week: [asc(planEntries.week), asc(athletes.name), asc(planEntries.slotId)],
  '-week': [desc(planEntries.week), asc(athletes.name), asc(planEntries.slotId)],
  athlete: [asc(athletes.name), asc(planEntries.week), asc(planEntries.slotId)],
  '-athlete': [desc(athletes.name), asc(planEntries.week), asc(planEntries.slotId)],
  updated: [asc(planEntries.updatedAt), asc(planEntries.id)],
  '-updated': [desc(planEntries.updatedAt), desc(planEntries.id)],
};

export async function listEntries(db: Queryable, teamId: number, q: PlanListQuery) {
  const where = and(
    eq(planEntries.teamId, teamId),
    q.from ? gte(planEntries.week, q.from) : undefined,
    q.to ? lte(planEntries.week, q.to) : undefined,
    q.athleteId ? eq(planEntries.athleteId, q.athleteId) : undefined,
    q.slotId ? eq(planEntries.slotId, q.slotId) : undefined,
    q.source ? eq(planEntries.source, q.source) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    db
      .select({ entry: planEntries })
      .from(planEntries)
      .innerJoin(athletes, eq(athletes.id, planEntries.athleteId))
      .where(where)
      .orderBy(...SORTS[q.sort]!)
      .limit(q.limit)
      .offset(q.offset),
    db.select({ n: count() }).from(planEntries).where(where),
  ]);
  return { rows: rows.map((r) => r.entry), total: Number(total?.n ?? 0) };
}

const oldVariant = alias(variants, 'old_variant');
const newVariant = alias(variants, 'new_variant');

export async function cellHistory(db: Queryable, teamId: number, cell: PlanCell, limit: number, offset: number) {
  const where = and(
    eq(planEntryHistory.teamId, teamId),
    eq(planEntryHistory.athleteId, cell.athleteId),
    eq(planEntryHistory.week, cell.week),
    eq(planEntryHistory.slotId, cell.slotId),
  );
  const [rows, [total]] = await Promise.all([
    db
      .select({
        h: planEntryHistory,
        oldName: oldVariant.name,
        newName: newVariant.name,
        byName: users.name,
      })
      .from(planEntryHistory)
      .leftJoin(oldVariant, eq(oldVariant.id, planEntryHistory.oldVariantId))
      .leftJoin(newVariant, eq(newVariant.id, planEntryHistory.newVariantId))
      .leftJoin(users, eq(users.id, planEntryHistory.changedBy))
      .where(where)
      .orderBy(desc(planEntryHistory.id))
      .limit(limit)
      .offset(offset),
    db.select({ n: count() }).from(planEntryHistory).where(where),
  ]);
  return { rows, total: Number(total?.n ?? 0) };
}

/** One athlete's max-effort picks on the board for a week, with their variants, in slot order. */
export async function weekPicks(db: Queryable, teamId: number, athleteId: number, week: string) {
  return db
    .select({
      planEntryId: planEntries.id,
      slotId: planEntries.slotId,
      variant: {
        id: variants.id,
        name: variants.name,
        lift: variants.lift,
        family: variants.family,
        bar: variants.bar,
        specificity: variants.specificity,
        scheme: variants.scheme,
        notes: variants.notes,
        stress: variants.stress,
      },
    })
    .from(planEntries)
    .innerJoin(variants, and(eq(variants.id, planEntries.variantId), eq(variants.teamId, teamId)))
    .where(
      and(
        eq(planEntries.teamId, teamId),
        eq(planEntries.athleteId, athleteId),
        eq(planEntries.week, week),
        isNotNull(planEntries.variantId),
      ),
    )
    .orderBy(asc(planEntries.slotId));
}
