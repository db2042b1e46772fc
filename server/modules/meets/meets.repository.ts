// SQL for meets and who is entered in them, and the recent top sets attempt plans start from.
import { and, asc, desc, eq, gte, inArray, like, lt, sql, type SQL } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, meetEntries, meets, topSets, variants } from '../../db/schema';
import { readSort } from '../../../shared/schemas';
import type { meetSortKeys } from '../../../shared/schemas/meets';
import { containsPattern } from '../../db/patterns';

export type MeetRow = typeof meets.$inferSelect;
export type MeetValues = Partial<
  Omit<typeof meets.$inferInsert, 'id' | 'teamId' | 'version' | 'createdAt' | 'updatedAt'>
>;
export type EntryValues = Partial<Pick<typeof meetEntries.$inferInsert, 'weightClass' | 'division' | 'attempts'>>;

export async function listMeets(
  db: Queryable,
  teamId: number,
  f: {
    when: 'upcoming' | 'past' | 'all';
    q?: string | undefined;
    sort: string;
    limit: number;
    offset: number;
  },
  today: string,
) {
  const where: (SQL | undefined)[] = [eq(meets.teamId, teamId)];
  if (f.when === 'upcoming') where.push(gte(meets.date, today));
  if (f.when === 'past') where.push(lt(meets.date, today));
  if (f.q) where.push(like(meets.name, containsPattern(f.q)));
  const cond = and(...where);
  const { key, desc: down } = readSort(f.sort as (typeof meetSortKeys)[number]);
  const col = key === 'name' ? meets.name : meets.date;
  const [rows, [count]] = await Promise.all([
    db
      .select()
      .from(meets)
      .where(cond)
      .orderBy(down ? desc(col) : asc(col), asc(meets.id))
      .limit(f.limit)
      .offset(f.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(meets)
      .where(cond),
  ]);
  return { rows, total: Number(count?.n ?? 0) };
}

export async function findMeet(db: Queryable, teamId: number, id: number): Promise<MeetRow | null> {
  const [row] = await db
    .select()
    .from(meets)
    .where(and(eq(meets.teamId, teamId), eq(meets.id, id)))
    .limit(1);
  return row ?? null;
}

export async function insertMeet(db: Queryable, teamId: number, values: Omit<typeof meets.$inferInsert, 'teamId'>) {
  const [res] = await db
    .insert(meets)
    .values({ ...values, teamId })
    .$returningId();
  return res!.id;
}

export async function updateMeet(db: Queryable, teamId: number, id: number, version: number, values: MeetValues) {
  const [res] = await db
    .update(meets)
    .set({ ...values, version: sql`${meets.version} + 1` })
    .where(and(eq(meets.teamId, teamId), eq(meets.id, id), eq(meets.version, version)));
  return res.affectedRows > 0;
}

export async function deleteMeet(db: Queryable, teamId: number, id: number) {
  const [res] = await db.delete(meets).where(and(eq(meets.teamId, teamId), eq(meets.id, id)));
  return res.affectedRows > 0;
}

export async function entriesOf(db: Queryable, teamId: number, meetIds: number[]) {
  if (meetIds.length === 0) return [];
  return db
    .select({
      id: meetEntries.id,
      meetId: meetEntries.meetId,
      athleteId: meetEntries.athleteId,
      athleteName: athletes.name,
      athleteSex: athletes.sex,
      athleteDivision: athletes.division,
      weightClass: meetEntries.weightClass,
      division: meetEntries.division,
      attempts: meetEntries.attempts,
      version: meetEntries.version,
    })
    .from(meetEntries)
    .innerJoin(athletes, eq(athletes.id, meetEntries.athleteId))
    .where(and(eq(meetEntries.teamId, teamId), inArray(meetEntries.meetId, meetIds)))
    .orderBy(asc(athletes.name), asc(meetEntries.id));
}

export async function findEntry(db: Queryable, teamId: number, meetId: number, entryId: number) {
  const [row] = await db
    .select()
    .from(meetEntries)
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.meetId, meetId), eq(meetEntries.id, entryId)))
    .limit(1);
  return row ?? null;
}

export async function findEntryOf(db: Queryable, teamId: number, meetId: number, athleteId: number) {
  const [row] = await db
    .select({ id: meetEntries.id })
    .from(meetEntries)
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.meetId, meetId), eq(meetEntries.athleteId, athleteId)))
    .limit(1);
  return row ?? null;
}

export async function insertEntry(db: Queryable, values: typeof meetEntries.$inferInsert) {
  const [res] = await db.insert(meetEntries).values(values).$returningId();
  return res!.id;
}

export async function updateEntry(db: Queryable, teamId: number, id: number, version: number, values: EntryValues) {
  const [res] = await db
    .update(meetEntries)
    .set({ ...values, version: sql`${meetEntries.version} + 1` })
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.id, id), eq(meetEntries.version, version)));
  return res.affectedRows > 0;
}

export async function deleteEntry(db: Queryable, teamId: number, meetId: number, id: number) {
  const [res] = await db
    .delete(meetEntries)
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.meetId, meetId), eq(meetEntries.id, id)));
  return res.affectedRows > 0;
}

/** Top sets on variants close to a competition lift since a date: where attempt plans start from. */
export async function recentCompetitionSets(
  db: Queryable,
  teamId: number,
  athleteIds: number[],
  since: string,
  minSpecificity: number,
) {
  if (athleteIds.length === 0) return [];
  return db
    .select({
      athleteId: topSets.athleteId,
      lift: variants.lift,
      variantName: variants.name,
      specificity: variants.specificity,
      equipment: variants.equipment,
      weightKg: topSets.weightKg,
      reps: topSets.reps,
      rpe: topSets.rpe,
      performedOn: topSets.performedOn,
    })
    .from(topSets)
    .innerJoin(variants, and(eq(variants.id, topSets.variantId), eq(variants.teamId, teamId)))
    .where(
      and(
        eq(topSets.teamId, teamId),
        inArray(topSets.athleteId, athleteIds),
        gte(topSets.performedOn, since),
        gte(variants.specificity, minSpecificity),
      ),
    );
}
