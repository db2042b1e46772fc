// The training week of one athlete: the team's sessions resolved for a week with the coach's speed and
// accessory work, the training maxes behind the speed loads, the deload mark (kept in step with the
// max-effort rest week) and what the athlete logged of each session.
import {
  DEFAULT_TRAINING_MAX_PCT,
  openingRange,
  speedWave,
  trainingMax,
  type OpeningRange,
} from '../../../shared/calc';
import { LIFTS, type Lift } from '../../../shared/engine/types';
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import { deloaded, sessionWorkFor } from '../../../shared/engine/week';
import {
  CURRENT_MAX_WEEKS,
  FRESH_MAX_WEEKS,
  pickCurrentMax,
  type AthleteWeek,
  type LiftMax,
  type Session,
  type SessionLog,
  type SessionWork,
  type TeamRules,
  type WeekSession,
  type MyWeekSession,
} from '../../../shared/schemas';
import type { z } from 'zod';
import type { athleteWeekBody, sessionLogBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { isDuplicateKey } from '../../db/errors';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { AuthContext } from '../../middleware/auth';
import { inTransaction } from '../../db/transaction';
import { markRestWeek, unmarkRestWeek } from '../athletes/athletes.service';
import { publishChange } from '../events/events.service';
import { closeLiftSetsOf } from '../meets/meets.service';
import { readRulesOfTeam } from '../tissue/tissue.service';
import { withLibraryAccessories } from './accessory-rotation.service';
import * as repo from './week.repository';
import { isoDay } from '../../lib/days';

type WeekRow = Awaited<ReturnType<typeof repo.findAthleteWeek>>;
type LogRow = Awaited<ReturnType<typeof repo.sessionLogsOf>>[number];
type CloseSet = Awaited<ReturnType<typeof closeLiftSetsOf>>[number];

/** The date `since` which top sets count toward a training max, for a week. */
export function maxesSince(week: string): string {
  return isoDay(mondayOf(addWeeks(week, -CURRENT_MAX_WEEKS)));
}

/** Each competition lift's current estimate (RPE-aware) and the training max the week's share makes of it. */
export function liftMaxes(sets: readonly CloseSet[], week: string, pct: number): Record<Lift, LiftMax | null> {
  const freshSince = isoDay(mondayOf(addWeeks(week, -FRESH_MAX_WEEKS)));
  const out = {} as Record<Lift, LiftMax | null>;
  for (const lift of LIFTS) {
    const current = pickCurrentMax(
      sets.filter((s) => s.lift === lift),
      freshSince,
    );
    out[lift] = current ? { e1rmKg: current.e1rmKg, trainingMaxKg: trainingMax(current.e1rmKg, pct) } : null;
  }
  return out;
}

/** The week's sessions in the order of the week, with the work resolved and a deload applied. */
export function resolveSessions(
  sessions: readonly Session[],
  week: string,
  stored: Record<string, SessionWork>,
  deload: boolean,
  maxes: Record<Lift, LiftMax | null>,
): { work: Record<string, SessionWork>; sessions: WeekSession[] } {
  const monday = mondayOf(week).getTime();
  const work: Record<string, SessionWork> = {};
  const resolved = [...sessions]
    .sort((a, b) => a.weekday - b.weekday)
    .map((s): WeekSession => {
      const own = sessionWorkFor(s, week, stored[s.id]);
      work[s.id] = own;
      const w = deload ? deloaded(own) : own;
      let speed: WeekSession['speed'] = null;
      if (w.speed && s.speedLift) {
        const max = maxes[s.speedLift];
        const load = max
          ? speedWave(max.trainingMaxKg, {
              weeks: 1,
              lift: s.speedLift,
              startPct: w.speed.pct,
              sets: w.speed.sets,
              reps: w.speed.reps,
              accommodation: w.speed.accommodation,
            })[0]!
          : null;
        speed = {
          ...w.speed,
          lift: s.speedLift,
          barKg: load?.barKg ?? null,
          accommodationKg: load?.accommodationKg ?? 0,
        };
      }
      return { ...s, date: isoDay(new Date(monday + (s.weekday - 1) * 86_400_000)), speed, accessories: w.accessories };
    });
  return { work, sessions: resolved };
}

export function athleteWeekOf(
  rules: TeamRules,
  athleteId: number,
  week: string,
  row: WeekRow,
  sets: readonly CloseSet[],
  logs: readonly LogRow[] = [],
): AthleteWeek {
  const pct = row?.trainingMaxPct ?? DEFAULT_TRAINING_MAX_PCT;
  const deload = row?.deload ?? false;
  const maxes = liftMaxes(sets, week, pct);
  const { work, sessions } = resolveSessions(rules.sessions, week, row?.work ?? {}, deload, maxes);
  return {
    athleteId,
    week,
    deload,
    trainingMaxPct: pct,
    maxes,
    work,
    sessions,
    logs: sessions.flatMap((s) => logs.filter((l) => l.sessionId === s.id).map(toSessionLog)),
    version: row?.version ?? 0,
    updatedAt: row ? row.updatedAt.toISOString() : null,
  };
}

async function mustFindAthlete(db: Queryable, teamId: number, athleteId: number) {
  if (!(await repo.athleteInTeam(db, teamId, athleteId))) throw new NotFoundError('That athlete');
}

export async function getAthleteWeek(
  ctx: Pick<AppContext, 'database'>,
  teamId: number,
  athleteId: number,
  week: string,
) {
  const db = ctx.database.db;
  await mustFindAthlete(db, teamId, athleteId);
  const [rules, row, sets, logs] = await Promise.all([
    readRulesOfTeam(db, teamId),
    repo.findAthleteWeek(db, teamId, athleteId, week),
    closeLiftSetsOf(db, teamId, athleteId, maxesSince(week)),
    repo.sessionLogsOf(db, teamId, athleteId, week),
  ]);
  return athleteWeekOf(rules, athleteId, week, row, sets, logs);
}

/** Work for a session it has no part for, or for a session the rules do not have, is refused by field. */
function checkWork(sessions: readonly Session[], work: Record<string, SessionWork>) {
  const fields: Record<string, string[]> = {};
  for (const [id, w] of Object.entries(work)) {
    const s = sessions.find((x) => x.id === id);
    if (!s) fields[`sessions.${id}`] = ['No such session in the team’s rules'];
    else if (w.speed && !s.parts.includes('speed')) fields[`sessions.${id}.speed`] = ['This session has no speed part'];
    else if (w.accessories.length > 0 && !s.parts.includes('accessories'))
      fields[`sessions.${id}.accessories`] = ['This session has no accessories part'];
  }
  if (Object.keys(fields).length > 0) throw new ValidationError('Some fields need attention.', fields);
}

const STALE = 'Someone else saved this week since you opened it. Their version is shown; apply your change again.';

export async function putAthleteWeek(
  ctx: AppContext,
  auth: AuthContext,
  athleteId: number,
  week: string,
  body: z.output<typeof athleteWeekBody>,
): Promise<AthleteWeek> {
  const db = ctx.database.db;
  const teamId = auth.teamId;
  await mustFindAthlete(db, teamId, athleteId);
  const rules = await readRulesOfTeam(db, teamId);
  checkWork(rules.sessions, body.sessions);
  const before = await repo.findAthleteWeek(db, teamId, athleteId, week);
  const work = await withLibraryAccessories(db, teamId, body.sessions, before?.work ?? {});
  const deloadChanged = (before?.deload ?? false) !== body.deload;
  if (deloadChanged && week < weekOfDate(new Date())) {
    throw new ValidationError('Some fields need attention.', { deload: ['Past weeks are history'] });
  }
  const key = { teamId, athleteId, week };
  const values = {
    deload: body.deload,
    trainingMaxPct: body.trainingMaxPct,
    work,
    updatedBy: auth.userId,
  };
  // The week, its rest-week mark and the live event are one write: all of it lands or none.
  const ok = await inTransaction(db, async (tx) => {
    if (body.version === 0) {
      try {
        await repo.insertAthleteWeek(tx, key, values);
      } catch (err) {
        if (!isDuplicateKey(err)) throw err;
        return false;
      }
    } else if (!(await repo.updateAthleteWeek(tx, key, body.version, values))) {
      return false;
    }
    // A deload week is a rest week for max effort: the rest-week mark follows (both are safe to repeat).
    if (deloadChanged) {
      if (body.deload) await markRestWeek(ctx, auth, athleteId, week, tx);
      else
        await unmarkRestWeek(ctx, teamId, athleteId, week, tx).catch((err: unknown) => {
          if (!(err instanceof NotFoundError)) throw err;
        });
    }
    await publishChange(tx, { teamId, athleteId, topic: 'plan', weeks: [week] });
    return true;
  });
  if (!ok) throw new ConflictError(STALE, await getAthleteWeek(ctx, teamId, athleteId, week));
  return getAthleteWeek(ctx, teamId, athleteId, week);
}

export function toSessionLog(row: LogRow): SessionLog {
  return {
    sessionId: row.sessionId,
    speedSetsDone: row.speedSetsDone,
    accessorySetsDone: row.accessorySetsDone,
    backOffDone: row.backOffDone,
    done: row.done,
    version: row.version,
  };
}

const STALE_LOG = 'This session was logged from another device since. That log is shown; add yours again.';

/** The athlete logs what they did of one session of a published or past week. */
export async function logSession(
  ctx: AppContext,
  who: { teamId: number; athleteId: number },
  sessionId: string,
  body: z.output<typeof sessionLogBody>,
): Promise<SessionLog> {
  const db = ctx.database.db;
  const rules = await readRulesOfTeam(db, who.teamId);
  const session = rules.sessions.find((s) => s.id === sessionId);
  if (!session) throw new NotFoundError('That session');
  if (body.week > weekOfDate(new Date())) {
    throw new ValidationError('Some fields need attention.', { week: ['That week has not started yet'] });
  }
  if (body.backOffDone?.some(Boolean) && !session.parts.includes('maxEffort')) {
    throw new ValidationError('Some fields need attention.', {
      backOffDone: ['This session has no max-effort part, so no back-off sets'],
    });
  }
  const key = { teamId: who.teamId, athleteId: who.athleteId, week: body.week, sessionId };
  // What the body leaves out stays as stored: the session card and the back-off ticks each send their own.
  const stored = (await repo.sessionLogsOf(db, who.teamId, who.athleteId, body.week)).find(
    (r) => r.sessionId === sessionId,
  );
  const values = {
    speedSetsDone: body.speedSetsDone ?? stored?.speedSetsDone ?? 0,
    accessorySetsDone: body.accessorySetsDone ?? stored?.accessorySetsDone ?? [],
    backOffDone: body.backOffDone ?? stored?.backOffDone ?? [],
    done: body.done ?? stored?.done ?? false,
  };
  let ok: boolean;
  if (body.version === 0) {
    try {
      await repo.insertSessionLog(db, key, values);
      ok = true;
    } catch (err) {
      if (!isDuplicateKey(err)) throw err;
      ok = false;
    }
  } else {
    ok = await repo.updateSessionLog(db, key, body.version, values);
  }
  const rows = await repo.sessionLogsOf(db, who.teamId, who.athleteId, body.week);
  const row = rows.find((r) => r.sessionId === sessionId);
  if (!ok) throw new ConflictError(STALE_LOG, row ? toSessionLog(row) : null);
  return toSessionLog(row!);
}

/** What an athlete's week page needs of the training week, read in one round (three queries side by side). */
export async function weekInputs(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [row, logs, sets] = await Promise.all([
    repo.findAthleteWeek(db, teamId, athleteId, week),
    repo.sessionLogsOf(db, teamId, athleteId, week),
    closeLiftSetsOf(db, teamId, athleteId, maxesSince(week)),
  ]);
  return { row, logs, sets };
}

/** The athlete's sessions of a week with what they logged; none while the week is a draft. */
export function myWeekSessions(
  rules: TeamRules,
  athleteId: number,
  week: string,
  inputs: Awaited<ReturnType<typeof weekInputs>>,
  published: boolean,
): { deload: boolean; sessions: MyWeekSession[] } {
  if (!published) return { deload: false, sessions: [] };
  const plan = athleteWeekOf(rules, athleteId, week, inputs.row, inputs.sets, inputs.logs);
  const sessions = plan.sessions.map((s) => ({ ...s, log: plan.logs.find((l) => l.sessionId === s.id) ?? null }));
  return { deload: plan.deload, sessions };
}

/**
 * A suggested opening range for a variant the athlete has never done: from the current estimate of its
 * competition lift (an estimate, shown as such), or null without one.
 */
export function openingFor(sets: readonly CloseSet[], week: string, lift: Lift, reps: number): OpeningRange | null {
  const max = liftMaxes(sets, week, DEFAULT_TRAINING_MAX_PCT)[lift];
  return max ? openingRange([max.e1rmKg], reps) : null;
}
