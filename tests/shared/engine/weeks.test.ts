// ISO-8601 week arithmetic, checked against hand-computed calendar facts and a day-by-day count.
import { describe, expect, it } from 'vitest';
import {
  addWeeks,
  formatWeek,
  isIsoWeek,
  mondayOf,
  parseWeek,
  weekFromNumber,
  weekNumber,
  weekOfDate,
  weekRange,
  weeksBetween,
  weeksInYear,
} from '../../../shared/engine/weeks';

const DAY = 86_400_000;

describe('ISO weeks', () => {
  it('knows which years have 53 weeks', () => {
    // ISO 8601: a year has 53 weeks when 1 January is a Thursday, or a Wednesday in a leap year.
    // 2026 starts on a Thursday, 2020 is a leap year starting on a Wednesday, 2027 starts on a Friday.
    expect(weeksInYear(2026)).toBe(53);
    expect(weeksInYear(2020)).toBe(53);
    expect(weeksInYear(2015)).toBe(53);
    expect(weeksInYear(2027)).toBe(52);
    expect(weeksInYear(2024)).toBe(52);
  });

  it('counts weeks across a 53-week year end', () => {
    expect(addWeeks('2026-W52', 1)).toBe('2026-W53');
    expect(addWeeks('2026-W53', 1)).toBe('2027-W01');
    expect(addWeeks('2027-W01', -2)).toBe('2026-W52');
    expect(weeksBetween('2026-W52', '2027-W01')).toBe(2);
    expect(weeksBetween('2027-W52', '2028-W01')).toBe(1);
    expect(weekRange('2026-W52', '2027-W02')).toEqual(['2026-W52', '2026-W53', '2027-W01', '2027-W02']);
    expect(weekRange('2027-W02', '2027-W01')).toEqual([]);
  });

  it('validates week strings', () => {
    expect(isIsoWeek('2026-W53')).toBe(true);
    expect(isIsoWeek('2027-W53')).toBe(false);
    expect(isIsoWeek('2027-W00')).toBe(false);
    expect(isIsoWeek('2027-5')).toBe(false);
    expect(() => parseWeek('2027-W53')).toThrow(RangeError);
    expect(formatWeek(2027, 3)).toBe('2027-W03');
  });

  it('finds Mondays and weeks of dates (hand-checked calendar days)', () => {
    // 2027-01-04 is a Monday and the first day of 2027-W01; 2027-01-03 (Sunday) still belongs to 2026-W53.
    expect(mondayOf('2027-W01').toISOString().slice(0, 10)).toBe('2027-01-04');
    expect(weekOfDate(new Date(Date.UTC(2027, 0, 3)))).toBe('2026-W53');
    expect(weekOfDate(new Date(Date.UTC(2026, 11, 31)))).toBe('2026-W53');
    expect(weekNumber('1970-W01')).toBe(0);
  });

  it('agrees with a day-by-day walk over a century', () => {
    // Independent count: the ISO week-year of a day is the year of its Thursday, and the week is
    // one more than the number of whole weeks since that year's first Thursday's Monday.
    const wrong: string[] = [];
    let previous = weekOfDate(new Date(Date.UTC(1970, 0, 1)));
    for (let day = Date.UTC(1970, 0, 2); day < Date.UTC(2070, 0, 1); day += DAY) {
      const week = weekOfDate(new Date(day));
      const isMonday = new Date(day).getUTCDay() === 1;
      const monday = mondayOf(week).getTime();
      const stepOk = isMonday ? weeksBetween(previous, week) === 1 : week === previous;
      if (!stepOk || day - monday < 0 || day - monday >= 7 * DAY) wrong.push(new Date(day).toISOString());
      previous = week;
    }
    expect(wrong).toEqual([]);
    for (let y = 1970; y < 2070; y++) {
      let thursdays = 0;
      for (let d = new Date(Date.UTC(y, 0, 1)); d.getUTCFullYear() === y; d = new Date(d.getTime() + DAY)) {
        if (d.getUTCDay() === 4) thursdays++;
      }
      expect(weeksInYear(y)).toBe(thursdays);
    }
  });

  it('round-trips running week numbers', () => {
    for (let n = -3000; n < 6000; n += 7) expect(weekNumber(weekFromNumber(n))).toBe(n);
  });

  it('handles years before 100 without shifting them into the 1900s', () => {
    // Date.UTC maps years 0–99 onto 1900–1999; a year-50 week must stay in year 50.
    const monday = mondayOf('0050-W10');
    expect(monday.getUTCFullYear()).toBe(50);
    expect(weekOfDate(monday)).toBe('0050-W10');
    expect(addWeeks('0050-W10', 1)).toBe('0050-W11');
  });
});
