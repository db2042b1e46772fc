// Chart rows from the history series: dates as day numbers for a time axis, weights in the viewer's
// unit, and each week's best e1RM per lift for the trend line.
import { fromKg, type WeightUnit } from '../../../../shared/calc';
import type { Bodyweight, E1rmPoint } from '../../../../shared/schemas';

/** Variants at least this close to the competition lift are drawn as filled points. */
export const CLOSE_SPECIFICITY = 0.8;

const DAY_MS = 86_400_000;
export const dayOf = (isoDate: string) => Math.round(Date.parse(`${isoDate}T00:00:00Z`) / DAY_MS);
const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
export const dayLabel = (day: number) => dateFmt.format(new Date(day * DAY_MS));

const round1 = (x: number) => Math.round(x * 10) / 10;

export interface E1rmRow {
  day: number;
  e1rm: number;
  variantName: string;
  set: string;
  close: boolean;
}

export function e1rmRows(points: readonly E1rmPoint[], unit: WeightUnit, onlyClose: boolean): E1rmRow[] {
  return points
    .filter((p) => !onlyClose || p.specificity >= CLOSE_SPECIFICITY)
    .map((p) => ({
      day: dayOf(p.performedOn),
      e1rm: round1(fromKg(p.e1rmKg, unit)),
      variantName: p.variantName,
      set: `${p.reps} × ${round1(fromKg(p.weightKg, unit))} ${unit}`,
      close: p.specificity >= CLOSE_SPECIFICITY,
    }));
}

/** The best e1RM of each ISO week, at the day of that week's best set, oldest first. */
export function weeklyBest(points: readonly E1rmPoint[], unit: WeightUnit, onlyClose: boolean) {
  const best = new Map<string, E1rmPoint>();
  for (const p of points) {
    if (onlyClose && p.specificity < CLOSE_SPECIFICITY) continue;
    const b = best.get(p.week);
    if (!b || p.e1rmKg > b.e1rmKg) best.set(p.week, p);
  }
  return [...best.values()]
    .sort((a, b) => a.performedOn.localeCompare(b.performedOn))
    .map((p) => ({ day: dayOf(p.performedOn), best: round1(fromKg(p.e1rmKg, unit)) }));
}

export function bodyweightRows(readings: readonly Bodyweight[], unit: WeightUnit) {
  return [...readings]
    .sort((a, b) => a.measuredOn.localeCompare(b.measuredOn))
    .map((r) => ({ day: dayOf(r.measuredOn), weight: round1(fromKg(r.weightKg, unit)) }));
}

const TICK = { fontSize: 12, fill: '#364a70' };
/** Axis settings both charts share: days along the bottom, plain weights up the side. */
export const TIME_AXIS = {
  dataKey: 'day',
  type: 'number',
  domain: ['dataMin', 'dataMax'],
  tickFormatter: dayLabel,
  tick: TICK,
} as const;
export const WEIGHT_AXIS = {
  type: 'number',
  domain: ['auto', 'auto'],
  tick: TICK,
  width: 44,
  tickFormatter: (v: number) => String(Math.round(v * 10) / 10),
} as const;
