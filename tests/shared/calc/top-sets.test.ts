// Top sets and records, the same maths on both sides: the stored e1RM, records per variant, how a new
// set compares with them, the suggested top set and the live estimate while a set is typed.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  compareWithRecord,
  estimateOneRepMax,
  heavierThan,
  isLoadable,
  lbToKg,
  liveEstimate,
  recordOf,
  suggestedTopSet,
  topSetE1rmKg,
} from '../../../shared/calc';

const set = (weightKg: number, reps: number) => ({ weightKg, reps, e1rmKg: topSetE1rmKg(weightKg, reps) });

describe('topSetE1rmKg', () => {
  it('is Epley on the reps done, a single being the weight itself', () => {
    // Epley (1985): 1RM = w × (1 + r/30); 100 kg × 5 → 116.67 kg.
    expect(topSetE1rmKg(100, 5)).toBe(116.67);
    expect(topSetE1rmKg(182.5, 1)).toBe(182.5);
  });
});

describe('recordOf and compareWithRecord', () => {
  it('keeps the best e1RM and the heaviest weight apart', () => {
    const sets = [set(150, 3), set(155, 1), set(140, 5)];
    const r = recordOf(sets);
    expect(r.bestE1rm).toBe(sets[0]); // 165 beats 155 and 163.33
    expect(r.heaviest).toBe(sets[1]);
  });

  it('at the same weight, more reps is heavier', () => {
    expect(heavierThan(set(100, 3), set(100, 2))).toBe(true);
    expect(heavierThan(set(100, 2), set(100, 2))).toBe(false);
  });

  it('a tie is no new record; the first set on a variant always is', () => {
    const earlier = recordOf([set(150, 3)]);
    expect(compareWithRecord(set(150, 3), earlier)).toEqual({
      firstOnVariant: false,
      newRecord: false,
      newHeaviest: false,
    });
    expect(compareWithRecord(set(60, 1), recordOf([]))).toEqual({
      firstOnVariant: true,
      newRecord: true,
      newHeaviest: true,
    });
  });

  it('a new record is exactly a set whose e1RM beats every earlier one', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 20, max: 300 }), fc.integer({ min: 1, max: 12 })), { maxLength: 15 }),
        fc.tuple(fc.integer({ min: 20, max: 300 }), fc.integer({ min: 1, max: 12 })),
        (history, [w, r]) => {
          const earlier = history.map(([hw, hr]) => set(hw, hr));
          const next = set(w, r);
          const { newRecord, newHeaviest } = compareWithRecord(next, recordOf(earlier));
          expect(newRecord).toBe(earlier.every((s) => next.e1rmKg > s.e1rmKg));
          expect(newHeaviest).toBe(earlier.every((s) => heavierThan(next, s)));
        },
      ),
    );
  });
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
    expect(liveEstimate(150, 3, 'kg', 165)).toEqual({ e1rmKg: 165, beatsRecord: false, firstOnVariant: false });
    expect(liveEstimate(152.5, 3, 'kg', 165)?.beatsRecord).toBe(true);
    // 365 lb × 0.45359237 = 165.56 kg, a single: beats a 165 kg record.
    expect(liveEstimate(365, 1, 'lb', 165)).toEqual({
      e1rmKg: 165.56,
      beatsRecord: true,
      firstOnVariant: false,
    });
    expect(liveEstimate(60, 5, 'kg', null)?.firstOnVariant).toBe(true);
  });

  it('waits for usable input', () => {
    expect(liveEstimate(NaN, 3, 'kg', 100)).toBeNull();
    expect(liveEstimate(100, 0, 'kg', 100)).toBeNull();
    expect(liveEstimate(100, 13, 'kg', 100)).toBeNull();
  });
});

describe('liveEstimate with an RPE', () => {
  it('adds the reps in reserve, like the stored estimate', () => {
    // 1 × 130 at RPE 8: two reps left (Zourdos et al., JSCR 2016), Epley (1985) at 3 reps: 130 × 1.1 = 143.
    expect(liveEstimate(130, 1, 'kg', 140, 8)).toEqual({
      e1rmKg: 143,
      beatsRecord: true,
      firstOnVariant: false,
    });
    // An RPE that is not on the scale yet (still being typed) is left out.
    expect(liveEstimate(130, 1, 'kg', 140, 8.3)?.e1rmKg).toBe(130);
  });
});
