// Top sets and records, the same in the browser and on the server: the stored e1RM of a logged set,
// the records per variant, how a new set compares with them, and the top set a record suggests.
import { isValidRpe } from './rpe';
import { setE1rm, weightForReps } from './loads';
import { roundToLoadable } from './plates';
import { fromKg, toKg, type WeightUnit } from './units';

/**
 * e1RM stored with a top set, rounded to 0.01 kg like the column: Epley on the reps done plus the reps in
 * reserve the logged RPE says were left (a single at RPE 8 is not a max), plain Epley without an RPE. The
 * seeded history is made the same way, so a record means the same thing from week to week.
 */
export function topSetE1rmKg(weightKg: number, reps: number, rpe: number | null = null): number {
  return setE1rm(weightKg, reps, rpe);
}

/** What a record is made of: the weight, the reps and the stored e1RM of a top set. */
export interface SetMark {
  weightKg: number;
  reps: number;
  e1rmKg: number;
}

/** Heavier weight wins; at the same weight, more reps. */
export function heavierThan(a: SetMark, b: SetMark): boolean {
  return a.weightKg > b.weightKg || (a.weightKg === b.weightKg && a.reps > b.reps);
}

/** Best e1RM and heaviest weight × reps; of equal sets, the first in the list counts. */
export function recordOf<T extends SetMark>(sets: readonly T[]): { bestE1rm: T | null; heaviest: T | null } {
  let bestE1rm: T | null = null;
  let heaviest: T | null = null;
  for (const s of sets) {
    if (!bestE1rm || s.e1rmKg > bestE1rm.e1rmKg) bestE1rm = s;
    if (!heaviest || heavierThan(s, heaviest)) heaviest = s;
  }
  return { bestE1rm, heaviest };
}

/** An e1RM is a new record when it beats the best so far (a tie is not), or is the first on the variant. */
export function beatsBest(e1rmKg: number, bestE1rmKg: number | null | undefined): boolean {
  return bestE1rmKg === null || bestE1rmKg === undefined || e1rmKg > bestE1rmKg;
}

/** How a new set compares with every earlier set on the same variant. */
export function compareWithRecord(set: SetMark, earlier: { bestE1rm: SetMark | null; heaviest: SetMark | null }) {
  return {
    firstOnVariant: earlier.bestE1rm === null,
    newRecord: beatsBest(set.e1rmKg, earlier.bestE1rm?.e1rmKg),
    newHeaviest: earlier.heaviest === null || heavierThan(set, earlier.heaviest),
  };
}

/**
 * A top set for `reps` that matches a best e1RM, by turning Epley round (w = e1RM / (1 + r/30)), rounded
 * down to a weight the unit's plates can load: a starting point for the warm-up, not a target to hit.
 */
export function suggestedTopSet(bestE1rmKg: number, reps: number, unit: WeightUnit): number {
  return roundToLoadable(weightForReps(fromKg(bestE1rmKg, unit), reps), unit, { mode: 'down' });
}

export interface LiveEstimate {
  e1rmKg: number;
  /** Beats the variant's best e1RM (or there is none yet). */
  beatsRecord: boolean;
  firstOnVariant: boolean;
}

/**
 * The e1RM of a set being typed (RPE-aware once a valid RPE is typed, like the stored one) against the
 * variant's best, or null while the weight or reps are not usable yet.
 */
export function liveEstimate(
  weight: number,
  reps: number,
  unit: WeightUnit,
  bestE1rmKg: number | null | undefined,
  rpe: number | null = null,
): LiveEstimate | null {
  if (!Number.isFinite(weight) || weight <= 0 || !Number.isInteger(reps) || reps < 1 || reps > 12) return null;
  const weightKg = Math.round(toKg(weight, unit) * 100) / 100;
  const e1rmKg = topSetE1rmKg(weightKg, reps, rpe !== null && isValidRpe(rpe) ? rpe : null);
  const first = bestE1rmKg === null || bestE1rmKg === undefined;
  return { e1rmKg, beatsRecord: beatsBest(e1rmKg, bestE1rmKg), firstOnVariant: first };
}
