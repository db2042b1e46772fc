// Working loads of the training week: the training max, speed-day waves, back-off sets, loads for an RPE
// target and a suggested opening range for a variant the athlete has never done.

import { E1RM_MAX_REPS, estimateOneRepMax, estimateOneRepMaxAtRpe } from './e1rm';
import { requireFinite, requireInteger, requireOneOf, requirePositive } from './guard';
import { roundToLoadable } from './plates';
import { rpeToRir } from './rpe';
import type { WeightUnit } from './units';
import { SPEED_SETS_REPS } from '../engine/week';

export type TrainingLift = 'squat' | 'bench' | 'deadlift';
export type Accommodation = 'none' | 'bands' | 'chains';
export const ACCOMMODATIONS: readonly Accommodation[] = ['none', 'bands', 'chains'];

/** Speed-day and training-max percentages a coach may set (of a max), in percent. */
export const LOAD_PCT_MIN = 30;
export const LOAD_PCT_MAX = 100;
/** A training max a little below the estimate (common practice, no published source). */
export const DEFAULT_TRAINING_MAX_PCT = 90;
export const TRAINING_MAX_PCT_MIN = 50;

/**
 * Share of the planned load that bands or chains supply at the top of the lift, so the bar itself carries
 * the rest (common practice, value from memory: coaches quote about 20–25 % at lockout).
 */
export const ACCOMMODATION_SHARE = 0.2;

function requirePct(name: string, pct: number, min = LOAD_PCT_MIN, max = LOAD_PCT_MAX): number {
  requireFinite(name, pct);
  if (pct < min || pct > max) throw new RangeError(`${name} must be from ${min} to ${max} %, got ${pct}`);
  return pct;
}

const round2 = (n: number) => Math.round(n * 100) / 100;

/** Training weights move in the gym's usual steps (common practice): 2.5 kg or 5 lb. */
export const GYM_STEP: Readonly<Record<WeightUnit, number>> = { kg: 2.5, lb: 5 };

/** Rounded down to the gym step, but never below the empty bar with collars. */
function downToLoadable(weight: number, unit: WeightUnit): number {
  const bar = roundToLoadable(0, unit, { mode: 'up' });
  const step = GYM_STEP[unit];
  return Math.max(bar, Math.floor(weight / step + 1e-9) * step);
}

/**
 * The e1RM of a logged set: RPE-aware when an RPE is given, counting reps + reps in reserve as reps to
 * failure (common practice on the RIR-based scale). Beyond the formula's rep limit the count is capped there,
 * so a long easy set is still estimated (conservatively) rather than refused. Rounded to 0.01.
 */
export function setE1rm(weight: number, reps: number, rpe: number | null | undefined): number {
  if (rpe === null || rpe === undefined) return round2(estimateOneRepMax(weight, reps));
  const max = E1RM_MAX_REPS.epley;
  requireInteger('reps', reps, 1, max);
  if (reps + rpeToRir(rpe) > max) return round2(estimateOneRepMax(weight, max));
  return round2(estimateOneRepMaxAtRpe(weight, reps, rpe));
}

/** A working max below the estimate: `pct` percent (50–100, default 90) of the e1RM, rounded to 0.01. */
export function trainingMax(e1rmKg: number, pct: number = DEFAULT_TRAINING_MAX_PCT): number {
  requirePositive('e1RM', e1rmKg);
  requirePct('training-max share', pct, TRAINING_MAX_PCT_MIN, 100);
  return round2((e1rmKg * pct) / 100);
}

/**
 * The weight for `reps` at an RPE target from an e1RM: Epley turned round with reps + reps in reserve as the
 * reps to failure (the inverse of the RPE-aware estimate), not rounded to plates.
 */
export function weightForReps(e1rm: number, reps: number, rpe = 10): number {
  requirePositive('e1RM', e1rm);
  requireInteger('reps', reps, 1, E1RM_MAX_REPS.epley);
  const toFailure = reps + rpeToRir(rpe);
  if (toFailure > E1RM_MAX_REPS.epley) {
    throw new RangeError(`reps plus reps in reserve must be at most ${E1RM_MAX_REPS.epley}, got ${toFailure}`);
  }
  return toFailure === 1 ? e1rm : e1rm / (1 + toFailure / 30);
}

export interface SpeedWeek {
  week: number;
  /** Planned load at the top of the lift, percent of the training max. */
  pct: number;
  /** What goes on the bar (plates and collars included), loadable with the default plates. */
  barKg: number;
  /** What the bands or chains add at the top (0 without). */
  accommodationKg: number;
  sets: number;
  reps: number;
}

export interface SpeedWaveOptions {
  weeks: number;
  lift: TrainingLift;
  startPct?: number;
  stepPct?: number;
  accommodation?: Accommodation;
  sets?: number;
  reps?: number;
  unit?: WeightUnit;
}

/**
 * A speed-day wave: week i at startPct + i·stepPct of the training max (default 50, 55, 60 %), the lift's
 * usual sets × reps, and with bands or chains the bar lowered so bar + accommodation at the top is the
 * planned load (common practice, no single published source).
 */
export function speedWave(maxKg: number, opts: SpeedWaveOptions): SpeedWeek[] {
  requirePositive('training max', maxKg);
  requireInteger('weeks', opts.weeks, 1, 6);
  requireOneOf('lift', opts.lift, ['squat', 'bench', 'deadlift'] as const);
  const accommodation = requireOneOf('accommodation', opts.accommodation ?? 'none', ACCOMMODATIONS);
  const start = requirePct('start percentage', opts.startPct ?? 50);
  const step = requireFinite('step percentage', opts.stepPct ?? 5);
  if (step < 0 || step > 20) throw new RangeError(`step percentage must be from 0 to 20, got ${step}`);
  const last = start + step * (opts.weeks - 1);
  requirePct('last week percentage', last);
  const sets = requireInteger('sets', opts.sets ?? SPEED_SETS_REPS[opts.lift].sets, 1, 20);
  const reps = requireInteger('reps', opts.reps ?? SPEED_SETS_REPS[opts.lift].reps, 1, 10);
  const unit = opts.unit ?? 'kg';
  return Array.from({ length: opts.weeks }, (_, i) => {
    const pct = round2(start + step * i);
    const planned = (maxKg * pct) / 100;
    const share = accommodation === 'none' ? 0 : ACCOMMODATION_SHARE;
    const barKg = downToLoadable(planned * (1 - share), unit);
    const accommodationKg = share === 0 ? 0 : round2(Math.max(0, planned - barKg));
    return { week: i + 1, pct, barKg, accommodationKg, sets, reps };
  });
}

export interface BackOffOptions {
  sets: number;
  /** Reps per back-off set; default the top set's reps. */
  reps?: number;
  /** How much lighter than the top set, percent (default 10). */
  dropPct?: number;
  unit?: WeightUnit;
}

/**
 * Back-off sets after a top set: the same weight for each set, `dropPct` percent lighter than the top set,
 * rounded down to a loadable weight, never below the bar (common practice: 5–15 % lighter, no published source).
 */
export function backOffSets(topSet: number, topReps: number, opts: BackOffOptions): { weight: number; reps: number }[] {
  requirePositive('top set', topSet);
  requireInteger('top set reps', topReps, 1, E1RM_MAX_REPS.epley);
  const sets = requireInteger('back-off sets', opts.sets, 1, 10);
  const reps = requireInteger('back-off reps', opts.reps ?? topReps, 1, 20);
  const drop = requireFinite('drop', opts.dropPct ?? 10);
  if (drop < 0 || drop > 50) throw new RangeError(`drop must be from 0 to 50 %, got ${drop}`);
  const unit = opts.unit ?? 'kg';
  const weight = downToLoadable((topSet * (100 - drop)) / 100, unit);
  return Array.from({ length: sets }, () => ({ weight, reps }));
}

export interface OpeningRange {
  low: number;
  high: number;
  /** Always true: a suggestion from other lifts, not a measured number. */
  estimate: true;
  basedOn: number;
}

/**
 * A suggested opening weight for `reps` on a variant never done before, from e1RMs of related lifts (same
 * family, else the competition lift): the middle estimate turned into a weight for `reps` at RPE 10, then
 * 75–85 % of it, so the athlete starts below what they can do (common practice, no published source).
 */
export function openingRange(
  relatedE1rms: readonly number[],
  reps: number,
  unit: WeightUnit = 'kg',
): OpeningRange | null {
  if (relatedE1rms.length === 0) return null;
  for (const e of relatedE1rms) requirePositive('related e1RM', e);
  const sorted = [...relatedE1rms].sort((a, b) => a - b);
  const mid = sorted[Math.floor((sorted.length - 1) / 2)]!;
  const at = weightForReps(mid, reps);
  const low = downToLoadable(at * 0.75, unit);
  const high = Math.max(low, downToLoadable(at * 0.85, unit));
  return { low, high, estimate: true, basedOn: relatedE1rms.length };
}

/** The back-off work a team sets after the max-effort top set: how many sets, and how much lighter. */
export interface BackOffRule {
  /** 0 = no back-off sets. */
  sets: number;
  /** Percent lighter than the top set. */
  dropPct: number;
}
/**
 * What a team may set. At most 5 sets: after a true max-effort top set one to three are usual, and more turns
 * the day into volume work. A drop of 5–25 %: under 5 % the gym step rounds a back-off set to the top set
 * itself, past 25 % it is light work rather than back-off work (our choice, from common practice).
 */
export const BACK_OFF_SETS_MAX = 5;
export const BACK_OFF_DROP_MIN = 5;
export const BACK_OFF_DROP_MAX = 25;
/** Two sets about 10 % lighter than the top set (common practice, no single published source). */
export const DEFAULT_BACK_OFF: Readonly<BackOffRule> = { sets: 2, dropPct: 10 };

export interface BackOffPlan {
  /** What the sets come from: the top set logged this week, or the suggested one before any is logged. */
  basis: 'logged' | 'suggested';
  /** That top set's weight, in the unit asked for. */
  topSet: number;
  sets: { weight: number; reps: number }[];
}

/**
 * A max-effort pick's back-off sets, in `unit`: from the heaviest top set logged this week when there is
 * one (its reps), else from the suggested top set at the scheme's reps; null with 0 sets or neither.
 */
export function backOffPlan(
  rule: BackOffRule,
  top: { logged: readonly { weight: number; reps: number }[]; suggested: number | null; schemeReps: number },
  unit: WeightUnit = 'kg',
): BackOffPlan | null {
  requireInteger('back-off sets', rule.sets, 0, BACK_OFF_SETS_MAX);
  if (rule.sets === 0) return null;
  const heaviest = [...top.logged].sort((a, b) => b.weight - a.weight || b.reps - a.reps)[0];
  const basis = heaviest
    ? { basis: 'logged' as const, ...heaviest }
    : top.suggested !== null && top.suggested > 0
      ? { basis: 'suggested' as const, weight: top.suggested, reps: top.schemeReps }
      : null;
  if (!basis) return null;
  const sets = backOffSets(basis.weight, Math.min(basis.reps, E1RM_MAX_REPS.epley), {
    sets: rule.sets,
    dropPct: rule.dropPct,
    unit,
  });
  return { basis: basis.basis, topSet: basis.weight, sets };
}
