// SQL for connective-tissue prescriptions and check-ins, and the few facts their generation reads
// (team rules, the next meet). Every query is scoped to the team.
import { and, asc, desc, eq, gt, gte, lt, lte, sql, type SQL } from 'drizzle-orm';
import type { Joint } from '../../../shared/engine/types';
import { DEFAULT_TISSUE_RULES, type TissueKind, type TissuePrescription } from '../../../shared/engine/tissue';
import type { Queryable } from '../../db/client';
import { meetEntries, meets, teamRules, tissueCheckins, tissuePrescriptions } from '../../db/schema';

/**
 * The rules document as stored (text), so a caller can tell an unchanged document from a changed one
 * without parsing it; null when the team has never saved rules.
 */
export async function findTeamRulesText(db: Queryable, teamId: number): Promise<string | null> {
  const [row] = await db
    // As text: the driver would otherwise hand back the parsed document.
    .select({ rules: sql<string>`CAST(${teamRules.rules} AS CHAR)`.mapWith(String) })
    .from(teamRules)
    .where(eq(teamRules.teamId, teamId))
    .limit(1);
  return row?.rules ?? null;
}

/**
 * Stored items as the app reads them: items stored before the weekly session count existed read as the
 * default count, the number those weeks were meant to be done.
 */
function storedItems(items: unknown): TissuePrescription[] {
  return (items as (Omit<TissuePrescription, 'sessionsPerWeek'> & { sessionsPerWeek?: number })[]).map(
    (item) =>
      ({
        ...item,
        sessionsPerWeek: item.sessionsPerWeek ?? DEFAULT_TISSUE_RULES.sessionsPerWeek,
      }) as TissuePrescription,
  );
}

/** One athlete's prescriptions, inside the team. */
const prescriptionsOf = (teamId: number, athleteId: number) =>
  and(eq(tissuePrescriptions.teamId, teamId), eq(tissuePrescriptions.athleteId, athleteId));

export async function findPrescription(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [row] = await db
    .select()
    .from(tissuePrescriptions)
    .where(and(prescriptionsOf(teamId, athleteId), eq(tissuePrescriptions.week, week)))
    .limit(1);
  return row ? { ...row, items: storedItems(row.items) } : null;
}

async function listPrescriptions(db: Queryable, teamId: number, athleteId: number, weeks: SQL) {
  const rows = await db
    .select({ week: tissuePrescriptions.week, items: tissuePrescriptions.items })
    .from(tissuePrescriptions)
    .where(and(prescriptionsOf(teamId, athleteId), weeks))
    .orderBy(asc(tissuePrescriptions.week));
  return rows.map((r) => ({ week: r.week, items: storedItems(r.items) }));
}

/** Stored prescriptions of the weeks before `week`, oldest first. */
export async function listPrescriptionsBefore(db: Queryable, teamId: number, athleteId: number, week: string) {
  return listPrescriptions(db, teamId, athleteId, lt(tissuePrescriptions.week, week));
}

/** Stored prescriptions up to and including `week`, oldest first (history, that week and the one before). */
export async function listPrescriptionsThrough(db: Queryable, teamId: number, athleteId: number, week: string) {
  return listPrescriptions(db, teamId, athleteId, lte(tissuePrescriptions.week, week));
}

/**
 * Stores a week's prescription unless one is there already (two requests generating the same week at
 * once compute the same thing; the first write wins and both read it back).
 */
export async function insertPrescriptionIfAbsent(
  db: Queryable,
  row: { teamId: number; athleteId: number; week: string; items: TissuePrescription[] },
) {
  await db
    .insert(tissuePrescriptions)
    .values(row)
    .onDuplicateKeyUpdate({ set: { id: sql`${tissuePrescriptions.id}` } });
}

/** Drops stored prescriptions after both weeks, so they are generated again with newer check-ins. */
export async function deletePrescriptionsAfter(db: Queryable, teamId: number, athleteId: number, week: string) {
  await db
    .delete(tissuePrescriptions)
    .where(and(prescriptionsOf(teamId, athleteId), gt(tissuePrescriptions.week, week)));
}

export async function listCheckins(db: Queryable, teamId: number, athleteId: number, opts: { limit?: number } = {}) {
  const q = db
    .select()
    .from(tissueCheckins)
    .where(and(eq(tissueCheckins.teamId, teamId), eq(tissueCheckins.athleteId, athleteId)))
    .orderBy(desc(tissueCheckins.week), desc(tissueCheckins.createdAt), desc(tissueCheckins.id));
  const rows = opts.limit ? await q.limit(opts.limit) : await q;
  return rows.map((r) => ({ ...r, painJoints: r.painJoints as Joint[] }));
}

export async function insertCheckin(
  db: Queryable,
  row: {
    teamId: number;
    athleteId: number;
    week: string;
    kind: TissueKind;
    soreness: number;
    painJoints: Joint[];
    note: string | null;
  },
) {
  const [res] = await db.insert(tissueCheckins).values(row).$returningId();
  const [saved] = await db.select().from(tissueCheckins).where(eq(tissueCheckins.id, res!.id));
  return { ...saved!, painJoints: saved!.painJoints as Joint[] };
}

const meetColumns = {
  id: meets.id,
  name: meets.name,
  date: meets.date,
  weightClass: meetEntries.weightClass,
  division: meetEntries.division,
};

/** The athlete's meets on or after `fromDate`, soonest first. */
function meetsOn(db: Queryable, teamId: number, athleteId: number, fromDate: string) {
  return db
    .select(meetColumns)
    .from(meetEntries)
    .innerJoin(meets, and(eq(meets.id, meetEntries.meetId), eq(meets.teamId, teamId)))
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.athleteId, athleteId), gte(meets.date, fromDate)))
    .orderBy(asc(meets.date), asc(meets.id));
}

export async function meetsFrom(db: Queryable, teamId: number, athleteId: number, fromDate: string) {
  return meetsOn(db, teamId, athleteId, fromDate);
}

/** The date of the athlete's next meet on or after `fromDate`, if any. */
export async function findNextMeet(db: Queryable, teamId: number, athleteId: number, fromDate: string) {
  const [row] = await meetsOn(db, teamId, athleteId, fromDate).limit(1);
  return row ?? null;
}
