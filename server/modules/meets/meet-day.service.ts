// Meet day: the live state of every entered athlete, marks (idempotent by key, one result per attempt,
// checked against the federation's attempt rules), the weigh-in against the class limit, the usual jumps,
// and writing the results into the athletes' histories once the meet is over.
import type { Sex } from '../../../shared/calc';
import type { z } from 'zod';
import {
  ACCOMMODATION_EQUIPMENT,
  DEFAULT_JUMPS,
  type AttemptJumps,
  type DayAttempt,
  type DayEntry,
  type MarkResult,
  type MeetDay,
  type jumpsBody,
  type markBody,
  type weighInBody,
} from '../../../shared/schemas';
import {
  MEET_LIFTS,
  ageGroup,
  attemptProblem,
  bestGood,
  classLimitKg,
  weightClass,
  type MeetLift,
} from '../../../shared/calc';
import { LIFT_NAME } from '../../../shared/labels';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { isDuplicateKey } from '../../db/errors';
import { inTransaction } from '../../db/transaction';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { todayIso } from '../athletes/athletes.service';
import { addCompetitionResults, type CompetitionResult } from '../top-sets/top-sets.service';
import * as meetsRepo from './meets.repository';
import * as repo from './meet-day.repository';
import { checkWeightClass } from './meets.service';

/** The lift's full name inside a sentence ("the second bench press"). */
const liftWord = (lift: MeetLift) => LIFT_NAME[lift].toLowerCase();
const ORDINAL = ['', 'first', 'second', 'third'] as const;

function attemptDto(r: repo.AttemptRow): DayAttempt {
  return {
    id: r.id,
    attemptNo: r.attemptNo,
    weightKg: Number(r.weightKg),
    record: r.record,
    result: r.result,
    version: r.version,
  };
}

async function mustFindMeet(db: Queryable, teamId: number, id: number) {
  const meet = await meetsRepo.findMeet(db, teamId, id);
  if (!meet) throw new NotFoundError('That meet');
  return meet;
}

async function mustFindEntry(db: Queryable, teamId: number, meetId: number, entryId: number) {
  const meet = await mustFindMeet(db, teamId, meetId);
  const entry = await repo.findDayEntry(db, teamId, meetId, entryId);
  if (!entry) throw new NotFoundError('That entry');
  return { meet, entry };
}

export async function getMeetDay(ctx: AppContext, teamId: number, meetId: number): Promise<MeetDay> {
  const db = ctx.database.db;
  const meet = await mustFindMeet(db, teamId, meetId);
  const [entries, attempts] = await Promise.all([
    repo.dayEntries(db, teamId, meetId),
    repo.attemptsOfMeet(db, teamId, meetId),
  ]);
  const jumps = new Map(
    (
      await repo.jumpsOf(
        db,
        teamId,
        entries.map((e) => e.athleteId),
      )
    ).map((j) => [j.athleteId, j]),
  );
  const meetYear = Number(meet.date.slice(0, 4));
  const group = (birthYear: number | null) => {
    if (birthYear === null) return null;
    try {
      return ageGroup(birthYear, meetYear);
    } catch {
      return null; // too young to compete: shown without an age group
    }
  };
  const dto = (e: (typeof entries)[number]): DayEntry => {
    const mine = attempts.filter((a) => a.entryId === e.entryId);
    const byLift = (lift: MeetLift) => mine.filter((a) => a.lift === lift).map(attemptDto);
    const saved = jumps.get(e.athleteId);
    return {
      entryId: e.entryId,
      athlete: { id: e.athleteId, name: e.name, sex: e.sex, birthYear: e.birthYear },
      ageGroup: group(e.birthYear),
      division: e.division,
      weightClass: e.weightClass,
      weighInKg: e.weighInKg === null ? null : Number(e.weighInKg),
      flight: e.flight,
      lot: e.lot,
      plan: e.plan,
      jumps: saved ? (saved.jumps as AttemptJumps) : DEFAULT_JUMPS,
      jumpsVersion: saved ? saved.version : null,
      attempts: { squat: byLift('squat'), bench: byLift('bench'), deadlift: byLift('deadlift') },
      version: e.version,
    };
  };
  return {
    meet: {
      id: meet.id,
      name: meet.name,
      date: meet.date,
      equipment: meet.equipment,
      resultsSavedAt: meet.resultsSavedAt ? meet.resultsSavedAt.toISOString() : null,
    },
    entries: entries.map(dto),
  };
}

function markResult(row: repo.AttemptRow, replay: boolean): MarkResult {
  return { replay, attempt: { ...attemptDto(row), entryId: row.entryId, lift: row.lift } };
}

function sameMark(row: repo.AttemptRow, body: z.output<typeof markBody>) {
  return row.entryId === body.entryId && row.lift === body.lift && row.attemptNo === body.attemptNo;
}

function alreadyMarked(row: repo.AttemptRow, name = 'another coach') {
  const what = `${ORDINAL[row.attemptNo]} ${liftWord(row.lift)}`;
  return new ConflictError(
    `The ${what} attempt was already marked ${row.result} at ${Number(row.weightKg)} kg by ${name}. It counts once; check the board before marking again.`,
    markResult(row, false).attempt,
  );
}

/**
 * One mark: the attempt's weight and whether it was good. A key seen before returns the stored result
 * (nothing new written); a second mark of the same attempt with another key answers 409 with the one
 * that counts. The attempt before must be marked, and the weight must follow the rules from it.
 */
export async function mark(
  ctx: AppContext,
  who: { teamId: number; userId: number },
  meetId: number,
  body: z.output<typeof markBody>,
): Promise<MarkResult> {
  const { teamId } = who;
  const db = ctx.database.db;
  const replayOf = async () => {
    const seen = await repo.attemptByKey(db, teamId, body.key);
    if (!seen) return null;
    if (seen.meetId !== meetId || !sameMark(seen, body)) {
      throw new ConflictError('This mark key was already used for another attempt. Reload the meet and mark again.');
    }
    return markResult(seen, true);
  };
  const earlier = await replayOf();
  if (earlier) return earlier;
  try {
    return await inTransaction(db, async (tx) => {
      const meet = await repo.findMeetForUpdate(tx, teamId, meetId);
      if (!meet) throw new NotFoundError('That meet');
      const entry = await repo.findDayEntry(tx, teamId, meetId, body.entryId, true);
      if (!entry) throw new NotFoundError('That entry');
      if (meet.resultsSavedAt) {
        throw new ConflictError('The results of this meet are already in the athletes’ histories; marks are closed.');
      }
      const done = await repo.liftAttemptsForUpdate(tx, teamId, entry.id, body.lift);
      const taken = done.find((a) => a.attemptNo === body.attemptNo);
      if (taken) throw alreadyMarked(taken);
      if (body.attemptNo > done.length + 1) {
        throw new ValidationError(`Mark the ${ORDINAL[done.length + 1]} ${liftWord(body.lift)} attempt first.`, {
          attemptNo: [`The ${ORDINAL[done.length + 1]} attempt is not marked yet`],
        });
      }
      const prev = done[done.length - 1];
      const problem = attemptProblem(
        body.weightKg,
        prev ? { kg: Number(prev.weightKg), good: prev.result === 'good' } : null,
        { record: body.record },
      );
      if (problem) throw new ValidationError(problem, { weightKg: [problem] });
      const id = await repo.insertAttempt(tx, {
        teamId,
        meetId,
        entryId: entry.id,
        lift: body.lift,
        attemptNo: body.attemptNo,
        weightKg: body.weightKg,
        record: body.record,
        result: body.result,
        idempotencyKey: body.key,
        markedBy: who.userId,
      });
      const row = (await repo.findAttempt(tx, teamId, meetId, id))!;
      return markResult(row, false);
    });
  } catch (err) {
    if (!isDuplicateKey(err)) throw err;
    // Two marks raced: the same key (a resend) returns the stored one; another key lost the attempt.
    const replay = await replayOf();
    if (replay) return replay;
    const winner = (await repo.attemptsOfMeet(db, teamId, meetId)).find((a) => sameMark(a, body));
    if (winner) throw alreadyMarked(winner);
    throw err;
  }
}

/** Takes back the latest mark of a lift (a mis-tap), naming the version read. */
export async function undoMark(
  ctx: AppContext,
  teamId: number,
  meetId: number,
  attemptId: number,
  version: number,
): Promise<void> {
  const db = ctx.database.db;
  await inTransaction(db, async (tx) => {
    const meet = await repo.findMeetForUpdate(tx, teamId, meetId);
    if (!meet) throw new NotFoundError('That meet');
    const row = await repo.findAttempt(tx, teamId, meetId, attemptId);
    if (!row) throw new NotFoundError('That attempt');
    if (meet.resultsSavedAt) {
      throw new ConflictError('The results of this meet are already in the athletes’ histories; marks are closed.');
    }
    const done = await repo.liftAttemptsForUpdate(tx, teamId, row.entryId, row.lift);
    if (done[done.length - 1]!.id !== row.id) {
      throw new ConflictError('Only the latest attempt of a lift can be taken back: take back the later one first.');
    }
    if (row.version !== version || !(await repo.deleteAttempt(tx, teamId, row.id, version))) {
      throw new ConflictError('Someone else changed this attempt since you loaded it.', attemptDto(row));
    }
  });
}

function classProblem(bodyweightKg: number, label: string, sex: Sex, division: DayEntry['division']) {
  const limit = classLimitKg(label);
  if (limit !== null && bodyweightKg > limit) {
    return `Over the ${label} kg class limit: ${bodyweightKg} kg at the weigh-in. A lifter must weigh at most the class limit; enter the ${weightClass(bodyweightKg, sex, { division })} kg class or weigh in again.`;
  }
  const fits = weightClass(bodyweightKg, sex, { division });
  if (fits !== label) {
    return `${bodyweightKg} kg falls in the ${fits} kg class, not ${label}: a lifter competes in the class their weigh-in bodyweight falls in.`;
  }
  return null;
}

export async function weighIn(
  ctx: AppContext,
  teamId: number,
  meetId: number,
  entryId: number,
  body: z.output<typeof weighInBody>,
): Promise<MeetDay> {
  const db = ctx.database.db;
  const { meet, entry } = await mustFindEntry(db, teamId, meetId, entryId);
  if (meet.resultsSavedAt) {
    throw new ConflictError('The results of this meet are already in the athletes’ histories; the weigh-in is closed.');
  }
  if (entry.version !== body.version) {
    throw new ConflictError('Someone else changed this entry since you opened it. Their version is shown.');
  }
  const label =
    body.weightClass ?? entry.weightClass ?? weightClass(body.bodyweightKg, entry.sex, { division: entry.division });
  checkWeightClass(label, entry.sex, entry.division);
  const problem = classProblem(body.bodyweightKg, label, entry.sex, entry.division);
  if (problem) throw new ValidationError(problem, { bodyweightKg: [problem] });
  const ok = await repo.updateWeighIn(db, teamId, entryId, body.version, {
    weighInKg: body.bodyweightKg,
    weightClass: label,
    ...(body.flight ? { flight: body.flight } : {}),
    ...(body.lot !== undefined ? { lot: body.lot } : {}),
  });
  if (!ok) throw new ConflictError('Someone else changed this entry since you opened it. Their version is shown.');
  return getMeetDay(ctx, teamId, meetId);
}

export async function saveJumps(
  ctx: AppContext,
  teamId: number,
  meetId: number,
  entryId: number,
  body: z.output<typeof jumpsBody>,
): Promise<MeetDay> {
  const db = ctx.database.db;
  const { entry } = await mustFindEntry(db, teamId, meetId, entryId);
  const stale = 'Someone else changed these jumps since you opened them. Their version is shown.';
  if (body.version === null || body.version === undefined) {
    try {
      await repo.insertJumps(db, teamId, entry.athleteId, body.jumps);
    } catch (err) {
      if (isDuplicateKey(err)) throw new ConflictError(stale);
      throw err;
    }
  } else if (!(await repo.updateJumps(db, teamId, entry.athleteId, body.version, body.jumps))) {
    throw new ConflictError(stale);
  }
  return getMeetDay(ctx, teamId, meetId);
}

/**
 * Writes each athlete's best good lift per competition lift into their history as a single on the team's
 * straight-bar competition variant, once; the meet must have taken place.
 */
export async function saveResults(
  ctx: AppContext,
  who: { teamId: number; userId: number },
  meetId: number,
): Promise<{ saved: number; meet: MeetDay }> {
  const { teamId } = who;
  const db = ctx.database.db;
  const saved = await inTransaction(db, async (tx) => {
    const meet = await repo.findMeetForUpdate(tx, teamId, meetId);
    if (!meet) throw new NotFoundError('That meet');
    if (meet.resultsSavedAt)
      throw new ConflictError('The results of this meet are already in the athletes’ histories.');
    if (meet.date > todayIso()) {
      throw new ValidationError('The meet has not taken place yet.', {
        meet: ['Save results on or after the meet day'],
      });
    }
    const [entries, attempts, comp] = await Promise.all([
      repo.dayEntries(tx, teamId, meetId),
      repo.attemptsOfMeet(tx, teamId, meetId),
      repo.competitionVariants(tx, teamId),
    ]);
    const straight = comp.filter((v) => !v.equipment.some((e) => ACCOMMODATION_EQUIPMENT.includes(e)));
    const results: CompetitionResult[] = [];
    const missing = new Set<MeetLift>();
    for (const e of entries) {
      for (const lift of MEET_LIFTS) {
        const judged = attempts
          .filter((a) => a.entryId === e.entryId && a.lift === lift)
          .map((a) => ({ kg: Number(a.weightKg), good: a.result === 'good' }));
        const best = bestGood(judged);
        if (best === null) continue;
        const variant = straight.find((v) => v.lift === lift);
        if (!variant) {
          missing.add(lift);
          continue;
        }
        results.push({
          athleteId: e.athleteId,
          variantId: variant.id,
          weightKg: best,
          performedOn: meet.date,
          note: `Best ${liftWord(lift)} at ${meet.name}`,
        });
      }
    }
    if (missing.size) {
      const lifts = [...missing].map((l) => liftWord(l)).join(', ');
      throw new ValidationError(`Add a straight-bar competition variant (specificity 1) for: ${lifts}.`, {
        meet: [`The library has no competition variant for ${lifts}`],
      });
    }
    if (results.length === 0) {
      throw new ValidationError('No good attempt is marked yet: nothing to save.', { meet: ['Mark attempts first'] });
    }
    await addCompetitionResults(tx, teamId, who.userId, results);
    await repo.markResultsSaved(tx, teamId, meetId);
    return results.length;
  });
  return { saved, meet: await getMeetDay(ctx, teamId, meetId) };
}
