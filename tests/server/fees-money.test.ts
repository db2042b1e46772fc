// Money in minor units: decimal prices typed by a head coach, turned into integer minor units and back.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { currencyDigits, formatMoney, fromMinorUnits, toMinorUnits } from '../../shared/schemas/fees';

describe('currency minor units', () => {
  // ISO 4217's minor-unit column: EUR 2, JPY 0, KWD 3 (as shipped in the runtime's Intl data).
  it('follows ISO 4217 minor units', () => {
    expect(currencyDigits('EUR')).toBe(2);
    expect(currencyDigits('GBP')).toBe(2);
    expect(currencyDigits('JPY')).toBe(0);
    expect(currencyDigits('KWD')).toBe(3);
  });

  it('reads decimals digit by digit, never through floating point', () => {
    expect(toMinorUnits('49.5', 'EUR')).toBe(4950);
    expect(toMinorUnits('0.29', 'EUR')).toBe(29); // 0.29 * 100 is 28.999… in binary floating point
    expect(toMinorUnits('1.005', 'EUR')).toBeNull();
    expect(toMinorUnits('1.005', 'KWD')).toBe(1005);
    expect(toMinorUnits('5000', 'JPY')).toBe(5000);
    expect(toMinorUnits('5000.5', 'JPY')).toBeNull();
    expect(toMinorUnits('4,50', 'EUR')).toBeNull(); // the schema turns commas into points first
    expect(toMinorUnits('', 'EUR')).toBeNull();
  });

  it('writes minor units back as the plain decimal a price field shows', () => {
    expect(fromMinorUnits(4950, 'EUR')).toBe('49.50');
    expect(fromMinorUnits(5, 'EUR')).toBe('0.05');
    expect(fromMinorUnits(5000, 'JPY')).toBe('5000');
    expect(fromMinorUnits(1005, 'KWD')).toBe('1.005');
  });

  it('round-trips every amount in every currency (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), fc.constantFrom('EUR', 'JPY', 'KWD', 'USD'), (m, c) => {
        expect(toMinorUnits(fromMinorUnits(m, c), c)).toBe(m);
      }),
    );
  });

  it('agrees with rounding the float for two-decimal amounts (property, reference: Math.round(x × 100))', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 999_999 }), fc.integer({ min: 0, max: 99 }), (whole, cents) => {
        const text = `${whole}.${String(cents).padStart(2, '0')}`;
        expect(toMinorUnits(text, 'EUR')).toBe(Math.round(Number(text) * 100));
      }),
    );
  });

  it('formats for reading with the currency sign', () => {
    expect(formatMoney(4950, 'EUR', 'en-GB')).toBe('€49.50');
    expect(formatMoney(5000, 'JPY', 'en-GB')).toBe('JP¥5,000');
  });
});
