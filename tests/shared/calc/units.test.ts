// Kilogram ↔ pound conversion and weight display.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { KG_PER_LB, formatInUnit, formatWeight, fromKg, kgToLb, lbToKg, toKg } from '../../../shared/calc';

describe('the international pound', () => {
  // International yard and pound agreement, 1959: 1 lb = 0.45359237 kg exactly — text (a definition).
  it('is 0.45359237 kg exactly', () => {
    expect(KG_PER_LB).toBe(0.45359237);
    expect(lbToKg(1)).toBe(0.45359237);
    expect(kgToLb(0.45359237)).toBe(1);
  });

  it('gives worked conversions', () => {
    // 100 / 0.45359237 = 220.46226218487758…
    expect(kgToLb(100)).toBeCloseTo(220.462262184878, 10);
    // 225 · 0.45359237 = 102.05828325
    expect(lbToKg(225)).toBeCloseTo(102.05828325, 10);
    expect(fromKg(100, 'kg')).toBe(100);
    expect(toKg(225, 'lb')).toBeCloseTo(102.05828325, 10);
  });

  it('round-trips (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e6, noNaN: true }), (kg) => {
        expect(lbToKg(kgToLb(kg))).toBeCloseTo(kg, 6);
        expect(kgToLb(kg)).toBeGreaterThanOrEqual(kg);
      }),
    );
  });

  it('rejects negative and non-finite weights', () => {
    expect(() => kgToLb(-1)).toThrow(RangeError);
    expect(() => kgToLb(-1)).toThrow(/kg .*-1/);
    expect(() => lbToKg(Number.NaN)).toThrow(/lb .*NaN/);
    expect(() => lbToKg(Number.POSITIVE_INFINITY)).toThrow(RangeError);
    expect(() => fromKg(10, 'st' as 'kg')).toThrow(/unit/);
  });
});

describe('formatWeight', () => {
  it('shows kilograms to two decimals and pounds to one, trailing zeros dropped, with a no-break space', () => {
    expect(formatWeight(102.5, 'kg')).toBe('102.5\u00a0kg');
    expect(formatWeight(1.25, 'kg')).toBe('1.25\u00a0kg');
    expect(formatWeight(200, 'kg')).toBe('200\u00a0kg');
    expect(formatWeight(100, 'lb')).toBe('220.5\u00a0lb'); // 220.4623 lb
    expect(formatWeight(lbToKg(225), 'lb')).toBe('225\u00a0lb');
    expect(formatWeight(102.5, 'kg', { decimals: 0 })).toBe('103\u00a0kg');
  });

  it('formats a value already in the unit the same way, without converting it', () => {
    expect(formatInUnit(225, 'lb')).toBe('225\u00a0lb');
    expect(formatInUnit(87.5, 'kg', { decimals: 1 })).toBe('87.5\u00a0kg');
    expect(formatInUnit(48.25, 'kg', { decimals: 1 })).toBe('48.3\u00a0kg');
  });
});
