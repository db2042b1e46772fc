// Dates of meets as a coach reads them.
import { weekOfDate, weeksBetween } from '../../../../shared/engine/weeks';

export function dateText(date: string): string {
  return new Date(`${date}T12:00:00Z`).toLocaleDateString(undefined, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  });
}

/** "5 weeks out" (ISO weeks, as the board counts them), "this week", "3 weeks ago". */
export function meetWhen(date: string, now = new Date()): string {
  const w = weeksBetween(weekOfDate(now), weekOfDate(new Date(`${date}T12:00:00Z`)));
  const today = now.toISOString().slice(0, 10);
  if (date === today) return 'today';
  if (w === 0) return date > today ? 'this week' : 'earlier this week';
  if (w > 0) return w === 1 ? 'next week' : `${w} weeks out`;
  return w === -1 ? 'last week' : `${-w} weeks ago`;
}
