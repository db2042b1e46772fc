// SQL for meet day: the entered athletes with their weigh-in, the judged attempts, the usual jumps,
// and the competition variants results are written to. Every query is scoped to the team.
import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, attemptJumps, meetAttempts, meetEntries, meets, variants } from '../../db/schema';
import type { AttemptJumps } from '../../db/schema/meetday';

export type AttemptRow = typeof meetAttempts.$inferSelect;

export async function findMeetForUpdate(db: Queryable, teamId: number, id: number) {
  const [row] = await db
    .select()
    .from(meets)
    .where(and(eq(meets.teamId, teamId), eq(meets.id, id)))
    .for('update');
  return row ?? null;
}

export async function markResultsSaved(db: Queryable, teamId: number, id: number) {
  await db
    .update(meets)
    .set({ resultsSavedAt: new Date(), version: sql`${meets.version} + 1` })
    .where(and(eq(meets.teamId, teamId), eq(meets.id, id)));
}

export async function dayEntries(db: Queryable, teamId: number, meetId: number) {
  return db
    .select({
      entryId: meetEntries.id,
      athleteId: athletes.id,
      name: athletes.name,
      sex: athletes.sex,
      birthYear: athletes.birthYear,
      division: meetEntries.division,
      weightClass: meetEntries.weightClass,
      weighInKg: meetEntries.weighInKg,
      flight: meetEntries.flight,
      lot: meetEntries.lot,
      plan: meetEntries.attempts,
      version: meetEntries.version,
    })
    .from(meetEntries)
    .innerJoin(athletes, eq(athletes.id, meetEntries.athleteId))
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.meetId, meetId)))
    .orderBy(asc(meetEntries.flight), asc(meetEntries.lot), asc(athletes.name), asc(meetEntries.id));
}

export async function findDayEntry(db: Queryable, teamId: number, meetId: number, entryId: number, lock = false) {
  const q = db
    .select({
      id: meetEntries.id,
      athleteId: meetEntries.athleteId,
      sex: athletes.sex,
      division: meetEntries.division,
      weightClass: meetEntries.weightClass,
      version: meetEntries.version,
    })
    .from(meetEntries)
    .innerJoin(athletes, eq(athletes.id, meetEntries.athleteId))
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.meetId, meetId), eq(meetEntries.id, entryId)));
  const [row] = lock ? await q.for('update') : await q;
  return row ?? null;
}

export async function updateWeighIn(
  db: Queryable,
  teamId: number,
  entryId: number,
  version: number,
  values: { weighInKg: number; weightClass: string; flight?: string; lot?: number | null },
) {
  const [res] = await db
    .update(meetEntries)
    .set({ ...values, version: sql`${meetEntries.version} + 1` })
    .where(and(eq(meetEntries.teamId, teamId), eq(meetEntries.id, entryId), eq(meetEntries.version, version)));
  return res.affectedRows > 0;
}

export async function attemptsOfMeet(db: Queryable, teamId: number, meetId: number) {
  return db
    .select()
    .from(meetAttempts)
    .where(and(eq(meetAttempts.teamId, teamId), eq(meetAttempts.meetId, meetId)))
    .orderBy(asc(meetAttempts.entryId), asc(meetAttempts.lift), asc(meetAttempts.attemptNo));
}

/** The judged attempts of one lift of one entry, held until the transaction ends. */
export async function liftAttemptsForUpdate(db: Queryable, teamId: number, entryId: number, lift: AttemptRow['lift']) {
  return db
    .select()
    .from(meetAttempts)
    .where(and(eq(meetAttempts.teamId, teamId), eq(meetAttempts.entryId, entryId), eq(meetAttempts.lift, lift)))
    .orderBy(asc(meetAttempts.attemptNo))
    .for('update');
}

export async function attemptByKey(db: Queryable, teamId: number, key: string) {
  const [row] = await db
    .select()
    .from(meetAttempts)
    .where(and(eq(meetAttempts.teamId, teamId), eq(meetAttempts.idempotencyKey, key)))
    .limit(1);
  return row ?? null;
}

export async function findAttempt(db: Queryable, teamId: number, meetId: number, id: number) {
  const [row] = await db
    .select()
    .from(meetAttempts)
    .where(and(eq(meetAttempts.teamId, teamId), eq(meetAttempts.meetId, meetId), eq(meetAttempts.id, id)))
    .limit(1);
  return row ?? null;
}

export async function insertAttempt(db: Queryable, row: typeof meetAttempts.$inferInsert) {
  const [res] = await db.insert(meetAttempts).values(row).$returningId();
  return res!.id;
}

export async function deleteAttempt(db: Queryable, teamId: number, id: number, version: number) {
  const [res] = await db
    .delete(meetAttempts)
    .where(and(eq(meetAttempts.teamId, teamId), eq(meetAttempts.id, id), eq(meetAttempts.version, version)));
  return res.affectedRows > 0;
}

export async function jumpsOf(db: Queryable, teamId: number, athleteIds: number[]) {
  if (athleteIds.length === 0) return [];
  return db
    .select()
    .from(attemptJumps)
    .where(and(eq(attemptJumps.teamId, teamId), inArray(attemptJumps.athleteId, athleteIds)));
}

export async function insertJumps(db: Queryable, teamId: number, athleteId: number, jumps: AttemptJumps) {
  await db.insert(attemptJumps).values({ teamId, athleteId, jumps });
}

export async function updateJumps(
  db: Queryable,
  teamId: number,
  athleteId: number,
  version: number,
  jumps: AttemptJumps,
) {
  const [res] = await db
    .update(attemptJumps)
    .set({ jumps, version: sql`${attemptJumps.version} + 1` })
    .where(
      and(eq(attemptJumps.teamId, teamId), eq(attemptJumps.athleteId, athleteId), eq(attemptJumps.version, version)),
    );
  return res.affectedRows > 0;
}

/** The team's straight-bar competition variants (specificity 1), best suited first, for writing results. */
export async function competitionVariants(db: Queryable, teamId: number) {
  return db
    .select({
      id: variants.id,
      lift: variants.lift,
      name: variants.name,
      equipment: variants.equipment,
      scheme: variants.scheme,
    })
    .from(variants)
    .where(and(eq(variants.teamId, teamId), isNull(variants.archivedAt), sql`${variants.specificity} >= 1`))
    .orderBy(desc(sql`${variants.scheme} = 'single'`), desc(variants.risk), asc(variants.id));
}
