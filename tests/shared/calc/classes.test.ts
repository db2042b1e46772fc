// Bodyweight categories from the international federation's rules, and DOTS from its published coefficients.
import { describe, expect, it } from 'vitest';
import { WEIGHT_CLASSES, dotsScore, weightClass } from '../../../shared/calc';

describe('weight classes', () => {
  // Federation bodyweight categories — secondary/text: men 59 … 120, 120+; women 47 … 84, 84+; juniors and
  // sub-juniors add 53 (men) and 43 (women). A lifter is in the lightest category at or above their weight.
  it('lists the categories per sex and division', () => {
    expect(WEIGHT_CLASSES.M.open).toEqual(['59', '66', '74', '83', '93', '105', '120', '120+']);
    expect(WEIGHT_CLASSES.M.junior).toEqual(['53', '59', '66', '74', '83', '93', '105', '120', '120+']);
    expect(WEIGHT_CLASSES.M.subjunior).toEqual(WEIGHT_CLASSES.M.junior);
    expect(WEIGHT_CLASSES.F.open).toEqual(['47', '52', '57', '63', '69', '76', '84', '84+']);
    expect(WEIGHT_CLASSES.F.junior).toEqual(['43', '47', '52', '57', '63', '69', '76', '84', '84+']);
    expect(WEIGHT_CLASSES.F.subjunior).toEqual(WEIGHT_CLASSES.F.junior);
  });

  it('puts a bodyweight exactly on a limit in that class, and anything over in the next', () => {
    expect(weightClass(83, 'M')).toBe('83');
    expect(weightClass(83.01, 'M')).toBe('93');
    expect(weightClass(120, 'M')).toBe('120');
    expect(weightClass(120.5, 'M')).toBe('120+');
    expect(weightClass(63, 'F')).toBe('63');
    expect(weightClass(63.01, 'F')).toBe('69');
    expect(weightClass(84.01, 'F')).toBe('84+');
  });

  it('uses the lightest class for light lifters, with the extra class only for juniors and sub-juniors', () => {
    expect(weightClass(50, 'M')).toBe('59');
    expect(weightClass(50, 'M', { division: 'junior' })).toBe('53');
    expect(weightClass(53.01, 'M', { division: 'subjunior' })).toBe('59');
    expect(weightClass(41.5, 'F', { division: 'subjunior' })).toBe('43');
    expect(weightClass(41.5, 'F')).toBe('47');
  });

  it('rejects bad input with a RangeError naming it', () => {
    expect(() => weightClass(0, 'M')).toThrow(/bodyweight .*0/);
    expect(() => weightClass(Number.NaN, 'F')).toThrow(/bodyweight .*NaN/);
    expect(() => weightClass(80, 'X' as 'M')).toThrow(/sex .*"X"/);
    expect(() => weightClass(80, 'M', { division: 'masters' as 'open' })).toThrow(/division .*"masters"/);
  });
});

describe('DOTS', () => {
  // DOTS, German federation BVDK 2019 — secondary: total · 500 / (A·x⁴ + B·x³ + C·x² + D·x + E), bodyweight
  // clamped to 40–210 kg (men) and 40–150 kg (women). Denominators below worked by hand from the coefficients.
  it('scores a man: 600 kg at 83 kg', () => {
    // x⁴ = 47458321, x³ = 571787, x² = 6889
    // −0.0000010930·47458321 = −51.871945; 0.0007391293·571787 = 422.624525; −0.1918759221·6889 = −1321.833227
    // 24.0900756·83 = 1999.476275; sum with −307.75076 = 740.644868; 600·500/740.644868 = 405.052425
    expect(dotsScore(600, 83, 'M')).toBeCloseTo(405.052425, 5);
  });

  it('scores a woman: 400 kg at 63 kg', () => {
    // x⁴ = 15752961, x³ = 250047, x² = 3969
    // −0.0000010706·15752961 = −16.865120; 0.0005158568·250047 = 128.988445; −0.1126655495·3969 = −447.169566
    // 13.6175032·63 = 857.902702; sum with −57.96288 = 464.893581; 400·500/464.893581 = 430.205983
    expect(dotsScore(400, 63, 'F')).toBeCloseTo(430.205983, 5);
  });

  it('clamps the bodyweight to 40–210 kg for men', () => {
    // x = 210: denominator 1008.836069 → 700·500/1008.836069 = 346.934463
    expect(dotsScore(700, 210, 'M')).toBeCloseTo(346.934463, 5);
    expect(dotsScore(700, 240, 'M')).toBe(dotsScore(700, 210, 'M'));
    // x = 40: denominator 393.356984 → 300·500/393.356984 = 381.333003
    expect(dotsScore(300, 40, 'M')).toBeCloseTo(381.333003, 5);
    expect(dotsScore(300, 35, 'M')).toBe(dotsScore(300, 40, 'M'));
    expect(dotsScore(700, 209, 'M')).not.toBe(dotsScore(700, 210, 'M'));
  });

  it('clamps the bodyweight to 40–150 kg for women', () => {
    // x = 150: denominator 648.713186 → 500·500/648.713186 = 385.378323
    expect(dotsScore(500, 150, 'F')).toBeCloseTo(385.378323, 5);
    expect(dotsScore(500, 170, 'F')).toBe(dotsScore(500, 150, 'F'));
    // x = 40: denominator 336.746468 → 250·500/336.746468 = 371.199142
    expect(dotsScore(250, 40, 'F')).toBeCloseTo(371.199142, 5);
    expect(dotsScore(250, 38, 'F')).toBe(dotsScore(250, 40, 'F'));
  });

  it('is zero for a zero total and rejects bad input', () => {
    expect(dotsScore(0, 90, 'M')).toBe(0);
    expect(() => dotsScore(-1, 90, 'M')).toThrow(/total .*-1/);
    expect(() => dotsScore(500, 0, 'M')).toThrow(/bodyweight .*0/);
    expect(() => dotsScore(500, Number.NaN, 'F')).toThrow(/bodyweight .*NaN/);
    expect(() => dotsScore(500, 80, 'Q' as 'M')).toThrow(/sex/);
  });
});
