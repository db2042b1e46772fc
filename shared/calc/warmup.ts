// Warm-up ramp from the empty bar up to just under the day's top set, every step loadable.

import { requireInteger, requireNonNegative, requireOneOf } from './guard';
import { isLoadable, loadableBelow, roundToLoadable, type BarOptions } from './plates';
import { WEIGHT_UNITS, type WeightUnit } from './units';

export interface WarmupStep {
  weight: number;
  reps: number;
}

export const DEFAULT_WARMUP_STEPS = 5;
export const MAX_WARMUP_STEPS = 10;
/**
 * Warm-ups land on round numbers a lifter can load without change discs: multiples of 2.5 kg (the step of
 * attempts) or 5 lb. A multiple the plates cannot make falls back to the nearest loadable weight.
 */
export const WARMUP_INCREMENT: Readonly<Record<WeightUnit, number>> = { kg: 2.5, lb: 5 };
/** The last warm-up sits near this share of the top set (common practice, no single source). */
export const LAST_WARMUP_FRACTION = 0.9;

// Reps fall as the load climbs (common practice): the bar for 10, then 5, 3, 2 and singles near the top.
function repsFor(fraction: number, isBar: boolean): number {
  if (isBar) return 10;
  if (fraction <= 0.5) return 5;
  if (fraction <= 0.7) return 3;
  if (fraction <= 0.85) return 2;
  return 1;
}

/**
 * Up to `steps` warm-up sets (default 5, 1 to 10), the first the empty bar with collars, the rest evenly
 * spaced up to about 90% of the top set, each rounded to a multiple of 2.5 kg or 5 lb that the unit's
 * default plates (or those given) can load. Weights strictly rise and stay below the top set; steps that would
 * repeat a weight are dropped, so a light top set gets fewer steps. A top set at or below the empty bar
 * needs no warm-up: the result is empty.
 */
export function warmupRamp(
  topSet: number,
  opts: { unit?: WeightUnit; steps?: number } & BarOptions = {},
): WarmupStep[] {
  requireNonNegative('top set', topSet);
  const unit = requireOneOf('unit', opts.unit ?? 'kg', WEIGHT_UNITS);
  const steps = requireInteger('steps', opts.steps ?? DEFAULT_WARMUP_STEPS, 1, MAX_WARMUP_STEPS);
  const increment = WARMUP_INCREMENT[unit];
  const empty = roundToLoadable(0, unit, opts);
  if (topSet <= empty) return [];
  const last = LAST_WARMUP_FRACTION * topSet;
  const out: WarmupStep[] = [];
  for (let i = 0; i < steps; i++) {
    const aim = steps === 1 ? empty : empty + ((last - empty) * i) / (steps - 1);
    const round = Math.round(Math.max(aim, empty) / increment) * increment;
    let weight = isLoadable(round, unit, opts) ? round : roundToLoadable(round, unit, opts);
    if (weight >= topSet) weight = loadableBelow(topSet, unit, opts) ?? empty;
    const prev = out[out.length - 1];
    if (prev && weight <= prev.weight) continue;
    out.push({ weight, reps: repsFor(weight / topSet, i === 0) });
  }
  return out;
}
