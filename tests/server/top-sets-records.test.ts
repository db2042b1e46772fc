// Records per variant and the stored e1RM, on their own.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compareWithRecord, heavierThan, recordOf, topSetE1rmKg } from '../../server/modules/top-sets/records';
import { performedOnFor } from '../../server/modules/top-sets/top-sets.service';

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

describe('performedOnFor', () => {
  it('is today inside the week, else the nearest end of the week', () => {
    expect(performedOnFor('2027-W10', new Date('2027-03-10T18:00:00Z'))).toBe('2027-03-10');
    expect(performedOnFor('2027-W10', new Date('2027-03-20T08:00:00Z'))).toBe('2027-03-14');
    expect(performedOnFor('2027-W10', new Date('2027-03-01T08:00:00Z'))).toBe('2027-03-08');
  });
});
