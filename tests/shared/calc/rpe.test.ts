// The repetitions-in-reserve RPE scale.
import { describe, expect, it } from 'vitest';
import { RPE_VALUES, assertRpe, isValidRpe, rirToRpe, rpeToRir } from '../../../shared/calc';

describe('RPE scale', () => {
  // Zourdos et al., JSCR 30(1):267–275, 2016; Helms et al., Strength Cond. J. 38(4):42–49, 2016 — secondary:
  // 10 = no reps left, 9 = one left, 8 = two left, halves in between. The product accepts 6–10.
  it('maps RPE to reps in reserve and back', () => {
    expect(rpeToRir(10)).toBe(0);
    expect(rpeToRir(9)).toBe(1);
    expect(rpeToRir(8)).toBe(2);
    expect(rpeToRir(8.5)).toBe(1.5);
    expect(rirToRpe(2)).toBe(8);
    expect(rirToRpe(0.5)).toBe(9.5);
  });

  it('lists 6 to 10 in half steps', () => {
    expect(RPE_VALUES).toEqual([6, 6.5, 7, 7.5, 8, 8.5, 9, 9.5, 10]);
    for (const v of RPE_VALUES) expect(rirToRpe(rpeToRir(v))).toBe(v);
  });

  it('refuses values off the scale', () => {
    for (const bad of [5.5, 10.5, 8.25, Number.NaN, -1]) expect(isValidRpe(bad)).toBe(false);
    expect(() => assertRpe(8.25)).toThrow(/RPE .*8\.25/);
    expect(() => assertRpe(11)).toThrow(RangeError);
    expect(() => rpeToRir(Number.NaN)).toThrow(/RPE .*NaN/);
    expect(() => rirToRpe(5)).toThrow(/reps in reserve .*5/);
    expect(assertRpe(7.5)).toBe(7.5);
  });
});
