// Logging top sets against this week's plan entries, with the e1RM worked out here and records marked.
import { inTransaction } from '../../db/transaction';
import { toKg } from '../../../shared/calc';
import { mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import type { LogTopSetInput, LoggedTopSet, TopSet } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { NotFoundError, ValidationError } from '../../lib/errors';
import { noticeTopSet } from '../notices/notices.service';
import { compareWithRecord, recordOf, topSetE1rmKg } from './records';
import { findAthleteEntry, findTopSet, insertTopSet, variantTopSets } from './top-sets.repository';
import { isoDay } from '../../lib/days';

const DAY_MS = 86_400_000;

/** Today when it falls in the entry's week, else the last day of that week (a set logged late). */
export function performedOnFor(week: string, today: Date): string {
  const monday = mondayOf(week).getTime();
  const sunday = monday + 6 * DAY_MS;
  const t = Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate());
  return isoDay(new Date(Math.min(Math.max(t, monday), sunday)));
}

export async function logTopSet(
  ctx: Pick<AppContext, 'database'>,
  who: { teamId: number; athleteId: number; userId: number },
  body: LogTopSetInput,
  today = new Date(),
): Promise<LoggedTopSet> {
  const { teamId, athleteId } = who;
  const entry = await findAthleteEntry(ctx.database.db, teamId, athleteId, body.planEntryId);
  if (!entry) throw new NotFoundError('That plan entry');
  if (!entry.variantId) {
    throw new ValidationError('Some fields need attention.', { planEntryId: ['No variant is planned in that slot'] });
  }
  if (entry.week > weekOfDate(today)) {
    throw new ValidationError('Some fields need attention.', { planEntryId: ['That week has not started yet'] });
  }
  const weightKg = Math.round(toKg(body.weight, body.unit) * 100) / 100;
  const e1rmKg = topSetE1rmKg(weightKg, body.reps, body.rpe ?? null);
  const variantId = entry.variantId;
  return inTransaction(ctx.database.db, async (tx) => {
    const id = await insertTopSet(tx, {
      teamId,
      athleteId,
      planEntryId: entry.id,
      variantId,
      week: entry.week,
      performedOn: performedOnFor(entry.week, today),
      weightKg,
      reps: body.reps,
      rpe: body.rpe ?? null,
      e1rmKg,
      note: body.note ? body.note : null,
      createdBy: who.userId,
    });
    const earlier = recordOf(await variantTopSets(tx, teamId, athleteId, variantId, { excludeId: id }));
    const topSet = (await findTopSet(tx, teamId, athleteId, id))!;
    await noticeTopSet(tx, {
      teamId,
      athleteId,
      week: entry.week,
      topSetId: id,
      variantName: topSet.variantName,
      e1rmKg: topSet.e1rmKg,
      bestE1rmKg: earlier.bestE1rm?.e1rmKg ?? null,
    });
    return { topSet, ...compareWithRecord(topSet, earlier), previousBest: earlier.bestE1rm };
  });
}

/** Last time on a variant before `week`, and its records over every set (this week's included). */
export async function variantSummary(
  db: Queryable,
  teamId: number,
  athleteId: number,
  variantId: number,
  week: string,
) {
  const sets: TopSet[] = await variantTopSets(db, teamId, athleteId, variantId);
  return { lastTime: sets.find((s) => s.week < week) ?? null, record: recordOf(sets) };
}

/** A judged meet lift written into an athlete's history as a single on the competition variant. */
export interface CompetitionResult {
  athleteId: number;
  variantId: number;
  weightKg: number;
  performedOn: string;
  note: string;
}

/** Writes meet results as top sets (one rep, e1RM = the weight) inside the caller's transaction. */
export async function addCompetitionResults(
  tx: Queryable,
  teamId: number,
  userId: number,
  results: readonly CompetitionResult[],
): Promise<number[]> {
  const ids: number[] = [];
  for (const r of results) {
    ids.push(
      await insertTopSet(tx, {
        teamId,
        athleteId: r.athleteId,
        planEntryId: null,
        variantId: r.variantId,
        week: weekOfDate(new Date(`${r.performedOn}T12:00:00Z`)),
        performedOn: r.performedOn,
        weightKg: r.weightKg,
        reps: 1,
        rpe: null,
        e1rmKg: topSetE1rmKg(r.weightKg, 1),
        note: r.note,
        createdBy: userId,
      }),
    );
  }
  return ids;
}

// Offered to My week and videos: records and the top-set rows they read or link, through this service.
export { recordOf } from './records';
export { findTopSet, setTopSetVideo, topSetsAroundWeek, topSetsByVideo } from './top-sets.repository';
