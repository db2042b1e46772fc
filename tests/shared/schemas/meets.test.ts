// Attempt suggestions from a current max, and the attempt plan's own checks.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { attemptPlanSchema, suggestAttempts } from '../../../shared/schemas';

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

  it('always gives a valid, rising plan at or under the max (to the hundredth) and within a step of it', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 500, noNaN: true }), (max) => {
        const plan = suggestAttempts(max);
        expect(attemptPlanSchema.safeParse({ squat: plan }).success).toBe(true);
        expect(plan[2]).toBeLessThanOrEqual(Math.round(max * 100) / 100);
        expect(plan[2]).toBeGreaterThan(max - 2.5 - 0.01);
        expect(plan[0]).toBeLessThanOrEqual(plan[1]);
        expect(plan[1]).toBeLessThanOrEqual(plan[2]);
        for (const w of plan) expect(w % 2.5).toBe(0);
      }),
    );
  });
});

describe('attemptPlanSchema', () => {
  it('takes up to three rising attempts per lift in 0.5 kg steps', () => {
    expect(attemptPlanSchema.safeParse({ bench: [100, 102.5, 103] }).success).toBe(true);
    expect(attemptPlanSchema.safeParse({ bench: [100, 95] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [100.2] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ bench: [1, 2, 3, 4] }).success).toBe(false);
    expect(attemptPlanSchema.safeParse({ clean: [100] }).success).toBe(false);
  });
});
