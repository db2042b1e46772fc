// SQL for top sets: the plan entry a set is logged against, the sets themselves, and per-variant records.
import { and, asc, desc, eq, inArray, lt, ne, or, sql, type SQL } from 'drizzle-orm';
import type { TopSet } from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import { planEntries, topSets, variants } from '../../db/schema';

/** A plan entry of this athlete (another athlete's entry is simply not found), with its variant. */
export async function findAthleteEntry(db: Queryable, teamId: number, athleteId: number, planEntryId: number) {
  const [row] = await db
    .select({
      id: planEntries.id,
      week: planEntries.week,
      slotId: planEntries.slotId,
      variantId: planEntries.variantId,
      variantName: variants.name,
      lift: variants.lift,
    })
    .from(planEntries)
    .leftJoin(variants, and(eq(variants.id, planEntries.variantId), eq(variants.teamId, teamId)))
    .where(and(eq(planEntries.teamId, teamId), eq(planEntries.athleteId, athleteId), eq(planEntries.id, planEntryId)))
    .limit(1);
  return row ?? null;
}

const topSetColumns = {
  id: topSets.id,
  planEntryId: topSets.planEntryId,
  variantId: topSets.variantId,
  variantName: variants.name,
  lift: variants.lift,
  specificity: variants.specificity,
  week: topSets.week,
  performedOn: topSets.performedOn,
  weightKg: topSets.weightKg,
  reps: topSets.reps,
  rpe: topSets.rpe,
  e1rmKg: topSets.e1rmKg,
  note: topSets.note,
  videoId: topSets.videoId,
  version: topSets.version,
};

type Row = { [K in keyof typeof topSetColumns]: unknown } & {
  id: number;
  variantId: number;
  specificity: number;
};

export function toTopSet(r: Row): TopSet {
  return {
    id: r.id,
    planEntryId: (r.planEntryId as number | null) ?? null,
    variantId: r.variantId,
    variantName: r.variantName as string,
    lift: r.lift as TopSet['lift'],
    week: r.week as string,
    performedOn: r.performedOn as string,
    weightKg: Number(r.weightKg),
    reps: Number(r.reps),
    rpe: r.rpe === null ? null : Number(r.rpe),
    e1rmKg: Number(r.e1rmKg),
    note: (r.note as string | null) ?? null,
    videoId: (r.videoId as number | null) ?? null,
    version: Number(r.version),
  };
}

function selectTopSets(db: Queryable, teamId: number, athleteId: number, extra: SQL | undefined) {
  return db
    .select(topSetColumns)
    .from(topSets)
    .innerJoin(variants, eq(variants.id, topSets.variantId))
    .where(and(eq(topSets.teamId, teamId), eq(topSets.athleteId, athleteId), extra));
}

export async function insertTopSet(db: Queryable, row: typeof topSets.$inferInsert): Promise<number> {
  const [res] = await db.insert(topSets).values(row).$returningId();
  return res!.id;
}

export async function findTopSet(db: Queryable, teamId: number, athleteId: number, id: number) {
  const [row] = await selectTopSets(db, teamId, athleteId, eq(topSets.id, id)).limit(1);
  return row ? toTopSet(row) : null;
}

export async function setTopSetVideo(db: Queryable, teamId: number, id: number, videoId: number | null) {
  await db
    .update(topSets)
    .set({ videoId, version: sql`${topSets.version} + 1` })
    .where(and(eq(topSets.teamId, teamId), eq(topSets.id, id)));
}

const ORDER = {
  newest: [desc(topSets.performedOn), desc(topSets.id)],
  oldest: [asc(topSets.performedOn), asc(topSets.id)],
  e1rm: [desc(topSets.e1rmKg), desc(topSets.performedOn)],
} as const;

export async function listTopSets(
  db: Queryable,
  teamId: number,
  athleteId: number,
  q: {
    variantId?: number | undefined;
    lift?: TopSet['lift'] | undefined;
    limit: number;
    offset: number;
    sort: keyof typeof ORDER;
  },
) {
  const filter = and(
    q.variantId ? eq(topSets.variantId, q.variantId) : undefined,
    q.lift ? eq(variants.lift, q.lift) : undefined,
  );
  const rows = await selectTopSets(db, teamId, athleteId, filter)
    .orderBy(...ORDER[q.sort])
    .limit(q.limit)
    .offset(q.offset);
  const [count] = await db
    .select({ n: sql<number>`count(*)` })
    .from(topSets)
    .innerJoin(variants, eq(variants.id, topSets.variantId))
    .where(and(eq(topSets.teamId, teamId), eq(topSets.athleteId, athleteId), filter));
  return { items: rows.map(toTopSet), total: Number(count?.n ?? 0) };
}

/** Every top set of the athlete, oldest first, with the variant's specificity (for series and records). */
export async function allTopSets(db: Queryable, teamId: number, athleteId: number) {
  const rows = await selectTopSets(db, teamId, athleteId, undefined).orderBy(asc(topSets.performedOn), asc(topSets.id));
  return rows.map((r) => ({ ...toTopSet(r), specificity: Number(r.specificity) }));
}

/** Top sets on one variant, optionally leaving one out (the set just logged) or only weeks before one. */
export async function variantTopSets(
  db: Queryable,
  teamId: number,
  athleteId: number,
  variantId: number,
  opts: { excludeId?: number; beforeWeek?: string } = {},
) {
  const rows = await selectTopSets(
    db,
    teamId,
    athleteId,
    and(
      eq(topSets.variantId, variantId),
      opts.excludeId ? ne(topSets.id, opts.excludeId) : undefined,
      opts.beforeWeek ? lt(topSets.week, opts.beforeWeek) : undefined,
    ),
  ).orderBy(desc(topSets.performedOn), desc(topSets.id));
  return rows.map(toTopSet);
}

/**
 * An athlete's week in one query: every top set on the variants planned that week (for last time and
 * records) and every set logged in the week, newest first.
 */
export async function topSetsAroundWeek(db: Queryable, teamId: number, athleteId: number, week: string) {
  const planned = db
    .select({ variantId: planEntries.variantId })
    .from(planEntries)
    .where(and(eq(planEntries.teamId, teamId), eq(planEntries.athleteId, athleteId), eq(planEntries.week, week)));
  const rows = await selectTopSets(
    db,
    teamId,
    athleteId,
    or(eq(topSets.week, week), inArray(topSets.variantId, planned)),
  ).orderBy(desc(topSets.performedOn), desc(topSets.id));
  return rows.map(toTopSet);
}

/** This week's top sets logged against the given plan entries. */
export async function topSetsOfWeek(db: Queryable, teamId: number, athleteId: number, week: string) {
  const rows = await selectTopSets(db, teamId, athleteId, eq(topSets.week, week)).orderBy(
    asc(topSets.performedOn),
    asc(topSets.id),
  );
  return rows.map(toTopSet);
}

/** The top sets that carry these videos, keyed by video id. */
export async function topSetsByVideo(db: Queryable, teamId: number, athleteId: number, videoIds: number[]) {
  if (videoIds.length === 0) return new Map<number, TopSet>();
  const rows = await selectTopSets(db, teamId, athleteId, inArray(topSets.videoId, videoIds));
  return new Map(rows.map((r) => [r.videoId as number, toTopSet(r)]));
}
