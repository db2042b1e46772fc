// The numbers the week page works out in the browser: the suggested top set, the live e1RM of the
// form, and how it compares with the variant's record. Same maths as the server (shared/calc).
import { fromKg, isValidRpe, setE1rm, roundToLoadable, toKg, type WeightUnit } from '../../../../shared/calc';
import type { Scheme, VariantRecord } from '../../../../shared/schemas';

export const SCHEME_LABEL: Readonly<Record<Scheme, string>> = {
  single: 'Work up to a top single',
  triple: 'Work up to a top triple',
  five: 'Work up to a top five',
};

/**
 * A top set for `reps` that matches a best e1RM, by turning Epley round (w = e1RM / (1 + r/30)), rounded
 * down to a weight the unit's plates can load: a starting point for the warm-up, not a target to hit.
 */
export function suggestedTopSet(bestE1rmKg: number, reps: number, unit: WeightUnit): number {
  const inUnit = fromKg(bestE1rmKg, unit);
  const weight = reps === 1 ? inUnit : inUnit / (1 + reps / 30);
  return roundToLoadable(weight, unit, { mode: 'down' });
}

export interface LiveEstimate {
  e1rmKg: number;
  /** Beats the variant's best e1RM (or there is none yet). */
  beatsRecord: boolean;
  firstOnVariant: boolean;
}

/**
 * The e1RM of what the form holds (RPE-aware once a valid RPE is typed, like the stored one), or null while
 * the weight or reps are not usable yet.
 */
export function liveEstimate(
  weight: number,
  reps: number,
  unit: WeightUnit,
  record: VariantRecord,
  rpe: number | null = null,
): LiveEstimate | null {
  if (!Number.isFinite(weight) || weight <= 0 || !Number.isInteger(reps) || reps < 1 || reps > 12) return null;
  const weightKg = Math.round(toKg(weight, unit) * 100) / 100;
  const e1rmKg = setE1rm(weightKg, reps, rpe !== null && isValidRpe(rpe) ? rpe : null);
  const best = record.bestE1rm?.e1rmKg;
  return { e1rmKg, beatsRecord: best === undefined || e1rmKg > best, firstOnVariant: best === undefined };
}
