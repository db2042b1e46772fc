// Connective-tissue work per athlete and week: generated once from the team's settings and the
// athlete's past work and check-ins, then stored so the week never changes under the athlete's feet.
import { noticePain } from '../notices/notices.service';
import { inTransaction } from '../../db/transaction';
import {
  DEFAULT_TISSUE_RULES,
  jointLoadOf,
  prescribeTissueWork,
  restrictedJoints,
  restrictedNote,
  type TissueCheckin,
  type TissueInput,
  type TissuePrescription,
  type TissueRules,
  type TissueWeek,
} from '../../../shared/engine/tissue';
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import { readTeamRules, type TeamRules, type TissueCheckinRow, type TissueWorkWeek } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { NotFoundError, ValidationError } from '../../lib/errors';
import { engineRestrictionsOf, findTeamAthlete } from '../athletes/athletes.service';
import type { Restriction } from '../../../shared/engine/types';
import {
  deletePrescriptionsAfter,
  findNextMeet,
  findPrescription,
  findTeamRulesText,
  insertCheckin,
  insertPrescriptionIfAbsent,
  listCheckins,
  listPrescriptionsBefore,
} from './tissue.repository';
import { weekPicks } from '../plans/plans.service';
import { isoDay } from '../../lib/days';

type DbOrCtx = Queryable | Pick<AppContext, 'database'>;

/** How far ahead a prescription is stored (next week's goes out in the weekly e-mail). */
export const STORE_AHEAD_WEEKS = 1;

function dbOf(source: DbOrCtx): Queryable {
  return 'database' in source ? source.database.db : source;
}

/** The tissue module's rules: its defaults with the settings the team edits on top. */
export function tissueRulesOf(team: TeamRules): {
  rules: TissueRules;
  focusJoints: TeamRules['tissue']['focusJoints'];
} {
  const { focusJoints, ...settings } = team.tissue;
  // The team sets the reps of high-rep work as its floor; the target is never below it.
  const highRepReps = Math.max(DEFAULT_TISSUE_RULES.highRepReps, settings.highRepMinReps);
  return { rules: { ...DEFAULT_TISSUE_RULES, ...settings, highRepReps }, focusJoints };
}

/**
 * Parsed rules per team, kept with the exact stored text they were parsed from: a request reads the text
 * (one small query, as before) and parses only when it differs, so a saved change shows at once.
 */
const parsedRules = new Map<number, { text: string | null; rules: TeamRules }>();
const PARSED_RULES_MAX = 1_000;

/** The team's rules from their stored text (null: never saved), parsed once per distinct text. */
export function rulesFromText(teamId: number, text: string | null): TeamRules {
  const hit = parsedRules.get(teamId);
  if (hit && hit.text === text) return hit.rules;
  const rules = readTeamRules(text === null ? undefined : (JSON.parse(text) as unknown));
  if (parsedRules.size >= PARSED_RULES_MAX) parsedRules.clear();
  parsedRules.set(teamId, { text, rules });
  return rules;
}

export async function readRulesOfTeam(db: Queryable, teamId: number): Promise<TeamRules> {
  return rulesFromText(teamId, await findTeamRulesText(db, teamId));
}

function toEngineCheckins(rows: Awaited<ReturnType<typeof listCheckins>>): TissueCheckin[] {
  return rows.map((c) => ({ week: c.week, kind: c.kind, soreness: c.soreness, painJoints: c.painJoints }));
}

/** What a week's tissue work is worked out from, as read from the database. */
export interface TissueFacts {
  team: TeamRules;
  /** Stored prescriptions of the weeks before, oldest first. */
  history: { week: string; items: TissuePrescription[] }[];
  checkins: Awaited<ReturnType<typeof listCheckins>>;
  /** The athlete's next meet on or after the Monday of the week. */
  meet: { date: string } | null;
  /** The week's max-effort picks (their joint stress). */
  picks: { variant: { stress: Parameters<typeof jointLoadOf>[0][number]['stress'] } }[];
  /** The athlete's restrictions with their weeks: a joint restricted that week gets no tissue work. */
  restrictions: Restriction[];
}

export function tissueInputFrom(week: string, facts: TissueFacts): TissueInput {
  const { rules, focusJoints } = tissueRulesOf(facts.team);
  return {
    week,
    ...(facts.meet ? { meetWeek: weekOfDate(new Date(`${facts.meet.date}T00:00:00Z`)) } : {}),
    rules,
    history: facts.history.flatMap((h) => h.items),
    checkins: toEngineCheckins(facts.checkins),
    focusJoints,
    jointLoad: jointLoadOf(facts.picks.map((p) => p.variant)),
    restrictions: facts.restrictions,
  };
}

/** Everything prescribeTissueWork needs for one athlete and week, read from the database. */
export async function tissueInput(
  db: Queryable,
  teamId: number,
  athleteId: number,
  week: string,
): Promise<TissueInput> {
  const [team, history, checkins, meet, picks, restrictions] = await Promise.all([
    readRulesOfTeam(db, teamId),
    listPrescriptionsBefore(db, teamId, athleteId, week),
    listCheckins(db, teamId, athleteId),
    findNextMeet(db, teamId, athleteId, isoDay(mondayOf(week))),
    weekPicks(db, teamId, athleteId, week),
    engineRestrictionsOf(db, teamId, athleteId),
  ]);
  return tissueInputFrom(week, { team, history, checkins, meet, picks, restrictions });
}

/**
 * The generated week for an input, worked out once while the input stays the same (the function is pure,
 * so an equal input always gives an equal week). Keyed per athlete and week; callers never mutate it.
 */
const generated = new Map<string, { input: string; week: TissueWeek }>();
const GENERATED_MAX = 2_000;

function prescribeOnce(teamId: number, athleteId: number, input: TissueInput): TissueWeek {
  const key = `${teamId}:${athleteId}:${input.week}`;
  const text = JSON.stringify(input);
  const hit = generated.get(key);
  if (hit && hit.input === text) return hit.week;
  const week = prescribeTissueWork(input);
  if (generated.size >= GENERATED_MAX) generated.clear();
  generated.set(key, { input: text, week });
  return week;
}

/**
 * The week's work from facts already read: the stored prescription (`stored`), or the generated one,
 * stored when the week is this one or the next.
 */
export async function tissueWorkFrom(
  db: Queryable,
  who: { teamId: number; athleteId: number },
  week: string,
  facts: TissueFacts & { stored: { items: TissuePrescription[] } | null },
  today = new Date(),
): Promise<TissueWorkWeek> {
  const { teamId, athleteId } = who;
  const fresh = prescribeOnce(teamId, athleteId, tissueInputFrom(week, facts));
  let stored = facts.stored;
  // Only this week and next are written: a week already over is shown as it would have been, and one
  // further ahead as it looks now, without fixing either in the athlete's history.
  const current = weekOfDate(today);
  if (!stored && week >= current && week <= addWeeks(current, STORE_AHEAD_WEEKS)) {
    await insertPrescriptionIfAbsent(db, { teamId, athleteId, week, items: fresh.items });
    stored = await findPrescription(db, teamId, athleteId, week);
  }
  // A restriction added after the week was stored still keeps its joint out, with the note saying why.
  const restricted = restrictedJoints(week, facts.restrictions);
  const notes = [...fresh.notes];
  const items = (stored?.items ?? fresh.items).filter((item) => {
    const span = restricted.get(item.joint);
    if (span === undefined) return true;
    const note = restrictedNote(item.joint, span);
    if (!notes.includes(note)) notes.unshift(note);
    return false;
  });
  return { week, kind: items[0]?.kind ?? null, items, notes, suggestions: fresh.suggestions };
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
  const [team, history, checkins, meet, picks, restrictions, stored] = await Promise.all([
    readRulesOfTeam(db, teamId),
    listPrescriptionsBefore(db, teamId, athleteId, week),
    listCheckins(db, teamId, athleteId),
    findNextMeet(db, teamId, athleteId, isoDay(mondayOf(week))),
    weekPicks(db, teamId, athleteId, week),
    engineRestrictionsOf(db, teamId, athleteId),
    findPrescription(db, teamId, athleteId, week),
  ]);
  const facts = { team, history, checkins, meet, picks, restrictions, stored };
  return tissueWorkFrom(db, { teamId, athleteId }, week, facts, today);
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
    await noticePain(tx, { teamId, athleteId, week: body.week, checkinId: saved.id, joints: body.painJoints });
    return toCheckinRow(saved);
  });
}

// Offered to My week: the same reads it makes once per page, through this module's service.
export { findTeamRulesText, listCheckins, listPrescriptionsThrough, meetsFrom } from './tissue.repository';
