// Training-week loads: RPE-aware set estimates, training max, speed waves, back-off sets and opening ranges.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  BACK_OFF_SETS_MAX,
  DEFAULT_BACK_OFF,
  GYM_STEP,
  backOffPlan,
  backOffSets,
  estimateOneRepMax,
  isLoadable,
  openingRange,
  setE1rm,
  speedWave,
  trainingMax,
  weightForReps,
} from '../../../shared/calc';

describe('setE1rm: the RPE-aware estimate of a logged set', () => {
  it('counts reps in reserve: 1 × 130 kg at RPE 8 is 1 + 2 = 3 reps to failure, not 130', () => {
    // RIR scale (Zourdos et al., JSCR 30(1):267–275, 2016): RPE 8 = two reps left. Reps + RIR as reps to
    // failure is common practice on that scale (no published source). Epley (1985, secondary):
    // 130·(1 + 3/30) = 143.
    expect(setE1rm(130, 1, 8)).toBe(143);
  });
  it('140 × 3 at RPE 8 is Epley at 5 reps', () => {
    // Epley, Poundage Chart, 1985 (secondary): 140·(1 + 5/30) = 163.333… → 163.33.
    expect(setE1rm(140, 3, 8)).toBe(163.33);
  });
  it('a single at RPE 10 is the weight itself (our convention for r = 1)', () => {
    expect(setE1rm(200, 1, 10)).toBe(200);
  });
  it('without an RPE it is plain Epley', () => {
    // Epley 1985 (secondary): 140·1.1 = 154.
    expect(setE1rm(140, 3, null)).toBe(154);
  });
  it('caps reps to failure at the formula limit instead of refusing a long easy set', () => {
    // 12 reps at RPE 6 would be 16 to failure; capped at 12: Epley 100·(1 + 12/30) = 140.
    expect(setE1rm(100, 12, 6)).toBe(140);
  });
  it('is never below the plain estimate and grows as the RPE falls (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 20, max: 400, noNaN: true }),
        fc.integer({ min: 1, max: 10 }),
        fc.integer({ min: 12, max: 20 }).map((n) => n / 2),
        (w, r, rpe) => {
          const at = setE1rm(w, r, rpe);
          expect(at).toBeGreaterThanOrEqual(Math.round(estimateOneRepMax(w, r) * 100) / 100 - 0.01);
          if (rpe > 6) expect(setE1rm(w, r, rpe - 0.5)).toBeGreaterThanOrEqual(at);
        },
      ),
    );
  });
});

describe('trainingMax', () => {
  it('defaults to 90 % of the estimate (common practice, no published source)', () => {
    expect(trainingMax(200)).toBe(180);
    expect(trainingMax(187.5, 85)).toBe(159.38); // 187.5·0.85 = 159.375
  });
  it('refuses a share over 100 % or under 50 %, and a bad estimate', () => {
    expect(() => trainingMax(200, 101)).toThrow(/training-max share must be from 50 to 100/);
    expect(() => trainingMax(200, 40)).toThrow(RangeError);
    expect(() => trainingMax(-1)).toThrow(/e1RM/);
    expect(() => trainingMax(Number.NaN)).toThrow(RangeError);
  });
  it('never exceeds the estimate (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 500, noNaN: true }), fc.integer({ min: 50, max: 100 }), (e, pct) => {
        expect(trainingMax(e, pct)).toBeLessThanOrEqual(Math.round(e * 100) / 100 + 0.005);
      }),
    );
  });
});

describe('weightForReps: Epley turned round', () => {
  it('a triple at RPE 10 from a 154 e1RM is 140 (Epley 1985, secondary: 154 / 1.1)', () => {
    expect(weightForReps(154, 3)).toBeCloseTo(140, 9);
  });
  it('a triple at RPE 8 counts five reps (RIR scale, Zourdos et al. 2016)', () => {
    expect(weightForReps(175, 3, 8)).toBeCloseTo(150, 9); // 175 / (1 + 5/30)
  });
  it('inverts the RPE-aware estimate (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 400, noNaN: true }),
        fc.integer({ min: 1, max: 8 }),
        fc.integer({ min: 16, max: 20 }).map((n) => n / 2),
        (e, r, rpe) => {
          expect(setE1rm(weightForReps(e, r, rpe), r, rpe)).toBeCloseTo(e, 1);
        },
      ),
    );
  });
});

describe('speedWave (percentages and sets are common practice, no single published source)', () => {
  it('three weeks at 50, 55, 60 % of a 200 kg training max for squat, 10 × 2', () => {
    expect(speedWave(200, { weeks: 3, lift: 'squat' })).toEqual([
      { week: 1, pct: 50, barKg: 100, accommodationKg: 0, sets: 10, reps: 2 },
      { week: 2, pct: 55, barKg: 110, accommodationKg: 0, sets: 10, reps: 2 },
      { week: 3, pct: 60, barKg: 120, accommodationKg: 0, sets: 10, reps: 2 },
    ]);
  });
  it('bench 9 × 3; bands take a fifth of the planned load at the top (value from memory)', () => {
    const [w1] = speedWave(150, { weeks: 3, lift: 'bench', accommodation: 'bands' });
    // 150·0.5 = 75 planned; bar 75·0.8 = 60 kg; bands 15 kg at the top.
    expect(w1).toEqual({ week: 1, pct: 50, barKg: 60, accommodationKg: 15, sets: 9, reps: 3 });
  });
  it('refuses percentages outside 30–100 % and reps below 1', () => {
    expect(() => speedWave(200, { weeks: 3, lift: 'squat', startPct: 25 })).toThrow(/start percentage must be from 30/);
    expect(() => speedWave(200, { weeks: 3, lift: 'squat', startPct: 95, stepPct: 5 })).toThrow(/last week/);
    expect(() => speedWave(200, { weeks: 3, lift: 'squat', reps: 0 })).toThrow(/reps/);
  });
  it('every bar load is loadable, never above the planned load plus rounding, rising week on week (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 60, max: 400, noNaN: true }),
        fc.integer({ min: 1, max: 6 }),
        fc.integer({ min: 30, max: 60 }),
        fc.integer({ min: 0, max: 6 }),
        fc.constantFrom('none' as const, 'bands' as const, 'chains' as const),
        (max, weeks, start, step, accommodation) => {
          const wave = speedWave(max, { weeks, lift: 'bench', startPct: start, stepPct: step, accommodation });
          expect(wave).toHaveLength(weeks);
          wave.forEach((w, i) => {
            expect(isLoadable(w.barKg, 'kg')).toBe(true);
            expect(w.barKg).toBeLessThanOrEqual(Math.max(25, (max * w.pct) / 100 + 1.25));
            if (i > 0) expect(w.barKg).toBeGreaterThanOrEqual(wave[i - 1]!.barKg);
          });
        },
      ),
    );
  });
});

describe('backOffSets (5–15 % lighter than the top set: common practice, no published source)', () => {
  it('three triples 10 % under a 180 kg top triple', () => {
    expect(backOffSets(180, 3, { sets: 3 })).toEqual([
      { weight: 160, reps: 3 },
      { weight: 160, reps: 3 },
      { weight: 160, reps: 3 },
    ]); // 180·0.9 = 162, down to the 2.5 kg gym step
  });
  it('are loadable and never heavier than the top set (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 40, max: 400, noNaN: true }),
        fc.integer({ min: 1, max: 5 }),
        fc.integer({ min: 0, max: 30 }),
        (top, sets, drop) => {
          const out = backOffSets(top, 3, { sets, dropPct: drop });
          expect(out).toHaveLength(sets);
          for (const s of out) {
            expect(isLoadable(s.weight, 'kg')).toBe(true);
            expect(s.weight).toBeLessThanOrEqual(top + 1e-6); // float noise of the step division
          }
        },
      ),
    );
  });
  it('refuses zero sets', () => {
    expect(() => backOffSets(180, 3, { sets: 0 })).toThrow(/back-off sets/);
  });
});

describe('backOffPlan: the back-off sets of a max-effort pick', () => {
  it('defaults to two sets about 10 % lighter (common practice, no single published source)', () => {
    expect(DEFAULT_BACK_OFF).toEqual({ sets: 2, dropPct: 10 });
  });
  it('from the suggested top set before anything is logged, at the scheme’s reps', () => {
    // 170 kg suggested triple, 10 % lighter: 153 → 152.5 in the 2.5 kg gym step (common practice).
    expect(backOffPlan(DEFAULT_BACK_OFF, { logged: [], suggested: 170, schemeReps: 3 })).toEqual({
      basis: 'suggested',
      topSet: 170,
      sets: [
        { weight: 152.5, reps: 3 },
        { weight: 152.5, reps: 3 },
      ],
    });
  });
  it('from the heaviest top set logged this week, at its reps, once one is logged', () => {
    const logged = [
      { weight: 180, reps: 3 },
      { weight: 185, reps: 2 },
    ];
    // 185 × 0.85 = 157.25 → 157.5 is too heavy, so 155 (rounded down to the gym step).
    expect(backOffPlan({ sets: 3, dropPct: 15 }, { logged, suggested: 170, schemeReps: 3 })).toEqual({
      basis: 'logged',
      topSet: 185,
      sets: Array.from({ length: 3 }, () => ({ weight: 155, reps: 2 })),
    });
  });
  it('in pounds, in the 5 lb gym step', () => {
    // 405 lb × 0.9 = 364.5 → 360 lb (common practice: 5 lb jumps).
    expect(backOffPlan({ sets: 1, dropPct: 10 }, { logged: [], suggested: 405, schemeReps: 1 }, 'lb')!.sets).toEqual([
      { weight: 360, reps: 1 },
    ]);
  });
  it('none with 0 sets, or with neither a logged nor a suggested top set', () => {
    expect(backOffPlan({ sets: 0, dropPct: 10 }, { logged: [], suggested: 170, schemeReps: 3 })).toBeNull();
    expect(backOffPlan(DEFAULT_BACK_OFF, { logged: [], suggested: null, schemeReps: 3 })).toBeNull();
  });
  it('refuses a count outside 0–5 or not whole', () => {
    const top = { logged: [], suggested: 170, schemeReps: 3 };
    expect(() => backOffPlan({ sets: 6, dropPct: 10 }, top)).toThrow(RangeError);
    expect(() => backOffPlan({ sets: 1.5, dropPct: 10 }, top)).toThrow(RangeError);
    expect(() => backOffPlan({ sets: -1, dropPct: 10 }, top)).toThrow(RangeError);
  });
  it('as many equal sets as the rule, each within a gym step of top × (1 − drop) and below the top set (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('kg' as const, 'lb' as const),
        fc.array(
          fc.record({ weight: fc.double({ min: 60, max: 400, noNaN: true }), reps: fc.integer({ min: 1, max: 12 }) }),
          {
            maxLength: 3,
          },
        ),
        fc.double({ min: 60, max: 400, noNaN: true }),
        fc.integer({ min: 1, max: BACK_OFF_SETS_MAX }),
        fc.integer({ min: 5, max: 25 }),
        (unit, logged, suggested, sets, dropPct) => {
          const plan = backOffPlan({ sets, dropPct }, { logged, suggested, schemeReps: 3 }, unit)!;
          const top = logged.length ? Math.max(...logged.map((l) => l.weight)) : suggested;
          expect(plan.basis).toBe(logged.length ? 'logged' : 'suggested');
          expect(plan.topSet).toBe(top);
          expect(plan.sets).toHaveLength(sets);
          const target = (top * (100 - dropPct)) / 100;
          for (const s of plan.sets) {
            expect(s).toEqual(plan.sets[0]);
            expect(isLoadable(s.weight, unit)).toBe(true);
            expect(s.weight).toBeLessThan(top);
            expect(s.weight).toBeLessThanOrEqual(target + 1e-6);
            expect(s.weight).toBeGreaterThan(target - GYM_STEP[unit] - 1e-6);
          }
        },
      ),
    );
  });
});

describe('openingRange for a never-done variant (common practice, no published source)', () => {
  it('75–85 % of the median related estimate turned into a triple, marked as an estimate', () => {
    // median 165; triple at RPE 10 by Epley: 165 / 1.1 = 150; 75 % = 112.5, 85 % = 127.5.
    expect(openingRange([150, 165, 200], 3)).toEqual({ low: 112.5, high: 127.5, estimate: true, basedOn: 3 });
  });
  it('nothing related: no suggestion', () => {
    expect(openingRange([], 3)).toBeNull();
  });
  it('low ≤ high and both below the related estimate (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 40, max: 400, noNaN: true }), { minLength: 1, maxLength: 6 }), (es) => {
        const r = openingRange(es, 1)!;
        expect(r.low).toBeLessThanOrEqual(r.high);
        expect(r.high).toBeLessThanOrEqual(Math.max(25, Math.max(...es)));
      }),
    );
  });
});
