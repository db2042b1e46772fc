// Attempt suggestions from a current max, and the attempt plan's own checks.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { isLoadable } from '../../../shared/calc';
import { attemptPlanSchema, pickCurrentMax, suggestAttempts, type MaxCandidate } from '../../../shared/schemas';

describe('suggestAttempts', () => {
  it('plans about 91%, 96% and 100% of the current max in 2.5 kg steps', () => {
    // Common practice with no single published source (percentages from memory); the 2.5 kg step is how
    // meets load attempts (memory). 200 kg: 182 → 180, 192 → 190, 200 → 200.
    expect(suggestAttempts(200)).toEqual([180, 190, 200]);
    // 143.3 kg: 130.4 → 130, 137.6 → 137.5, 143.3 → 142.5.
    expect(suggestAttempts(143.3)).toEqual([130, 137.5, 142.5]);
  });

  it('refuses a max that is not a positive number', () => {
    expect(() => suggestAttempts(0)).toThrow(RangeError);
    expect(() => suggestAttempts(Number.NaN)).toThrow(RangeError);
  });

  it('never plans equal attempts: each at least 2.5 kg over the one before', () => {
    // 28 kg: 91% and 96% both round down to 25 and would repeat; the federation's rule after a good
    // lift (memory) needs 2.5 kg more each time.
    expect(suggestAttempts(28)).toEqual([25, 27.5, 30]);
    expect(suggestAttempts(10)).toEqual([25, 27.5, 30]); // never under the 25 kg bar with collars
  });

  it('always gives a valid, loadable, strictly rising plan within a step of the max', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 500, noNaN: true }), (max) => {
        const plan = suggestAttempts(max);
        expect(attemptPlanSchema.safeParse({ squat: plan }).success).toBe(true);
        for (const w of plan) expect(isLoadable(w, 'kg')).toBe(true);
        expect(plan[1] - plan[0]).toBeGreaterThanOrEqual(2.5);
        expect(plan[2] - plan[1]).toBeGreaterThanOrEqual(2.5);
        // From about 60 kg up the percentages are a full step apart, so the third stays at or under the max.
        if (max >= 60) expect(plan[2]).toBeLessThanOrEqual(Math.round(max * 100) / 100);
        expect(plan[2]).toBeGreaterThan(max - 2.5 - 0.01);
        for (const w of plan) expect(w % 2.5).toBe(0);
      }),
    );
  });
});

describe('attemptPlanSchema', () => {
  it('takes up to three loadable attempts per lift, each 2.5 kg over the last, records in 0.5 kg steps', () => {
    // 103.5 is a record weight the change discs can make (39.25 kg a side); 103 is not (39 a side).
    expect(attemptPlanSchema.safeParse({ bench: [100, 102.5, 106] }).success).toBe(true);
    expect(attemptPlanSchema.safeParse({ bench: [100, 103.5] }).success).toBe(true);
    expect(attemptPlanSchema.safeParse({ bench: [100, 103] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [100, 100] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [100, 101] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [100, 95] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [100.2] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [1, 2, 3, 4] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ clean: [100] }).success).toBe(false);
  });
});

describe('pickCurrentMax', () => {
  const set = (over: Partial<MaxCandidate>): MaxCandidate => ({
    variantName: 'Competition squat',
    specificity: 1,
    equipment: [],
    weightKg: 200,
    reps: 1,
    rpe: null,
    performedOn: '2026-11-20',
    ...over,
  });
  const fresh = '2026-10-19';

  it('prefers a fresh competition-lift set over a heavier close variant, RPE-aware', () => {
    // RPE-aware e1RM: reps + reps in reserve to failure (common practice on the RIR scale of Zourdos et al.
    // 2016 and Helms et al. 2016), Epley: 180 × (1 + (3 + 2)/30) = 210.
    const picked = pickCurrentMax(
      [set({ weightKg: 180, reps: 3, rpe: 8 }), set({ variantName: 'Pause squat', specificity: 0.9, weightKg: 215 })],
      fresh,
    );
    expect(picked).toMatchObject({
      e1rmKg: 210,
      variantName: 'Competition squat',
      competitionLift: true,
      stale: false,
    });
  });

  it('never counts chains or bands as the competition max', () => {
    const picked = pickCurrentMax(
      [set({ variantName: 'Competition squat with chains', equipment: ['chains'], weightKg: 260 }), set({})],
      fresh,
    );
    expect(picked).toMatchObject({ variantName: 'Competition squat', e1rmKg: 200 });
  });

  it('falls back to the newest older set and marks it stale', () => {
    const picked = pickCurrentMax(
      [set({ performedOn: '2026-07-01', weightKg: 220 }), set({ performedOn: '2026-09-01', weightKg: 205 })],
      fresh,
    );
    expect(picked).toMatchObject({ performedOn: '2026-09-01', e1rmKg: 205, stale: true });
    expect(pickCurrentMax([], fresh)).toBeNull();
  });
});
