// Meet-day maths: the federation's attempt rules, its points formula and its age groups by birth year.

import { DIVISIONS, dotsScore, type Division, type Sex } from './classes';
import { requireFinite, requireInteger, requireNonNegative, requireOneOf, requirePositive } from './guard';
import { isLoadable, type BarOptions } from './plates';

/** Every attempt is a multiple of this (federation technical rules; memory, see the tests). */
export const ATTEMPT_STEP_KG = 2.5;
/** Record attempts may use the lighter change discs and go in these steps. */
export const RECORD_STEP_KG = 0.5;
/** After a good lift the next attempt is at least this much heavier. */
export const MIN_INCREASE_KG = 2.5;
/** The heaviest attempt we accept (no total or single lift is near it; a typo guard). */
export const MAX_ATTEMPT_KG = 600;

const SEXES: readonly Sex[] = ['M', 'F'];
// Weights are compared in grams so that 0.5 kg steps add exactly.
const g = (kg: number) => Math.round(kg * 1000);

function onStep(kg: number, stepKg: number): boolean {
  return g(kg) % g(stepKg) === 0;
}

function ceilToStep(kg: number, stepKg: number): number {
  return (Math.ceil(g(kg) / g(stepKg)) * g(stepKg)) / 1000;
}

export interface AttemptOptions {
  /** A record attempt: 0.5 kg steps with the change discs. */
  record?: boolean;
  /** The platform's bar and discs; the federation's competition set when left out. */
  bar?: BarOptions;
}

function stepOf(opts: AttemptOptions): number {
  return opts.record ? RECORD_STEP_KG : ATTEMPT_STEP_KG;
}

function loadable(kg: number, opts: AttemptOptions): boolean {
  return isLoadable(kg, 'kg', opts.bar ?? {});
}

/** The lightest loadable weight on the step grid at or above `kg`. */
function firstLoadableFrom(kg: number, opts: AttemptOptions): number {
  const step = stepOf(opts);
  let w = ceilToStep(kg, step);
  while (w <= MAX_ATTEMPT_KG && !loadable(w, opts)) w = (g(w) + g(step)) / 1000;
  if (w > MAX_ATTEMPT_KG) throw new RangeError(`no loadable attempt between ${kg} and ${MAX_ATTEMPT_KG} kg`);
  return w;
}

function requireAttemptKg(name: string, kg: number): number {
  requirePositive(name, kg);
  if (kg > MAX_ATTEMPT_KG) throw new RangeError(`${name} must be at most ${MAX_ATTEMPT_KG} kg, got ${kg}`);
  return kg;
}

/**
 * The lightest next attempt the rules allow after `previousKg`, and the step to go up in.
 * After a good lift: at least 2.5 kg heavier. After a miss: the same weight again or heavier, never
 * lighter. Always on the 2.5 kg grid (0.5 kg for a record attempt) and loadable with the discs.
 */
export function nextAttemptOptions(
  previousKg: number,
  good: boolean,
  opts: AttemptOptions = {},
): { minKg: number; stepKg: number } {
  requireAttemptKg('previous attempt', previousKg);
  if (typeof good !== 'boolean') throw new RangeError(`good must be true or false, got ${String(good)}`);
  const stepKg = stepOf(opts);
  const floor = good ? previousKg + MIN_INCREASE_KG : previousKg;
  return { minKg: firstLoadableFrom(floor, opts), stepKg };
}

/** The first `count` weights a coach may choose from `fromKg` up: on the step grid and loadable. */
export function attemptChoices(fromKg: number, count: number, opts: AttemptOptions = {}): number[] {
  requireAttemptKg('first choice', fromKg);
  requireInteger('count', count, 1, 50);
  const out: number[] = [];
  let w = firstLoadableFrom(fromKg, opts);
  while (out.length < count && w <= MAX_ATTEMPT_KG) {
    if (loadable(w, opts)) out.push(w);
    w = (g(w) + g(stepOf(opts))) / 1000;
  }
  return out;
}

/** The earlier attempt on the same lift, when there is one, and how it went. */
export interface PreviousAttempt {
  kg: number;
  good: boolean;
}

/**
 * Why an attempt weight breaks the rules, in words a coach can act on, or null when it is allowed.
 * Checked in this order: the step grid, the discs, then the progression from the previous attempt.
 */
export function attemptProblem(kg: number, previous: PreviousAttempt | null, opts: AttemptOptions = {}): string | null {
  if (!Number.isFinite(kg) || kg <= 0) return 'Enter the attempt in kg, above 0.';
  if (kg > MAX_ATTEMPT_KG) return `Attempts go up to ${MAX_ATTEMPT_KG} kg.`;
  const step = stepOf(opts);
  if (!onStep(kg, step)) {
    return opts.record
      ? `Record attempts go in ${RECORD_STEP_KG} kg steps: ${kg} kg is not one.`
      : `Attempts must be a multiple of ${ATTEMPT_STEP_KG} kg: ${kg} kg is not (a record attempt may use ${RECORD_STEP_KG} kg steps).`;
  }
  if (!loadable(kg, opts)) {
    return `${kg} kg cannot be loaded with the competition bar, collars and discs.`;
  }
  if (previous) {
    const { minKg } = nextAttemptOptions(previous.kg, previous.good, opts);
    if (kg < minKg) {
      return previous.good
        ? `After a good lift the next attempt must be at least ${MIN_INCREASE_KG} kg heavier: at least ${minKg} kg after ${previous.kg} kg.`
        : `After a missed lift the attempt may be repeated but never lowered: at least ${minKg} kg after ${previous.kg} kg.`;
    }
  }
  return null;
}

// GL points coefficients [A, B, C] per sex, equipment and event, from the federation's published table
// (2020); see the tests for the source and how sure each value is.
export type Equipment = 'classic' | 'equipped';
export type MeetEvent = 'powerlifting' | 'bench';
export const EQUIPMENT: readonly Equipment[] = ['classic', 'equipped'];
export const MEET_EVENTS: readonly MeetEvent[] = ['powerlifting', 'bench'];
type Abc = readonly [number, number, number];
const GL: Readonly<Record<Sex, Readonly<Record<Equipment, Readonly<Record<MeetEvent, Abc>>>>>> = {
  M: {
    classic: { powerlifting: [1199.72839, 1025.18162, 0.00921], bench: [320.98041, 281.40258, 0.01008] },
    equipped: { powerlifting: [1236.25115, 1449.21864, 0.01644], bench: [381.22073, 733.79378, 0.02398] },
  },
  F: {
    classic: { powerlifting: [610.32796, 1045.59282, 0.03048], bench: [142.40398, 442.52671, 0.04724] },
    equipped: { powerlifting: [758.63878, 949.31382, 0.02435], bench: [221.82209, 357.00377, 0.02937] },
  },
};
/**
 * Our own floor: below it some of the curves' denominators approach zero (women's classic bench
 * reaches zero near 24 kg), which would give absurd points. No senior class goes this light.
 */
export const GL_MIN_BODYWEIGHT_KG = 35;

/** GL points: total × 100 / (A − B · e^(−C · bodyweight)). */
export function glPoints(
  totalKg: number,
  bodyweightKg: number,
  sex: Sex,
  opts: { equipment?: Equipment; event?: MeetEvent } = {},
): number {
  requireNonNegative('total', totalKg);
  requireFinite('bodyweight', bodyweightKg);
  if (bodyweightKg < GL_MIN_BODYWEIGHT_KG || bodyweightKg > 300) {
    throw new RangeError(
      `bodyweight must be from ${GL_MIN_BODYWEIGHT_KG} to 300 kg for GL points, got ${bodyweightKg}`,
    );
  }
  requireOneOf('sex', sex, SEXES);
  const equipment = requireOneOf('equipment', opts.equipment ?? 'classic', EQUIPMENT);
  const event = requireOneOf('event', opts.event ?? 'powerlifting', MEET_EVENTS);
  const [a, b, c] = GL[sex][equipment][event];
  return (totalKg * 100) / (a - b * Math.exp(-c * bodyweightKg));
}

/** Age groups by the calendar year of birth (the age a lifter reaches during the meet's year). */
export type AgeGroup = 'subjunior' | 'junior' | 'open' | 'masters1' | 'masters2' | 'masters3' | 'masters4';
export const AGE_GROUPS: readonly AgeGroup[] = [
  'subjunior',
  'junior',
  'open',
  'masters1',
  'masters2',
  'masters3',
  'masters4',
];
export const AGE_GROUP_LABELS: Readonly<Record<AgeGroup, string>> = {
  subjunior: 'Sub-junior',
  junior: 'Junior',
  open: 'Open',
  masters1: 'Masters 1',
  masters2: 'Masters 2',
  masters3: 'Masters 3',
  masters4: 'Masters 4',
};
/** The youngest age a lifter may compete at. */
export const MIN_COMPETITION_AGE = 14;
// The first age of each group, oldest first.
const GROUP_FROM: readonly [number, AgeGroup][] = [
  [70, 'masters4'],
  [60, 'masters3'],
  [50, 'masters2'],
  [40, 'masters1'],
  [24, 'open'],
  [19, 'junior'],
  [14, 'subjunior'],
];

/** The age group of a lifter born in `birthYear` competing in `meetYear`: 14–18 sub-junior, 19–23 junior, … */
export function ageGroup(birthYear: number, meetYear: number): AgeGroup {
  requireInteger('birth year', birthYear, 1900, 2200);
  requireInteger('meet year', meetYear, 1900, 2200);
  const age = meetYear - birthYear;
  const found = GROUP_FROM.find(([from]) => age >= from);
  if (!found) {
    throw new RangeError(`a lifter must turn at least ${MIN_COMPETITION_AGE} in the meet's year, got age ${age}`);
  }
  return found[1];
}

/** The weight-class division an age group uses: juniors and sub-juniors have the extra light class. */
export function classDivision(group: AgeGroup): Division {
  requireOneOf('age group', group, AGE_GROUPS);
  const d = group === 'junior' || group === 'subjunior' ? group : 'open';
  return requireOneOf('division', d, DIVISIONS);
}

/** The upper limit of a weight-class label ('83' → 83), or null for an open-ended class ('120+'). */
export function classLimitKg(label: string): number | null {
  if (!/^\d{2,3}\+?$/.test(label)) throw new RangeError(`weight class must look like 83 or 120+, got "${label}"`);
  return label.endsWith('+') ? null : Number(label);
}

/** One lift's attempts as they stand: the weight and, once judged, whether it was good. */
export interface JudgedAttempt {
  kg: number;
  good: boolean | null;
}

/** The best good attempt of a lift, or null when none is good yet. */
export function bestGood(attempts: readonly JudgedAttempt[]): number | null {
  const good = attempts.filter((a) => a.good === true).map((a) => a.kg);
  return good.length ? Math.max(...good) : null;
}

/** The three competition lifts in the order a meet runs them. */
export type MeetLift = 'squat' | 'bench' | 'deadlift';
export const MEET_LIFTS: readonly MeetLift[] = ['squat', 'bench', 'deadlift'];

export interface Standing {
  best: Record<MeetLift, number | null>;
  /** Sum of the best good lifts so far (a running total); final once every lift has a good attempt. */
  total: number;
  /** Every lift has a good attempt: the total counts. */
  complete: boolean;
  dots: number | null;
  gl: number | null;
}

/** The running total and points of one lifter; points need the weigh-in bodyweight. */
export function standingOf(
  attempts: Readonly<Record<MeetLift, readonly JudgedAttempt[]>>,
  bodyweightKg: number | null,
  sex: Sex,
  opts: { equipment?: Equipment } = {},
): Standing {
  const best = {
    squat: bestGood(attempts.squat),
    bench: bestGood(attempts.bench),
    deadlift: bestGood(attempts.deadlift),
  };
  const total = MEET_LIFTS.reduce((sum, l) => sum + (best[l] ?? 0), 0);
  const complete = MEET_LIFTS.every((l) => best[l] !== null);
  const scored = bodyweightKg !== null && bodyweightKg >= GL_MIN_BODYWEIGHT_KG;
  return {
    best,
    total,
    complete,
    dots: scored ? Math.round(dotsScore(total, bodyweightKg, sex) * 100) / 100 : null,
    gl: scored ? Math.round(glPoints(total, bodyweightKg, sex, { equipment: opts.equipment }) * 100) / 100 : null,
  };
}

/** What comes next on one lift: the attempt number and the weight the rules and the usual jump suggest. */
export interface NextOffer {
  attemptNo: 1 | 2 | 3;
  /** The lightest weight the rules allow (null for an opener: any loadable weight). */
  minKg: number | null;
  /** The offer: the planned opener, the usual jump after a good lift, or a repeat after a miss. */
  suggestedKg: number | null;
}

/**
 * The next attempt on a lift after the judged ones: after a good lift the previous weight plus the
 * athlete's usual jump (never under the rule's minimum), after a miss the same weight again. Null after
 * the third attempt.
 */
export function nextOffer(
  judged: readonly JudgedAttempt[],
  plannedOpener: number | null,
  jumps: readonly [number, number],
  opts: AttemptOptions = {},
): NextOffer | null {
  if (judged.length >= 3) return null;
  if (judged.length === 0) {
    const opener = plannedOpener !== null && attemptProblem(plannedOpener, null) === null ? plannedOpener : null;
    return { attemptNo: 1, minKg: null, suggestedKg: opener };
  }
  const prev = judged[judged.length - 1]!;
  const { minKg } = nextAttemptOptions(prev.kg, prev.good === true, opts);
  const jump = jumps[judged.length - 1] ?? MIN_INCREASE_KG;
  const wanted = prev.good === true ? Math.max(minKg, prev.kg + jump) : minKg;
  return {
    attemptNo: (judged.length + 1) as 2 | 3,
    minKg,
    suggestedKg: Math.min(MAX_ATTEMPT_KG, firstLoadableFrom(wanted, opts)),
  };
}
