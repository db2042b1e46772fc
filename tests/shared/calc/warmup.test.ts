// Warm-up ramps: rising, loadable with the unit's default plates, below the top set, sensible reps.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLoadable, warmupRamp } from '../../../shared/calc';

describe('warmupRamp worked examples', () => {
  it('ramps a 200 kg top set from the bar in five steps to about 90%', () => {
    // Aims 25 + (180 − 25)·i/4 = 25, 63.75, 102.5, 141.25, 180, each to the nearest 2.5 kg.
    expect(warmupRamp(200)).toEqual([
      { weight: 25, reps: 10 },
      { weight: 65, reps: 5 },
      { weight: 102.5, reps: 3 },
      { weight: 142.5, reps: 2 },
      { weight: 180, reps: 1 },
    ]);
  });

  it('ramps in pounds on 5 lb steps, with the number of steps asked for', () => {
    // Aims 45 + (364.5 − 45)·i/5 = 45, 108.9, 172.8, 236.7, 300.6, 364.5, each to the nearest 5 lb.
    expect(warmupRamp(405, { unit: 'lb', steps: 6 })).toEqual([
      { weight: 45, reps: 10 },
      { weight: 110, reps: 5 },
      { weight: 175, reps: 5 },
      { weight: 235, reps: 3 },
      { weight: 300, reps: 2 },
      { weight: 365, reps: 1 },
    ]);
  });

  it('drops steps that would repeat a weight when the top set is light', () => {
    // 30 kg: aims 25, 25.5, 26, 26.5, 27; to the nearest 2.5 kg that is 25, 25, 25, 27.5, 27.5.
    expect(warmupRamp(30)).toEqual([
      { weight: 25, reps: 10 },
      { weight: 27.5, reps: 1 },
    ]);
  });

  it('gives just the bar for one step, and nothing for a top set at or below the empty bar', () => {
    expect(warmupRamp(150, { steps: 1 })).toEqual([{ weight: 25, reps: 10 }]);
    expect(warmupRamp(25)).toEqual([]);
    expect(warmupRamp(20, { bar: 15 })).toEqual([]);
  });

  it('honours a lighter bar', () => {
    expect(warmupRamp(100, { bar: 15, steps: 3 })[0]).toEqual({ weight: 20, reps: 10 });
  });

  it('rejects bad input with a RangeError naming it', () => {
    expect(() => warmupRamp(Number.NaN)).toThrow(/top set .*NaN/);
    expect(() => warmupRamp(-100)).toThrow(/top set .*-100/);
    expect(() => warmupRamp(100, { steps: 0 })).toThrow(/steps .*0/);
    expect(() => warmupRamp(100, { steps: 11 })).toThrow(/steps .*1 to 10.*11/);
    expect(() => warmupRamp(100, { steps: 2.5 })).toThrow(/steps/);
    expect(() => warmupRamp(100, { unit: 'st' as 'kg' })).toThrow(/unit/);
  });
});

describe('warmupRamp properties', () => {
  const unit = fc.constantFrom('kg' as const, 'lb' as const);
  it('rises, is loadable with the default plates, ends below the top set, reps never climb', () => {
    fc.assert(
      fc.property(
        unit,
        fc.double({ min: 0, max: 500, noNaN: true }),
        fc.integer({ min: 1, max: 10 }),
        (u, top, steps) => {
          const ramp = warmupRamp(top, { unit: u, steps });
          expect(ramp.length).toBeLessThanOrEqual(steps);
          ramp.forEach((step, i) => {
            expect(isLoadable(step.weight, u)).toBe(true);
            expect(step.weight).toBeLessThan(top);
            expect(step.reps).toBeGreaterThanOrEqual(1);
            expect(step.reps).toBeLessThanOrEqual(10);
            const prev = ramp[i - 1];
            if (prev) {
              expect(step.weight).toBeGreaterThan(prev.weight);
              expect(step.reps).toBeLessThanOrEqual(prev.reps);
            }
          });
          const emptyBar = u === 'kg' ? 25 : 45;
          if (top > emptyBar) expect(ramp[0]).toEqual({ weight: emptyBar, reps: 10 });
        },
      ),
    );
  });
});
