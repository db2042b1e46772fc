// Weekly connective-tissue (tendon) work: which of three kinds, on which joints, at what dose, for one ISO week.
// Pure and deterministic: team rules, the athlete's past prescriptions and next-day check-ins in, a week out.
//
// Shape of a week, in order of decisions:
// 1. Kind. One kind for the whole week ('highRep', 'isometric' or 'loadedStretch'). A kind keeps going while
//    it has run fewer than `maxConsecutiveWeeks` weeks in a row, so adaptation can build; then the least
//    recently used kind takes over (ties: gentlest first). Near a meet the riskier kinds are pulled, the
//    riskiest first (loaded stretch, then isometrics; high-rep light work stays): with d
//    the weeks from this week to the meet (0 in the meet week), loaded stretch is out when
//    0 <= d <= pullStretchWeeksOut and isometrics when 0 <= d <= pullIsometricWeeksOut (-1 = never pulled).
//    When every allowed kind has used up its run, the week rests (no items), which also resets the runs.
// 2. Joints. The team's focus joints in their order, the ones under the most max-effort load first when
//    `jointLoad` is given, then other loaded joints; at most `maxJointsPerWeek`. A joint with pain flagged in
//    a check-in of the last `painLookbackWeeks` weeks is paused and the coach gets a suggestion to add a
//    restriction on it. A joint the athlete has a restriction on that covers the week (the rotation engine's
//    restrictions by joint, with their weeks) gets no work that week either, and the notes say why. Neither
//    is replaced by another joint: the week simply holds less.
// 3. Dose, per joint, from that joint's last prescription of the same kind and the check-in after it
//    (a check-in carries the week of the work it reports on, not the day it was filled in):
//    - high-rep: soreness at or over `sorenessThreshold` lowers the effort, never the reps (the work is 100
//      reps or more by definition): first the band one step lighter; once on the lightest band the reps stay
//      and the item says to split them into easy sets with short rests, and the coach gets a suggestion to
//      review the work. Reps never go below `highRepMinReps` (at least 100); without soreness they climb by
//      `highRepRepStep` to `highRepReps`; the band never gets heavier by itself.
//    - isometric pulses: seconds start very short at `isometricStartSeconds` (1 s), rise by
//      `isometricStepSeconds` after a week that left no soreness, cap at `isometricMaxSeconds` (5 s); soreness
//      steps back one step; no check-in holds the time (the pulses are harder to recover from than they feel). A gap longer than
//      `progressionResetWeeks` starts over. Angles are spread so that, each covering about ± the cover
//      angle, together they span the joint's working range.
//    - loaded stretch: the hold is not progressed week on week. It stays at `stretchHoldSeconds`; a sore week
//      shortens the next hold by a quarter (rounded to 5 s, not under STRETCH_MIN_HOLD_SECONDS), no check-in
//      keeps the last hold, and a week without soreness goes back to the set time, never past it. Step and
//      cap settings of older rules are ignored.
// Only history and check-ins from weeks before `week` count. Everything here is coaching guidance, not
// medical advice; the notes always carry the usual cautions.

import { JOINTS, type Joint, type Restriction, type Variant } from './types';
import { parseWeek, weekNumber as parseWeekNumber } from './weeks';
import { TISSUE_KIND_WORD } from '../labels';
import { jointName } from './words';

export type TissueKind = 'highRep' | 'isometric' | 'loadedStretch';
/** Gentlest first: the order riskier work is pulled in before a meet runs the other way. */
export const TISSUE_KINDS: readonly TissueKind[] = ['highRep', 'isometric', 'loadedStretch'];

export type BandLevel = 'lightest' | 'light' | 'medium';
/** Band tensions, lightest first. */
export const BAND_LEVELS: readonly BandLevel[] = ['lightest', 'light', 'medium'];

/**
 * The fewest reps high-rep work may have (common practice, no single published source: very-high-rep
 * tendon work is 100 reps or more with the least effort; fewer reps at a harder effort is other work).
 */
export const HIGH_REP_FLOOR = 100;
/**
 * Reps per easy set when sore high-rep work on the lightest band is split, and the rest between those sets.
 * Our choice (no published source): sets short enough to stay easy, rests short enough to keep it light work.
 */
export const EASY_SET_REPS = 25;
export const EASY_SET_REST_SECONDS = '30–60';
/** The shortest loaded-stretch hold a sore week leads to (our choice: under half a minute is no longer a hold). */
export const STRETCH_MIN_HOLD_SECONDS = 30;
/** After a sore week the hold is this share of the last one (our choice). */
const STRETCH_SORE_SHARE = 0.75;

export interface TissueRules {
  /** A kind runs at most this many weeks in a row. */
  maxConsecutiveWeeks: number;
  /** Isometrics are pulled when the meet is 0..this many weeks away (-1: never pulled). */
  pullIsometricWeeksOut: number;
  /** Loaded stretch is pulled when the meet is 0..this many weeks away (-1: never pulled). */
  pullStretchWeeksOut: number;
  /** Next-day soreness (0 none … 10 worst) at or above this means the dose was too much. */
  sorenessThreshold: number;
  isometricStartSeconds: number;
  isometricStepSeconds: number;
  isometricMaxSeconds: number;
  isometricPulsesPerAngle: number;
  /** Degrees either side of each pulse angle that it is taken to cover. */
  isometricAngleCoverDegrees: number;
  highRepReps: number;
  /** High-rep work never has fewer reps than this; at least HIGH_REP_FLOOR. */
  highRepMinReps: number;
  highRepRepStep: number;
  highRepBand: BandLevel;
  /** Light reps that tire the muscle before the stretched hold. */
  stretchFatigueReps: number;
  /** The loaded-stretch hold: set, not progressed week on week; soreness may shorten it. */
  stretchHoldSeconds: number;
  maxJointsPerWeek: number;
  /** Sessions of tissue work in a week, each item done in every one of them. */
  sessionsPerWeek: number;
  /** Pain flagged in a check-in of this many past weeks pauses that joint's work. */
  painLookbackWeeks: number;
  /** A kind not done on a joint for longer than this many weeks starts over from its start dose. */
  progressionResetWeeks: number;
}

/**
 * Defaults. Common practice with no single published source: isometric pulses built up from very short
 * ones (about 1 s) toward about 3–5 s over weeks, each angle covering about ±10°; high-rep work of 100 reps
 * or more that leaves no soreness the next day; holds of minutes in the stretch; riskier work pulled first
 * as a meet nears. The numbers are our own choices within that: three weeks in a row, loaded stretch out
 * 4 weeks and isometrics 2 weeks before the meet, soreness 3/10 as the line, pulses from 1 s by +0.5 s per
 * easy week to a cap of 5 s (3 s after four easy weeks of pulses), three pulses per angle, high-rep work of
 * 100 reps (the floor) climbing back in steps of 20 from older, shorter doses, a stretched hold of 2 min
 * (shortened by a quarter after a sore week, never under 30 s), three joints a week, pain pausing a joint for
 * two weeks, a restart after 8 weeks away. Sessions a week: three, on separate days — common practice for
 * short tendon work, recalled from coaching practice with no single published source; the number is ours
 * to default and each team sets its own.
 */
export const DEFAULT_TISSUE_RULES: Readonly<TissueRules> = {
  maxConsecutiveWeeks: 3,
  pullIsometricWeeksOut: 2,
  pullStretchWeeksOut: 4,
  sorenessThreshold: 3,
  isometricStartSeconds: 1,
  isometricStepSeconds: 0.5,
  isometricMaxSeconds: 5,
  isometricPulsesPerAngle: 3,
  isometricAngleCoverDegrees: 10,
  highRepReps: 100,
  highRepMinReps: HIGH_REP_FLOOR,
  highRepRepStep: 20,
  highRepBand: 'light',
  stretchFatigueReps: 25,
  stretchHoldSeconds: 120,
  maxJointsPerWeek: 3,
  sessionsPerWeek: 3,
  painLookbackWeeks: 2,
  progressionResetWeeks: 8,
};

export interface HighRepDose {
  reps: number;
  band: BandLevel;
  /** Set when the reps are to be split into this many easy sets with short rests (sore on the lightest band). */
  easySets?: number;
}
export interface IsometricDose {
  seconds: number;
  pulsesPerAngle: number;
  /** Joint angles in degrees; see the item's instructions for what 0° means on that joint. */
  angles: number[];
}
export interface StretchDose {
  fatigueReps: number;
  holdSeconds: number;
}

interface ItemBase {
  week: string;
  joint: Joint;
  exercise: string;
  instructions: string[];
  /** How many sessions of this work in the week (the team's setting when the week was made). */
  sessionsPerWeek: number;
}
export type TissuePrescription =
  | (ItemBase & { kind: 'highRep'; dose: HighRepDose })
  | (ItemBase & { kind: 'isometric'; dose: IsometricDose })
  | (ItemBase & { kind: 'loadedStretch'; dose: StretchDose });

export interface TissueCheckin {
  /** The week of the work reported on. */
  week: string;
  kind: TissueKind;
  soreness: number; // 0-10
  painJoints: Joint[];
  note?: string;
}

export interface TissueSuggestion {
  joint: Joint;
  /** 'pain': pain flagged in a check-in; 'soreness': still sore after high-rep work on the lightest band. */
  reason: 'pain' | 'soreness';
  message: string;
}

export interface TissueInput {
  week: string;
  meetWeek?: string;
  rules: TissueRules;
  history: TissuePrescription[];
  checkins: TissueCheckin[];
  /** Joints the team wants worked, most important first (elbows, knees and shoulders are typical). */
  focusJoints: Joint[];
  /** Load per joint from the athlete's current max-effort picks (see jointLoadOf); heavier first. */
  jointLoad?: Partial<Record<Joint, number>>;
  /** The athlete's restrictions; those on a joint that cover the week keep that joint's work out. */
  restrictions?: readonly Restriction[];
}

export interface TissueWeek {
  /** The week's kind, or null for a rest week. */
  kind: TissueKind | null;
  items: TissuePrescription[];
  suggestions: TissueSuggestion[];
  notes: string[];
}

export const TISSUE_CAUTION: readonly string[] = [
  'Stop on sharp or unusual pain.',
  'Tissue that gets hot, swollen or sore is a sign of doing too much: ease off and tell your coach.',
  'This is coaching guidance, not medical advice: see a licensed clinician for injuries.',
];

/** Ordinary exercise names per joint and kind. */
export const TISSUE_EXERCISES: Readonly<Record<Joint, Readonly<Record<TissueKind, string>>>> = {
  elbow: {
    highRep: 'Banded triceps pushdown',
    isometric: 'Elbow extension pulses against a fixed strap',
    loadedStretch: 'Light dumbbell overhead triceps extension, stretched hold',
  },
  knee: {
    highRep: 'Banded terminal knee extension',
    isometric: 'Knee extension pulses against a fixed strap',
    loadedStretch: 'Light goblet squat, bottom hold',
  },
  shoulder: {
    highRep: 'Banded pull-apart',
    isometric: 'Pressing pulses against a door frame',
    loadedStretch: 'Light dumbbell fly, stretched hold',
  },
  wrist: {
    highRep: 'Banded wrist curl',
    isometric: 'Wrist pulses against the other hand',
    loadedStretch: 'Light wrist curl, stretched hold',
  },
  hip: {
    highRep: 'Banded pull-through',
    isometric: 'Hip extension pulses against a fixed strap',
    loadedStretch: 'Light split squat, bottom hold',
  },
  lowerBack: {
    highRep: 'Banded good morning',
    isometric: 'Back extension pulses against a fixed strap',
    loadedStretch: 'Light back extension, bottom hold',
  },
};

/**
 * Working range per joint for isometric angles, in degrees, with what 0° means. Approximate training
 * ranges from memory, kept inside the usual full range of motion; not a clinical measure.
 */
export const JOINT_WORKING_RANGE: Readonly<Record<Joint, { from: number; to: number; zero: string }>> = {
  elbow: { from: 0, to: 140, zero: '0° = arm straight' },
  knee: { from: 0, to: 120, zero: '0° = leg straight' },
  shoulder: { from: 0, to: 160, zero: '0° = arm by your side, raised to the front' },
  wrist: { from: -60, to: 60, zero: '0° = wrist straight, minus = bent back' },
  hip: { from: 0, to: 110, zero: '0° = standing tall' },
  lowerBack: { from: 0, to: 40, zero: '0° = upright, leaning forward from the hips' },
};

/** Angles that, each covering ±cover degrees, span the joint's working range, evenly spread. */
export function isometricAngles(joint: Joint, coverDegrees: number): number[] {
  positive('isometricAngleCoverDegrees', coverDegrees);
  const { from, to } = JOINT_WORKING_RANGE[joint];
  const span = to - from;
  const count = Math.max(1, Math.ceil(span / (2 * coverDegrees)));
  if (count === 1) return [Math.round(from + span / 2)];
  const first = from + Math.min(coverDegrees, span / 2);
  const last = to - Math.min(coverDegrees, span / 2);
  return Array.from({ length: count }, (_, i) => Math.round(first + ((last - first) * i) / (count - 1)));
}

/**
 * The joints with a restriction covering `week`, each with the weeks it runs (for the note). Restrictions by
 * emphasis or family only name no joint and keep nothing out.
 */
export function restrictedJoints(week: string, restrictions: readonly Restriction[]): Map<Joint, string> {
  const n = weekNumber(week);
  const out = new Map<Joint, string>();
  for (const r of restrictions) {
    if (r.joint === undefined) continue;
    if (r.fromWeek !== undefined && weekNumber(r.fromWeek) > n) continue;
    if (r.toWeek !== undefined && weekNumber(r.toWeek) < n) continue;
    const span =
      r.fromWeek && r.toWeek
        ? `${r.fromWeek} to ${r.toWeek}`
        : r.toWeek
          ? `until ${r.toWeek}`
          : r.fromWeek
            ? `from ${r.fromWeek}, no end set`
            : 'no end set';
    if (!out.has(r.joint)) out.set(r.joint, span);
  }
  return out;
}

/** The note for a joint kept out by a restriction. */
export function restrictedNote(joint: Joint, span: string): string {
  return `No work on the ${jointName(joint)} this week: the athlete has a restriction on it (${span}).`;
}

/** Summed joint stress of a set of variants (e.g. the athlete's current max-effort picks). */
export function jointLoadOf(variants: readonly Pick<Variant, 'stress'>[]): Partial<Record<Joint, number>> {
  const load: Partial<Record<Joint, number>> = {};
  for (const v of variants) {
    for (const j of JOINTS) {
      const s = v.stress[j] ?? 0;
      if (s > 0) load[j] = (load[j] ?? 0) + s;
    }
  }
  return load;
}

// ---- input checks -------------------------------------------------------------------------------------

function finite(name: string, v: number): number {
  if (typeof v !== 'number' || !Number.isFinite(v))
    throw new RangeError(`${name} must be a finite number, got ${String(v)}`);
  return v;
}
function positive(name: string, v: number): number {
  if (finite(name, v) <= 0) throw new RangeError(`${name} must be greater than 0, got ${v}`);
  return v;
}
function wholeAtLeast(name: string, v: number, min: number): number {
  if (!Number.isInteger(finite(name, v)) || v < min)
    throw new RangeError(`${name} must be a whole number of at least ${min}, got ${v}`);
  return v;
}
function oneOf<T>(name: string, v: T, allowed: readonly T[]): T {
  if (!allowed.includes(v)) throw new RangeError(`${name} must be one of ${allowed.join(', ')}, got ${String(v)}`);
  return v;
}

function checkRules(r: TissueRules): void {
  wholeAtLeast('maxConsecutiveWeeks', r.maxConsecutiveWeeks, 1);
  wholeAtLeast('pullIsometricWeeksOut', r.pullIsometricWeeksOut, -1);
  wholeAtLeast('pullStretchWeeksOut', r.pullStretchWeeksOut, -1);
  if (positive('sorenessThreshold', r.sorenessThreshold) > 10) {
    throw new RangeError(`sorenessThreshold must be at most 10, got ${r.sorenessThreshold}`);
  }
  positive('isometricStartSeconds', r.isometricStartSeconds);
  if (finite('isometricStepSeconds', r.isometricStepSeconds) < 0)
    throw new RangeError(`isometricStepSeconds must not be negative, got ${r.isometricStepSeconds}`);
  if (finite('isometricMaxSeconds', r.isometricMaxSeconds) < r.isometricStartSeconds) {
    throw new RangeError(
      `isometricMaxSeconds (${r.isometricMaxSeconds}) must be at least isometricStartSeconds (${r.isometricStartSeconds})`,
    );
  }
  if (finite('stretchHoldSeconds', r.stretchHoldSeconds) < STRETCH_MIN_HOLD_SECONDS) {
    throw new RangeError(
      `stretchHoldSeconds must be at least ${STRETCH_MIN_HOLD_SECONDS}, got ${r.stretchHoldSeconds}`,
    );
  }
  wholeAtLeast('isometricPulsesPerAngle', r.isometricPulsesPerAngle, 1);
  positive('isometricAngleCoverDegrees', r.isometricAngleCoverDegrees);
  if (finite('highRepMinReps', r.highRepMinReps) < HIGH_REP_FLOOR || !Number.isInteger(r.highRepMinReps)) {
    throw new RangeError(
      `highRepMinReps must be a whole number of at least ${HIGH_REP_FLOOR} (high-rep work is ${HIGH_REP_FLOOR} reps or more), got ${r.highRepMinReps}`,
    );
  }
  if (wholeAtLeast('highRepReps', r.highRepReps, 1) < r.highRepMinReps) {
    throw new RangeError(`highRepReps (${r.highRepReps}) must be at least highRepMinReps (${r.highRepMinReps})`);
  }
  wholeAtLeast('highRepRepStep', r.highRepRepStep, 1);
  oneOf('highRepBand', r.highRepBand, BAND_LEVELS);
  wholeAtLeast('stretchFatigueReps', r.stretchFatigueReps, 1);
  wholeAtLeast('maxJointsPerWeek', r.maxJointsPerWeek, 1);
  if (wholeAtLeast('sessionsPerWeek', r.sessionsPerWeek, 1) > 7)
    throw new RangeError(`sessionsPerWeek must be at most 7, got ${r.sessionsPerWeek}`);
  wholeAtLeast('painLookbackWeeks', r.painLookbackWeeks, 1);
  wholeAtLeast('progressionResetWeeks', r.progressionResetWeeks, 1);
}

function checkInput(input: TissueInput): void {
  parseWeek(input.week);
  if (input.meetWeek !== undefined) parseWeek(input.meetWeek);
  checkRules(input.rules);
  for (const j of input.focusJoints) oneOf('focus joint', j, JOINTS);
  for (const [j, load] of Object.entries(input.jointLoad ?? {})) {
    oneOf('joint', j as Joint, JOINTS);
    finite(`load on ${j}`, load ?? 0);
  }
  for (const item of input.history) {
    parseWeek(item.week);
    oneOf('kind', item.kind, TISSUE_KINDS);
    oneOf('joint', item.joint, JOINTS);
    if (item.kind === 'highRep') {
      wholeAtLeast('high-rep reps in history', item.dose.reps, 1);
      oneOf('band in history', item.dose.band, BAND_LEVELS);
    } else if (item.kind === 'isometric') {
      positive('isometric seconds in history', item.dose.seconds);
    } else {
      positive('stretch hold seconds in history', item.dose.holdSeconds);
    }
  }
  for (const r of input.restrictions ?? []) {
    if (r.joint !== undefined) oneOf('restricted joint', r.joint, JOINTS);
    if (r.fromWeek !== undefined) parseWeek(r.fromWeek);
    if (r.toWeek !== undefined) parseWeek(r.toWeek);
  }
  for (const c of input.checkins) {
    parseWeek(c.week);
    oneOf('kind', c.kind, TISSUE_KINDS);
    if (finite('soreness', c.soreness) < 0 || c.soreness > 10)
      throw new RangeError(`soreness must be from 0 to 10, got ${c.soreness}`);
    for (const j of c.painJoints) oneOf('pain joint', j, JOINTS);
  }
}

// Week strings repeat across history and check-ins; parsing each once keeps long histories cheap.
const weekNumbers = new Map<string, number>();
function weekNumber(week: string): number {
  let n = weekNumbers.get(week);
  if (n === undefined) {
    n = parseWeekNumber(week);
    if (weekNumbers.size > 10_000) weekNumbers.clear();
    weekNumbers.set(week, n);
  }
  return n;
}

// ---- history lookups ----------------------------------------------------------------------------------

type ItemOf<K extends TissueKind> = Extract<TissuePrescription, { kind: K }>;

interface Past {
  now: number;
  kindsByWeek: Map<number, Set<TissueKind>>;
  checkins: Map<string, { soreness: number; painJoints: Set<Joint> }>;
  items: TissuePrescription[];
}

function readPast(input: TissueInput): Past {
  const now = weekNumber(input.week);
  const items = input.history.filter((h) => weekNumber(h.week) < now);
  const kindsByWeek = new Map<number, Set<TissueKind>>();
  for (const h of items) {
    const n = weekNumber(h.week);
    const set = kindsByWeek.get(n) ?? new Set<TissueKind>();
    set.add(h.kind);
    kindsByWeek.set(n, set);
  }
  // Several check-ins for the same week and kind merge to the worst soreness and every joint flagged.
  const checkins = new Map<string, { soreness: number; painJoints: Set<Joint> }>();
  for (const c of input.checkins) {
    if (weekNumber(c.week) >= now) continue;
    const key = `${weekNumber(c.week)}:${c.kind}`;
    const merged = checkins.get(key) ?? { soreness: 0, painJoints: new Set<Joint>() };
    merged.soreness = Math.max(merged.soreness, c.soreness);
    for (const j of c.painJoints) merged.painJoints.add(j);
    checkins.set(key, merged);
  }
  return { now, kindsByWeek, checkins, items };
}

function runLength(past: Past, kind: TissueKind): number {
  let run = 0;
  while (past.kindsByWeek.get(past.now - run - 1)?.has(kind)) run++;
  return run;
}

function lastUsed(past: Past, kind: TissueKind): number {
  let last = Number.NEGATIVE_INFINITY;
  for (const [n, kinds] of past.kindsByWeek) if (kinds.has(kind) && n > last) last = n;
  return last;
}

// Lower rank = lighter dose; among same-week duplicates the lighter one counts, so order never matters.
function doseRank(item: TissuePrescription): number {
  switch (item.kind) {
    case 'highRep':
      return BAND_LEVELS.indexOf(item.dose.band) * 1e6 + item.dose.reps;
    case 'isometric':
      return item.dose.seconds;
    case 'loadedStretch':
      return item.dose.holdSeconds;
  }
}

function lastItem<K extends TissueKind>(past: Past, kind: K, joint: Joint): ItemOf<K> | undefined {
  let best: ItemOf<K> | undefined;
  for (const h of past.items) {
    if (h.kind !== kind || h.joint !== joint) continue;
    const item = h as ItemOf<K>;
    const n = weekNumber(item.week);
    const bestN = best ? weekNumber(best.week) : Number.NEGATIVE_INFINITY;
    if (n > bestN || (best && n === bestN && doseRank(item) < doseRank(best))) best = item;
  }
  return best;
}

function checkinFor(
  past: Past,
  week: string,
  kind: TissueKind,
): { soreness: number; painJoints: Set<Joint> } | undefined {
  return past.checkins.get(`${weekNumber(week)}:${kind}`);
}

// ---- decisions ----------------------------------------------------------------------------------------

function pullWindow(rules: TissueRules, kind: TissueKind): number {
  if (kind === 'isometric') return rules.pullIsometricWeeksOut;
  if (kind === 'loadedStretch') return rules.pullStretchWeeksOut;
  return -1;
}

function chooseKind(input: TissueInput, past: Past): { kind: TissueKind | null; notes: string[] } {
  const { rules } = input;
  const weeksOut = input.meetWeek === undefined ? undefined : weekNumber(input.meetWeek) - past.now;
  const pulled = TISSUE_KINDS.filter(
    (k) => weeksOut !== undefined && weeksOut >= 0 && weeksOut <= pullWindow(rules, k),
  );
  const notes: string[] = [];
  if (pulled.length > 0) {
    const when = weeksOut === 0 ? 'this is meet week' : `the meet is ${weeksOut} week${weeksOut === 1 ? '' : 's'} away`;
    notes.push(
      `${capitalise(pulled.map((k) => TISSUE_KIND_WORD[k]).join(' and '))} ${pulled.length > 1 ? 'are' : 'is'} pulled: ${when}.`,
    );
  }
  const open = TISSUE_KINDS.filter((k) => !pulled.includes(k) && runLength(past, k) < rules.maxConsecutiveWeeks);
  if (open.length === 0) {
    notes.push(
      `No connective-tissue work this week: every kind still allowed has run ${rules.maxConsecutiveWeeks} week${rules.maxConsecutiveWeeks === 1 ? '' : 's'} in a row, so the tissue gets a rest week.`,
    );
    return { kind: null, notes };
  }
  if (weeksOut !== undefined && weeksOut >= 0 && weeksOut <= 1 && open.includes('highRep')) {
    notes.push('The meet is close: keep any high-rep work very easy and finish it early in the week.');
  }
  const lastWeek = past.kindsByWeek.get(past.now - 1);
  const continuing = open.find((k) => lastWeek?.has(k));
  if (continuing) {
    notes.push(
      `${capitalise(TISSUE_KIND_WORD[continuing])} again: week ${runLength(past, continuing) + 1} of at most ${rules.maxConsecutiveWeeks} in a row.`,
    );
    return { kind: continuing, notes };
  }
  // Least recently used first; TISSUE_KINDS order (gentlest first) breaks ties, and the sort is stable.
  const kind = [...open].sort((a, b) => {
    const [x, y] = [lastUsed(past, a), lastUsed(past, b)];
    return x === y ? 0 : x < y ? -1 : 1;
  })[0]!;
  const stopped = TISSUE_KINDS.find((k) => lastWeek?.has(k) && runLength(past, k) >= rules.maxConsecutiveWeeks);
  notes.push(
    stopped
      ? `${capitalise(TISSUE_KIND_WORD[kind])} this week: ${TISSUE_KIND_WORD[stopped]} has run ${rules.maxConsecutiveWeeks} week${rules.maxConsecutiveWeeks === 1 ? '' : 's'} in a row, so it rotates out.`
      : `${capitalise(TISSUE_KIND_WORD[kind])} this week.`,
  );
  return { kind, notes };
}

function chooseJoints(input: TissueInput): Joint[] {
  const load = (j: Joint): number => input.jointLoad?.[j] ?? 0;
  const focus = [...new Set(input.focusJoints)].sort((a, b) => load(b) - load(a));
  const extra = JOINTS.filter((j) => !focus.includes(j) && load(j) > 0).sort((a, b) => load(b) - load(a));
  return [...focus, ...extra].slice(0, input.rules.maxJointsPerWeek);
}

function recentPain(input: TissueInput, past: Past): Map<Joint, { weeks: Set<string>; after: Set<TissueKind> }> {
  const pain = new Map<Joint, { weeks: Set<string>; after: Set<TissueKind> }>();
  const sorted = [...input.checkins].sort((a, b) => weekNumber(a.week) - weekNumber(b.week));
  for (const c of sorted) {
    const n = weekNumber(c.week);
    if (n >= past.now || n < past.now - input.rules.painLookbackWeeks) continue;
    for (const j of c.painJoints) {
      const entry = pain.get(j) ?? { weeks: new Set<string>(), after: new Set<TissueKind>() };
      entry.weeks.add(c.week);
      entry.after.add(c.kind);
      pain.set(j, entry);
    }
  }
  return pain;
}

interface Ladder {
  start: number;
  step: number;
  max: number;
}

/** Next value on a start/step/cap ladder from the last dose and the check-in after it. */
function climb(
  ladder: Ladder,
  last: { week: string; value: number } | undefined,
  checkin: { soreness: number } | undefined,
  input: TissueInput,
  past: Past,
): { value: number; why?: string } {
  const { start, step, max } = ladder;
  if (!last) return { value: start };
  const gap = past.now - weekNumber(last.week);
  if (gap > input.rules.progressionResetWeeks) return { value: start, why: `starting over after ${gap} weeks away` };
  const prev = Math.min(max, Math.max(start, last.value));
  if (!checkin) return { value: prev, why: `kept as last time: no check-in after ${last.week}` };
  if (checkin.soreness >= input.rules.sorenessThreshold) {
    return {
      value: Math.max(start, prev - step),
      why: `one step back: soreness ${checkin.soreness}/10 after ${last.week}`,
    };
  }
  const value = Math.min(max, prev + step);
  return value > prev
    ? { value, why: `one step up: no soreness to speak of after ${last.week}` }
    : { value, why: 'at the cap' };
}

function highRepDose(
  input: TissueInput,
  past: Past,
  joint: Joint,
): { dose: HighRepDose; why?: string; suggestion?: string } {
  const r = input.rules;
  const last = lastItem(past, 'highRep', joint);
  const ruleBand = BAND_LEVELS.indexOf(r.highRepBand);
  if (!last) return { dose: { reps: r.highRepReps, band: r.highRepBand } };
  const band = Math.min(BAND_LEVELS.indexOf(last.dose.band), ruleBand);
  // Doses stored before the floor existed may hold fewer reps: they come back to the floor at once.
  const reps = Math.max(r.highRepMinReps, Math.min(last.dose.reps, r.highRepReps));
  const checkin = checkinFor(past, last.week, 'highRep');
  if (!checkin) {
    return { dose: { reps, band: BAND_LEVELS[band]! }, why: `Same dose as last time: no check-in after ${last.week}.` };
  }
  if (checkin.soreness >= r.sorenessThreshold) {
    const sore = `soreness ${checkin.soreness}/10 after ${last.week}`;
    if (band > 0) {
      return { dose: { reps, band: BAND_LEVELS[band - 1]! }, why: `Band one step lighter, same reps: ${sore}.` };
    }
    const easySets = Math.ceil(reps / EASY_SET_REPS);
    return {
      dose: { reps, band: BAND_LEVELS[band]!, easySets },
      why: `Already on the lightest band and still sore (${sore}): the same ${reps} reps, split into easy sets.`,
      suggestion:
        `High-rep work at the ${jointName(joint)} left soreness on the lightest band (${sore}). ` +
        `This week it is split into ${easySets} easy sets; consider another kind of tissue work for this joint ` +
        'or fewer sessions, and review how the reps are done.',
    };
  }
  const more = Math.min(r.highRepReps, reps + r.highRepRepStep);
  return {
    dose: { reps: more, band: BAND_LEVELS[band]! },
    ...(more > reps ? { why: `${more - reps} reps back on: no soreness to speak of after ${last.week}.` } : {}),
  };
}

/** The loaded-stretch hold: the set time, shortened after a sore week, never longer than the set time. */
function stretchHold(
  input: TissueInput,
  past: Past,
  last: ItemOf<'loadedStretch'> | undefined,
): { value: number; why?: string } {
  const set = input.rules.stretchHoldSeconds;
  if (!last) return { value: set };
  const gap = past.now - weekNumber(last.week);
  if (gap > input.rules.progressionResetWeeks) return { value: set };
  // A hold stored under older rules (progressed past today's set time) comes back to the set time.
  const prev = Math.min(set, last.dose.holdSeconds);
  const checkin = checkinFor(past, last.week, 'loadedStretch');
  if (!checkin) {
    return prev < set ? { value: prev, why: `kept as last time: no check-in after ${last.week}` } : { value: set };
  }
  if (checkin.soreness >= input.rules.sorenessThreshold) {
    const shorter = Math.max(STRETCH_MIN_HOLD_SECONDS, Math.round((prev * STRETCH_SORE_SHARE) / 5) * 5);
    return {
      value: Math.min(prev, shorter),
      why: `shortened: soreness ${checkin.soreness}/10 after ${last.week}`,
    };
  }
  return prev < set
    ? { value: set, why: `back to the set time: no soreness to speak of after ${last.week}` }
    : { value: set };
}

function formatSeconds(s: number): string {
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  const rest = Math.round((s - m * 60) * 10) / 10;
  return rest === 0 ? `${m} min` : `${m} min ${rest} s`;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function buildItem(
  input: TissueInput,
  past: Past,
  kind: TissueKind,
  joint: Joint,
): { item: TissuePrescription; suggestion?: string } {
  const r = input.rules;
  const base = {
    week: input.week,
    joint,
    exercise: TISSUE_EXERCISES[joint][kind],
    sessionsPerWeek: r.sessionsPerWeek,
  };
  if (kind === 'highRep') {
    const { dose, why, suggestion } = highRepDose(input, past, joint);
    const item: TissuePrescription = {
      ...base,
      kind,
      dose,
      instructions: [
        dose.easySets
          ? `${dose.reps} reps with the ${dose.band} band, split into ${dose.easySets} easy sets of about ${Math.ceil(dose.reps / dose.easySets)} with ${EASY_SET_REST_SECONDS} s rest between them.`
          : `${dose.reps} reps with the ${dose.band} band, in as few sets as feels easy.`,
        'Use the least effort that moves the band: smooth reps, no chasing a burn or a pump.',
        'Soreness the next day means it was done too hard: say so in the check-in.',
        ...(why ? [why] : []),
      ],
    };
    return suggestion ? { item, suggestion } : { item };
  }
  if (kind === 'isometric') {
    const last = lastItem(past, 'isometric', joint);
    const step = climb(
      { start: r.isometricStartSeconds, step: r.isometricStepSeconds, max: r.isometricMaxSeconds },
      last && { week: last.week, value: last.dose.seconds },
      last && checkinFor(past, last.week, 'isometric'),
      input,
      past,
    );
    const angles = isometricAngles(joint, r.isometricAngleCoverDegrees);
    const item: TissuePrescription = {
      ...base,
      kind,
      dose: { seconds: step.value, pulsesPerAngle: r.isometricPulsesPerAngle, angles },
      instructions: [
        'No weight: push against something that does not move (a strap, the safety pins, a door frame).',
        `${r.isometricPulsesPerAngle} pulses of ${formatSeconds(step.value)} at each angle: ${angles.map((a) => `${a}°`).join(', ')} (${JOINT_WORKING_RANGE[joint].zero}). Each angle covers about ${r.isometricAngleCoverDegrees}° either side.`,
        'Build to a firm effort, not an all-out one, and relax fully between pulses.',
        'Pulses are harder to recover from than they feel: do not add time on your own.',
        ...(step.why ? [`Hold time ${step.why}.`] : []),
      ],
    };
    return { item };
  }
  const last = lastItem(past, 'loadedStretch', joint);
  const step = stretchHold(input, past, last);
  const item: TissuePrescription = {
    ...base,
    kind,
    dose: { fatigueReps: r.stretchFatigueReps, holdSeconds: step.value },
    instructions: [
      `First tire the muscle: ${r.stretchFatigueReps} light reps of the same movement.`,
      `Then hold the stretched position for ${formatSeconds(step.value)}, breathing slowly; the load moves from the tired muscle to the tendon.`,
      'Light enough to hold still and relaxed; ease out at once if the stretch turns sharp.',
      'The hold stays at this time from week to week: do not lengthen it on your own.',
      ...(step.why ? [`Hold time ${step.why}.`] : []),
    ],
  };
  return { item };
}

/** The athlete's connective-tissue work for `input.week`. Throws a RangeError on malformed input. */
export function prescribeTissueWork(input: TissueInput): TissueWeek {
  checkInput(input);
  const past = readPast(input);
  const { kind, notes } = chooseKind(input, past);
  const pain = recentPain(input, past);
  const restricted = restrictedJoints(input.week, input.restrictions ?? []);
  const suggestions: TissueSuggestion[] = JOINTS.filter((j) => pain.has(j)).map((joint) => {
    const { weeks, after } = pain.get(joint)!;
    const label = jointName(joint);
    const span = restricted.get(joint);
    const advice =
      span === undefined
        ? `Consider adding a restriction on the ${label} for max-effort picks. Its connective-tissue work is paused meanwhile. `
        : `A restriction on the ${label} is in place (${span}): keep it while the pain lasts. Its connective-tissue work stays out meanwhile. `;
    return {
      joint,
      reason: 'pain' as const,
      message:
        `Pain at the ${label} reported after ${[...after].map((k) => TISSUE_KIND_WORD[k]).join(' and ')} (${[...weeks].join(', ')}). ` +
        advice +
        'If it persists, refer the athlete to a licensed clinician.',
    };
  });
  const items: TissuePrescription[] = [];
  if (kind) {
    const joints = chooseJoints(input);
    if (joints.length === 0)
      notes.push('No focus joints set: add some in the team rules to get connective-tissue work.');
    for (const joint of joints) {
      const span = restricted.get(joint);
      if (span !== undefined) {
        notes.push(restrictedNote(joint, span));
        continue;
      }
      if (pain.has(joint)) {
        notes.push(`No work on the ${jointName(joint)} this week: pain was reported there recently.`);
        continue;
      }
      const { item, suggestion } = buildItem(input, past, kind, joint);
      items.push(item);
      if (suggestion) suggestions.push({ joint, reason: 'soreness', message: suggestion });
    }
  }
  return { kind, items, suggestions, notes: [...notes, ...TISSUE_CAUTION] };
}
