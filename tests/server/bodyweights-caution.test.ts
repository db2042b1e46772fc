// The pre-meet bodyweight-gain caution on its own: when it applies and how the 7-day gain is measured.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gainCaution, sevenDayChange } from '../../server/modules/bodyweights/caution';

const r = (measuredOn: string, weightKg: number, id = 0) => ({ id, measuredOn, weightKg });

describe('sevenDayChange', () => {
  it('is the latest reading minus the earliest within the 7 days before it', () => {
    const change = sevenDayChange([r('2027-03-10', 64), r('2027-03-01', 60), r('2027-03-04', 61), r('2027-03-08', 62)]);
    expect(change).toEqual({ gainKg: 3, fromDate: '2027-03-04', toDate: '2027-03-10' });
  });

  it('needs a second reading inside the window', () => {
    expect(sevenDayChange([r('2027-03-10', 64)])).toBeNull();
    expect(sevenDayChange([r('2027-03-10', 64), r('2027-03-01', 60)])).toBeNull();
  });

  it('never depends on the order of the readings', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 30 }), { minLength: 1, maxLength: 12 }),
        fc.array(fc.double({ min: 40, max: 120, noNaN: true }), { minLength: 12, maxLength: 12 }),
        (days, weights) => {
          const readings = days.map((d, i) => r(`2027-03-${String(d + 1).padStart(2, '0')}`, weights[i]!, i));
          expect(sevenDayChange([...readings].reverse())).toEqual(sevenDayChange(readings));
        },
      ),
    );
  });
});

describe('gainCaution', () => {
  const readings = [r('2027-03-04', 61), r('2027-03-10', 63.5)];
  const meet = { name: 'Spring meet', date: '2027-03-13' };

  it('applies in the last 7 days before the meet when the gain passes the line', () => {
    expect(gainCaution({ readings, today: '2027-03-10', meet, thresholdKg: 2 })).toMatchObject({ gainKg: 2.5 });
    expect(gainCaution({ readings, today: '2027-03-10', meet, thresholdKg: 2.5 })).toBeNull(); // at the line: no
  });

  it('does not apply without a meet, more than 7 days out, after the meet, or on stale readings', () => {
    expect(gainCaution({ readings, today: '2027-03-10', meet: null, thresholdKg: 1 })).toBeNull();
    expect(
      gainCaution({ readings, today: '2027-03-10', meet: { ...meet, date: '2027-03-18' }, thresholdKg: 1 }),
    ).toBeNull();
    expect(gainCaution({ readings, today: '2027-03-14', meet, thresholdKg: 1 })).toBeNull();
    const old = [r('2027-02-20', 60), r('2027-02-25', 63)];
    expect(gainCaution({ readings: old, today: '2027-03-10', meet, thresholdKg: 1 })).toBeNull();
  });
});
