// Kilograms and pounds. The product stores kilograms; the user picks the unit shown.

import { requireInteger, requireNonNegative, requireOneOf } from './guard';

export type WeightUnit = 'kg' | 'lb';
export const WEIGHT_UNITS: readonly WeightUnit[] = ['kg', 'lb'];

/** The international pound, defined exactly by the 1959 yard and pound agreement. */
export const KG_PER_LB = 0.45359237;

export function kgToLb(kg: number): number {
  return requireNonNegative('kg', kg) / KG_PER_LB;
}

export function lbToKg(lb: number): number {
  return requireNonNegative('lb', lb) * KG_PER_LB;
}

/** A kilogram value in the chosen unit. */
export function fromKg(kg: number, unit: WeightUnit): number {
  requireOneOf('unit', unit, WEIGHT_UNITS);
  return unit === 'kg' ? requireNonNegative('kg', kg) : kgToLb(kg);
}

/** A value in the chosen unit, in kilograms (for storage). */
export function toKg(value: number, unit: WeightUnit): number {
  requireOneOf('unit', unit, WEIGHT_UNITS);
  return unit === 'kg' ? requireNonNegative('weight', value) : lbToKg(value);
}

/**
 * "102.5 kg", "225 lb": a stored kilogram value shown in the chosen unit, trailing zeros dropped.
 * Kilograms keep two decimals (1.25 kg discs), pounds one, unless `decimals` says otherwise. The space
 * is a no-break space so the unit never wraps away from its number.
 */
export function formatWeight(kg: number, unit: WeightUnit, opts: { decimals?: number } = {}): string {
  return formatInUnit(fromKg(kg, unit), unit, opts);
}

/** The same for a value already in `unit` (a load worked out in the athlete's unit). */
export function formatInUnit(value: number, unit: WeightUnit, opts: { decimals?: number } = {}): string {
  const decimals = opts.decimals ?? (unit === 'kg' ? 2 : 1);
  requireInteger('decimals', decimals, 0, 6);
  const factor = 10 ** decimals;
  const rounded = Math.round(value * factor) / factor;
  return `${String(rounded)}\u00a0${unit}`;
}
