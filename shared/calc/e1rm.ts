// Estimated one-rep max (e1RM) from a set taken to (or near) failure, by the seven published formulas.

import { requireFinite, requireInteger, requireOneOf, requirePositive } from './guard';
import { rpeToRir } from './rpe';

export type E1rmFormula = 'epley' | 'brzycki' | 'lander' | 'lombardi' | 'mayhew' | 'oconner' | 'wathan';

export const E1RM_FORMULAS: readonly E1rmFormula[] = [
  'epley',
  'brzycki',
  'lander',
  'lombardi',
  'mayhew',
  'oconner',
  'wathan',
];

export const E1RM_FORMULA_LABELS: Readonly<Record<E1rmFormula, string>> = {
  epley: 'Epley',
  brzycki: 'Brzycki',
  lander: 'Lander',
  lombardi: 'Lombardi',
  mayhew: 'Mayhew et al.',
  oconner: "O'Conner et al.",
  wathan: 'Wathan',
};

/**
 * Highest rep count each formula accepts. The equations were fitted to sets of about 10 reps or fewer and
 * lose accuracy beyond that, so we stop at 12: it covers the handbook %1RM table (which runs to 12) and the
 * common "set of 12", and refuses the long sets where a number would only mislead. Brzycki's and Lander's
 * denominators reach zero near 37 reps, far outside this limit. One limit for all keeps results comparable.
 */
export const E1RM_MAX_REPS: Readonly<Record<E1rmFormula, number>> = {
  epley: 12,
  brzycki: 12,
  lander: 12,
  lombardi: 12,
  mayhew: 12,
  oconner: 12,
  wathan: 12,
};

// w = load lifted, r = repetitions to failure.
const EQUATIONS: Readonly<Record<E1rmFormula, (w: number, r: number) => number>> = {
  epley: (w, r) => w * (1 + r / 30),
  brzycki: (w, r) => (w * 36) / (37 - r),
  lander: (w, r) => (100 * w) / (101.3 - 2.67123 * r),
  lombardi: (w, r) => w * r ** 0.1,
  mayhew: (w, r) => (100 * w) / (52.2 + 41.9 * Math.exp(-0.055 * r)),
  oconner: (w, r) => w * (1 + 0.025 * r),
  wathan: (w, r) => (100 * w) / (48.8 + 53.8 * Math.exp(-0.075 * r)),
};

function evaluate(weight: number, reps: number, formula: E1rmFormula): number {
  // Our convention: a single is the max itself. Several equations return a little more than w at r = 1;
  // all of them return at least w there, so this keeps every formula non-decreasing in reps.
  if (reps === 1) return weight;
  return EQUATIONS[formula](weight, reps);
}

/** e1RM in the unit of `weight`. Reps must be a whole number from 1 to the formula's limit. */
export function estimateOneRepMax(weight: number, reps: number, formula: E1rmFormula = 'epley'): number {
  requireOneOf('formula', formula, E1RM_FORMULAS);
  requirePositive('weight', weight);
  requireInteger('reps', reps, 1, E1RM_MAX_REPS[formula]);
  return evaluate(weight, reps, formula);
}

/**
 * e1RM of a set stopped short of failure, treating reps + reps in reserve as the reps to failure
 * (common practice with the RIR-based RPE scale, no single published source). 5 reps at RPE 8 counts as 7.
 */
export function estimateOneRepMaxAtRpe(
  weight: number,
  reps: number,
  rpe: number,
  formula: E1rmFormula = 'epley',
): number {
  requireOneOf('formula', formula, E1RM_FORMULAS);
  requirePositive('weight', weight);
  const max = E1RM_MAX_REPS[formula];
  requireInteger('reps', reps, 1, max);
  const toFailure = reps + rpeToRir(rpe);
  requireFinite('reps to failure', toFailure);
  if (toFailure > max) {
    throw new RangeError(
      `reps plus reps in reserve must be at most ${max} for ${E1RM_FORMULA_LABELS[formula]}, got ${toFailure}`,
    );
  }
  return evaluate(weight, toFailure, formula);
}
