// The week page's own numbers: the suggested top set, the live e1RM against the record, chart rows,
// and the plate drawing's layout.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateOneRepMax, isLoadable, lbToKg } from '../../../shared/calc';
import { liveEstimate, suggestedTopSet } from '../../../src/features/my-week/lib/top-set-math';
import { layoutSleeve } from '../../../src/features/my-week/components/plate-diagram';
import { e1rmRows, weeklyBest } from '../../../src/features/history/components/chart-data';
import type { E1rmPoint, TopSet } from '../../../shared/schemas';

const record = (e1rmKg: number | null) => ({
  bestE1rm: e1rmKg === null ? null : ({ e1rmKg } as TopSet),
  heaviest: null,
});

describe('suggestedTopSet', () => {
  it('turns Epley round and rounds down to a loadable weight', () => {
    // Epley (1985): w = 1RM / (1 + r/30); 165 / 1.1 = 150 kg for a triple.
    expect(suggestedTopSet(165, 3, 'kg')).toBe(150);
    expect(suggestedTopSet(122.5, 1, 'kg')).toBe(122.5);
  });

  it('never suggests more than the record supports, and is always loadable (kg and lb)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 60, max: 400 }),
        fc.constantFrom(1, 3, 5),
        fc.constantFrom('kg', 'lb'),
        (best, reps, unit) => {
          const w = suggestedTopSet(best, reps, unit as 'kg' | 'lb');
          const wKg = unit === 'kg' ? w : lbToKg(w);
          expect(estimateOneRepMax(wKg, reps)).toBeLessThanOrEqual(best + 1e-9);
          expect(isLoadable(w, unit as 'kg' | 'lb')).toBe(true);
        },
      ),
    );
  });
});

describe('liveEstimate', () => {
  it('compares the e1RM of what is typed with the record, in kilograms', () => {
    expect(liveEstimate(150, 3, 'kg', record(165))).toEqual({ e1rmKg: 165, beatsRecord: false, firstOnVariant: false });
    expect(liveEstimate(152.5, 3, 'kg', record(165))?.beatsRecord).toBe(true);
    // 365 lb × 0.45359237 = 165.56 kg, a single: beats a 165 kg record.
    expect(liveEstimate(365, 1, 'lb', record(165))).toEqual({
      e1rmKg: 165.56,
      beatsRecord: true,
      firstOnVariant: false,
    });
    expect(liveEstimate(60, 5, 'kg', record(null))?.firstOnVariant).toBe(true);
  });

  it('waits for usable input', () => {
    expect(liveEstimate(NaN, 3, 'kg', record(100))).toBeNull();
    expect(liveEstimate(100, 0, 'kg', record(100))).toBeNull();
    expect(liveEstimate(100, 13, 'kg', record(100))).toBeNull();
  });
});

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

describe('liveEstimate with an RPE', () => {
  it('adds the reps in reserve, like the stored estimate', () => {
    // 1 × 130 at RPE 8: two reps left (Zourdos et al., JSCR 2016), Epley (1985) at 3 reps: 130 × 1.1 = 143.
    expect(liveEstimate(130, 1, 'kg', record(140), 8)).toEqual({
      e1rmKg: 143,
      beatsRecord: true,
      firstOnVariant: false,
    });
    // An RPE that is not on the scale yet (still being typed) is left out.
    expect(liveEstimate(130, 1, 'kg', record(140), 8.3)?.e1rmKg).toBe(130);
  });
});
