// How roster values read on screen.
import { weekOfDate, weeksBetween } from '../../../../shared/engine/weeks';
import { RISK_WORD } from '../../../../shared/labels';
export { restrictionText } from '../../../../shared/planning/words';

/** The heaviest risk tier the planner may pick for an athlete, as the roster reads it. */
export const MAX_RISK_LABEL = {
  1: `Risk 1 · ${RISK_WORD[1]} only`,
  2: `Up to risk 2 · ${RISK_WORD[2]}`,
  3: `Up to risk 3 · ${RISK_WORD[3]}`,
} as const;
export const maxRiskText = (m: 1 | 2 | 3 | null) => (m === null ? 'No ceiling' : MAX_RISK_LABEL[m]);
export { DIVISION_LABEL } from '../../../../shared/labels';
export const STRESS_CAP = ['0 · no load at all', '1 · light load only', '2 · up to moderate', '3 · any load'] as const;

export const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Weeks from this ISO week to the date's, as the board counts "weeks out". */
export function weeksUntil(date: string, today = new Date()): number {
  return weeksBetween(weekOfDate(today), weekOfDate(new Date(`${date}T12:00:00Z`)));
}

export function whenText(date: string, today = new Date()): string {
  if (date < today.toISOString().slice(0, 10)) return 'done';
  const w = weeksUntil(date, today);
  if (w <= 0) return 'this week';
  return w === 1 ? 'next week' : `${w} weeks out`;
}

export function formatDate(date: string): string {
  return new Date(`${date}T12:00:00Z`).toLocaleDateString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  });
}
