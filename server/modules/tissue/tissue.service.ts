// Connective-tissue work per athlete and week: generated once from the team's settings and the
// athlete's past work and check-ins, then stored so the week never changes under the athlete's feet.
import { inTransaction } from '../../db/transaction';
import {
  DEFAULT_TISSUE_RULES,
  jointLoadOf,
  prescribeTissueWork,
  type TissueCheckin,
  type TissueInput,
  type TissueRules,
} from '../../../shared/engine/tissue';
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import { readTeamRules, type TeamRules, type TissueCheckinRow, type TissueWorkWeek } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { NotFoundError, ValidationError } from '../../lib/errors';
import { findTeamAthlete } from '../my-week/athlete.repository';
import {
  deletePrescriptionsAfter,
  findNextMeet,
  findPrescription,
  findTeamRulesRow,
  insertCheckin,
  insertPrescriptionIfAbsent,
  listCheckins,
  listPrescriptionsBefore,
} from './tissue.repository';
import { weekPicks } from '../my-week/my-week.repository';

type DbOrCtx = Queryable | Pick<AppContext, 'database'>;

/** How far ahead a prescription is stored (next week's goes out in the weekly e-mail). */
export const STORE_AHEAD_WEEKS = 1;

function dbOf(source: DbOrCtx): Queryable {
  return 'database' in source ? source.database.db : source;
}

function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/** The tissue module's rules: its defaults with the settings the team edits on top. */
export function tissueRulesOf(team: TeamRules): {
  rules: TissueRules;
  focusJoints: TeamRules['tissue']['focusJoints'];
} {
  const { focusJoints, ...settings } = team.tissue;
  return { rules: { ...DEFAULT_TISSUE_RULES, ...settings }, focusJoints };
}

export async function readRulesOfTeam(db: Queryable, teamId: number): Promise<TeamRules> {
  return readTeamRules((await findTeamRulesRow(db, teamId))?.rules);
}

function toEngineCheckins(rows: Awaited<ReturnType<typeof listCheckins>>): TissueCheckin[] {
  return rows.map((c) => ({ week: c.week, kind: c.kind, soreness: c.soreness, painJoints: c.painJoints }));
}

/** Everything prescribeTissueWork needs for one athlete and week, read from the database. */
export async function tissueInput(
  db: Queryable,
  teamId: number,
  athleteId: number,
  week: string,
): Promise<TissueInput> {
  const [team, history, checkins, meet, picks] = await Promise.all([
    readRulesOfTeam(db, teamId),
    listPrescriptionsBefore(db, teamId, athleteId, week),
    listCheckins(db, teamId, athleteId),
    findNextMeet(db, teamId, athleteId, isoDay(mondayOf(week))),
    weekPicks(db, teamId, athleteId, week),
  ]);
  const { rules, focusJoints } = tissueRulesOf(team);
  return {
    week,
    ...(meet ? { meetWeek: weekOfDate(new Date(`${meet.date}T00:00:00Z`)) } : {}),
    rules,
    history: history.flatMap((h) => h.items),
    checkins: toEngineCheckins(checkins),
    focusJoints,
    jointLoad: jointLoadOf(picks.map((p) => p.variant)),
  };
}

/**
 * The athlete's connective-tissue work for `week`: the stored prescription, or a new one generated and
 * stored (one per athlete and week; only this week and next are stored, other weeks are worked out).
 * Notes and coach suggestions are worked out from what is known now.
 * Throws NotFoundError when the athlete is not on that team.
 */
export async function tissueWorkFor(
  source: DbOrCtx,
  teamId: number,
  athleteId: number,
  week: string,
  today = new Date(),
): Promise<TissueWorkWeek> {
  const db = dbOf(source);
  if (!(await findTeamAthlete(db, teamId, athleteId))) throw new NotFoundError('That athlete');
  const input = await tissueInput(db, teamId, athleteId, week);
  const fresh = prescribeTissueWork(input);
  let stored = await findPrescription(db, teamId, athleteId, week);
  // Only this week and next are written: a week already over is shown as it would have been, and one
  // further ahead as it looks now, without fixing either in the athlete's history.
  const current = weekOfDate(today);
  if (!stored && week >= current && week <= addWeeks(current, STORE_AHEAD_WEEKS)) {
    await insertPrescriptionIfAbsent(db, { teamId, athleteId, week, items: fresh.items });
    stored = await findPrescription(db, teamId, athleteId, week);
  }
  const items = stored?.items ?? fresh.items;
  return { week, kind: items[0]?.kind ?? null, items, notes: fresh.notes, suggestions: fresh.suggestions };
}

/**
 * What the coach should know now: suggestions (restrictions to consider) from the check-ins up to and
 * including `week`, worked out as next week's generation would see them. Nothing is stored.
 */
export async function tissueSuggestionsFor(db: Queryable, teamId: number, athleteId: number, week: string) {
  const input = await tissueInput(db, teamId, athleteId, addWeeks(week, 1));
  return prescribeTissueWork(input).suggestions;
}

export function toCheckinRow(r: Awaited<ReturnType<typeof listCheckins>>[number]): TissueCheckinRow {
  return {
    id: r.id,
    week: r.week,
    kind: r.kind,
    soreness: r.soreness,
    painJoints: r.painJoints,
    note: r.note,
    createdAt: r.createdAt.toISOString(),
  };
}

export async function recentCheckins(db: Queryable, teamId: number, athleteId: number, limit = 12) {
  return (await listCheckins(db, teamId, athleteId, { limit })).map(toCheckinRow);
}

/** How many weeks back a check-in may still report on. */
export const CHECKIN_LOOKBACK_WEEKS = 2;

/**
 * Records the next-day check-in on a week's work. Prescriptions already generated for weeks that have
 * not started are dropped, so they are generated again with this check-in in mind.
 */
export async function recordCheckin(
  ctx: Pick<AppContext, 'database'>,
  teamId: number,
  athleteId: number,
  body: { week: string; soreness: number; painJoints: TissueCheckinRow['painJoints']; note?: string | undefined },
  today = new Date(),
): Promise<TissueCheckinRow> {
  const current = weekOfDate(today);
  if (body.week > current)
    throw new ValidationError('Some fields need attention.', { week: ['That week has not come yet'] });
  if (body.week < addWeeks(current, -CHECKIN_LOOKBACK_WEEKS)) {
    throw new ValidationError('Some fields need attention.', {
      week: [`Check-ins reach back at most ${CHECKIN_LOOKBACK_WEEKS} weeks`],
    });
  }
  const work = await tissueWorkFor(ctx, teamId, athleteId, body.week, today);
  if (!work.kind) {
    throw new ValidationError('Some fields need attention.', {
      week: ['There was no connective-tissue work that week to report on'],
    });
  }
  const kind = work.kind;
  return inTransaction(ctx.database.db, async (tx) => {
    const saved = await insertCheckin(tx, {
      teamId,
      athleteId,
      week: body.week,
      kind,
      soreness: body.soreness,
      painJoints: body.painJoints,
      note: body.note ? body.note : null,
    });
    await deletePrescriptionsAfter(tx, teamId, athleteId, current > body.week ? current : body.week);
    return toCheckinRow(saved);
  });
}
