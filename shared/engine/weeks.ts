// ISO-8601 week arithmetic ('YYYY-Www'), pure and timezone-free, shared by the engine, server and client.

export type IsoWeek = string;

const WEEK_RE = /^(\d{4})-W(\d{2})$/;
const DAY_MS = 86_400_000;

/** UTC midnight of a calendar day; unlike Date.UTC it does not map years 0–99 onto 1900–1999. */
function utcDay(year: number, month: number, day: number): number {
  const d = new Date(0);
  d.setUTCFullYear(year, month, day);
  return d.getTime();
}

/** Number of ISO weeks in a year: 53 when 1 January is a Thursday, or a Wednesday in a leap year. */
export function weeksInYear(year: number): 52 | 53 {
  const jan1 = new Date(utcDay(year, 0, 1)).getUTCDay();
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return jan1 === 4 || (leap && jan1 === 3) ? 53 : 52;
}

export function isIsoWeek(value: string): boolean {
  const m = WEEK_RE.exec(value);
  if (!m) return false;
  const week = Number(m[2]);
  return week >= 1 && week <= weeksInYear(Number(m[1]));
}

export function parseWeek(value: string): { year: number; week: number } {
  const m = WEEK_RE.exec(value);
  if (!m || !isIsoWeek(value)) throw new RangeError(`"${value}" is not an ISO week like 2027-W05`);
  return { year: Number(m[1]), week: Number(m[2]) };
}

export function formatWeek(year: number, week: number): IsoWeek {
  return `${String(year).padStart(4, '0')}-W${String(week).padStart(2, '0')}`;
}

/** Monday of the ISO week, as a UTC midnight timestamp. */
export function mondayOf(value: IsoWeek): Date {
  const { year, week } = parseWeek(value);
  // 4 January is always in week 1.
  const jan4 = utcDay(year, 0, 4);
  const jan4Dow = (new Date(jan4).getUTCDay() + 6) % 7; // 0 = Monday
  return new Date(jan4 - jan4Dow * DAY_MS + (week - 1) * 7 * DAY_MS);
}

/** The ISO week holding a date (its UTC calendar day). */
export function weekOfDate(date: Date): IsoWeek {
  const day = utcDay(date.getUTCFullYear(), date.getUTCMonth(), date.getUTCDate());
  const dow = (new Date(day).getUTCDay() + 6) % 7;
  const thursday = new Date(day + (3 - dow) * DAY_MS);
  const year = thursday.getUTCFullYear();
  const week = 1 + Math.floor((thursday.getTime() - utcDay(year, 0, 1)) / (7 * DAY_MS));
  return formatWeek(year, week);
}

/** A running week count (weeks since the ISO week of 1970-01-01's Monday), handy for distances. */
export function weekNumber(value: IsoWeek): number {
  // 1969-12-29 is the Monday of 1970-W01.
  return Math.round((mondayOf(value).getTime() - Date.UTC(1969, 11, 29)) / (7 * DAY_MS));
}

export function weekFromNumber(n: number): IsoWeek {
  return weekOfDate(new Date(Date.UTC(1969, 11, 29) + n * 7 * DAY_MS));
}

export function addWeeks(value: IsoWeek, n: number): IsoWeek {
  return weekFromNumber(weekNumber(value) + n);
}

/** to − from in ISO weeks (negative when `to` is earlier). */
export function weeksBetween(from: IsoWeek, to: IsoWeek): number {
  return weekNumber(to) - weekNumber(from);
}

/** Consecutive weeks from `from` to `to`, both included (empty when `to` is before `from`). */
export function weekRange(from: IsoWeek, to: IsoWeek): IsoWeek[] {
  const a = weekNumber(from);
  const b = weekNumber(to);
  const out: IsoWeek[] = [];
  for (let n = a; n <= b; n++) out.push(weekFromNumber(n));
  return out;
}
