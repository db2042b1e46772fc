// Bodyweight categories of the international federation, and the DOTS score for comparing totals across bodyweights.

import { requireNonNegative, requireOneOf, requirePositive } from './guard';

export type Sex = 'M' | 'F';
export type Division = 'open' | 'junior' | 'subjunior';
export const DIVISIONS: readonly Division[] = ['open', 'junior', 'subjunior'];
const SEXES: readonly Sex[] = ['M', 'F'];

// Upper limits in kg; the heaviest class is open-ended ("120+"). Juniors and sub-juniors add one lighter class.
const OPEN_LIMITS: Readonly<Record<Sex, readonly number[]>> = {
  M: [59, 66, 74, 83, 93, 105, 120],
  F: [47, 52, 57, 63, 69, 76, 84],
};
const YOUTH_LIMIT: Readonly<Record<Sex, number>> = { M: 53, F: 43 };

function limitsFor(sex: Sex, division: Division): readonly number[] {
  return division === 'open' ? OPEN_LIMITS[sex] : [YOUTH_LIMIT[sex], ...OPEN_LIMITS[sex]];
}

function labelsFor(sex: Sex, division: Division): readonly string[] {
  const limits = limitsFor(sex, division);
  return [...limits.map(String), `${limits[limits.length - 1]!}+`];
}

/** Category labels, lightest first, e.g. WEIGHT_CLASSES.M.open = ['59', '66', …, '120', '120+']. */
export const WEIGHT_CLASSES: Readonly<Record<Sex, Readonly<Record<Division, readonly string[]>>>> = {
  M: { open: labelsFor('M', 'open'), junior: labelsFor('M', 'junior'), subjunior: labelsFor('M', 'subjunior') },
  F: { open: labelsFor('F', 'open'), junior: labelsFor('F', 'junior'), subjunior: labelsFor('F', 'subjunior') },
};

/** The lightest category whose limit is at or above the bodyweight: 83.00 → '83', 83.01 → '93', 120.5 → '120+'. */
export function weightClass(bodyweightKg: number, sex: Sex, opts: { division?: Division } = {}): string {
  requirePositive('bodyweight', bodyweightKg);
  requireOneOf('sex', sex, SEXES);
  const division = requireOneOf('division', opts.division ?? 'open', DIVISIONS);
  const limits = limitsFor(sex, division);
  const limit = limits.find((l) => bodyweightKg <= l);
  return limit === undefined ? `${limits[limits.length - 1]!}+` : String(limit);
}

// DOTS coefficients (German federation, 2019), highest power first, and the bodyweight range they hold for.
const DOTS: Readonly<Record<Sex, { coeffs: readonly number[]; min: number; max: number }>> = {
  M: { coeffs: [-0.000001093, 0.0007391293, -0.1918759221, 24.0900756, -307.75076], min: 40, max: 210 },
  F: { coeffs: [-0.0000010706, 0.0005158568, -0.1126655495, 13.6175032, -57.96288], min: 40, max: 150 },
};

/** DOTS points: total × 500 / polynomial(bodyweight), the bodyweight clamped to the formula's range. */
export function dotsScore(totalKg: number, bodyweightKg: number, sex: Sex): number {
  requireNonNegative('total', totalKg);
  requirePositive('bodyweight', bodyweightKg);
  requireOneOf('sex', sex, SEXES);
  const { coeffs, min, max } = DOTS[sex];
  const x = Math.min(max, Math.max(min, bodyweightKg));
  const denominator = coeffs.reduce((acc, c) => acc * x + c, 0);
  return (totalKg * 500) / denominator;
}
