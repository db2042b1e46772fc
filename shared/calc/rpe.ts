// The repetitions-in-reserve RPE scale used when logging top sets: 10 = no rep left, 9 = one left,
// 8 = two left, halves in between. The product accepts RPE 6–10 in half steps.

import { requireFinite } from './guard';

export const RPE_MIN = 6;
export const RPE_MAX = 10;
/** Every RPE value a top set may be logged with, lightest first. */
export const RPE_VALUES: readonly number[] = Array.from(
  { length: (RPE_MAX - RPE_MIN) * 2 + 1 },
  (_, i) => RPE_MIN + i / 2,
);

export function isValidRpe(rpe: number): boolean {
  return Number.isFinite(rpe) && rpe >= RPE_MIN && rpe <= RPE_MAX && Number.isInteger(rpe * 2);
}

export function assertRpe(rpe: number): number {
  requireFinite('RPE', rpe);
  if (!isValidRpe(rpe)) {
    throw new RangeError(`RPE must be from ${RPE_MIN} to ${RPE_MAX} in half steps, got ${rpe}`);
  }
  return rpe;
}

/** Repetitions in reserve for an RPE: 10 − RPE (RPE 8.5 → 1.5 reps left). */
export function rpeToRir(rpe: number): number {
  return RPE_MAX - assertRpe(rpe);
}

/** The RPE for a number of repetitions in reserve (0–4 in half steps). */
export function rirToRpe(rir: number): number {
  requireFinite('reps in reserve', rir);
  const rpe = RPE_MAX - rir;
  if (!isValidRpe(rpe)) {
    throw new RangeError(`reps in reserve must be from 0 to ${RPE_MAX - RPE_MIN} in half steps, got ${rir}`);
  }
  return rpe;
}
