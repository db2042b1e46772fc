// The week's sessions on the phone start with today's, then follow the order of the week.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { sessionsTodayFirst } from '../../../src/features/my-week/components/week-sessions';

const days = ['2027-03-01', '2027-03-03', '2027-03-05', '2027-03-06'].map((date, i) => ({ id: `s${i}`, date }));

describe('sessionsTodayFirst', () => {
  it('puts today’s session first and keeps the rest in order', () => {
    expect(sessionsTodayFirst(days, '2027-03-05').map((s) => s.id)).toEqual(['s2', 's0', 's1', 's3']);
  });
  it('keeps the week’s order on a day without a session', () => {
    expect(sessionsTodayFirst(days, '2027-03-02').map((s) => s.id)).toEqual(['s0', 's1', 's2', 's3']);
  });
  it('is always a reordering of the same sessions (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...days.map((d) => d.date), '2027-03-07'), (today) => {
        const out = sessionsTodayFirst(days, today);
        expect([...out].sort((a, b) => a.id.localeCompare(b.id))).toEqual(days);
        if (days.some((d) => d.date === today)) expect(out[0]!.date).toBe(today);
      }),
    );
  });
});
