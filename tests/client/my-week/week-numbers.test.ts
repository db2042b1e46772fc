// The week page's own numbers: chart rows and the plate drawing's layout (the suggested top set and the
// live e1RM are shared maths, tested with shared/calc).
import { describe, expect, it } from 'vitest';
import { layoutSleeve } from '../../../src/features/my-week/components/plate-diagram';
import { e1rmRows, weeklyBest } from '../../../src/features/history/components/chart-data';
import type { E1rmPoint } from '../../../shared/schemas';

describe('chart rows', () => {
  const p = (week: string, performedOn: string, e1rmKg: number, specificity: number): E1rmPoint => ({
    topSetId: 1,
    week,
    performedOn,
    e1rmKg,
    weightKg: e1rmKg,
    reps: 1,
    variantId: 1,
    variantName: 'v',
    specificity,
  });
  const points = [
    p('2027-W01', '2027-01-05', 150, 0.9),
    p('2027-W01', '2027-01-07', 170, 0.5),
    p('2027-W02', '2027-01-12', 160, 0.85),
  ];

  it('takes each week’s best, optionally over close variants only', () => {
    expect(weeklyBest(points, 'kg', false).map((r) => r.best)).toEqual([170, 160]);
    expect(weeklyBest(points, 'kg', true).map((r) => r.best)).toEqual([150, 160]);
    expect(e1rmRows(points, 'kg', true)).toHaveLength(2);
    expect(e1rmRows(points, 'lb', false)[0]!.e1rm).toBe(330.7); // 150 kg ÷ 0.45359237
  });
});

describe('layoutSleeve', () => {
  it('puts discs side by side, heaviest innermost, taller for heavier kilo discs', () => {
    const { placed, collarX } = layoutSleeve([25, 10, 2.5], 'kg');
    expect(placed.map((d) => d.w)).toEqual([25, 10, 2.5]);
    for (let i = 1; i < placed.length; i++)
      expect(placed[i]!.x).toBeGreaterThan(placed[i - 1]!.x + placed[i - 1]!.width - 1e-9);
    expect(placed[0]!.h).toBeGreaterThan(placed[2]!.h);
    expect(collarX).toBeGreaterThan(placed[2]!.x + placed[2]!.width);
    expect(placed[0]!.colour.name).toBe('red'); // federation colour of the 25 kg disc
  });
});
