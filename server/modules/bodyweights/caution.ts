// The bodyweight-gain caution before a meet: gaining fast in the last days changes leverages and adds
// torque on tendons, so coaches warn against it (common practice; the line is the team's own setting).
import type { Bodyweight, BodyweightChange } from '../../../shared/schemas';

const DAY_MS = 86_400_000;
/** The gain is measured over this many days, and the caution applies this many days before a meet. */
export const GAIN_WINDOW_DAYS = 7;

function dayNumber(isoDate: string): number {
  return Math.round(Date.parse(`${isoDate}T00:00:00Z`) / DAY_MS);
}

/**
 * Latest reading minus the earliest one in the 7 days before it (readings in any order). Null with fewer
 * than two readings in that span.
 */
export function sevenDayChange(readings: readonly Bodyweight[]): BodyweightChange | null {
  if (readings.length < 2) return null;
  const sorted = [...readings].sort((a, b) => a.measuredOn.localeCompare(b.measuredOn));
  const latest = sorted[sorted.length - 1]!;
  const end = dayNumber(latest.measuredOn);
  const base = sorted.find((r) => r !== latest && end - dayNumber(r.measuredOn) <= GAIN_WINDOW_DAYS);
  if (!base || base.measuredOn === latest.measuredOn) return null;
  return {
    gainKg: Math.round((latest.weightKg - base.weightKg) * 100) / 100,
    fromDate: base.measuredOn,
    toDate: latest.measuredOn,
  };
}

/** Days from `today` to the meet (0 on meet day, negative after it). */
export function daysUntil(today: string, meetDate: string): number {
  return dayNumber(meetDate) - dayNumber(today);
}

/**
 * The caution, when the meet is 0–7 days away and the 7-day gain is above the team's line. A reading
 * older than the window (the athlete stopped weighing in) is not evidence of a recent gain.
 */
export function gainCaution(opts: {
  readings: readonly Bodyweight[];
  today: string;
  meet: { name: string; date: string } | null;
  thresholdKg: number;
}): (BodyweightChange & { meetName: string; meetDate: string }) | null {
  const { meet } = opts;
  if (!meet) return null;
  const days = daysUntil(opts.today, meet.date);
  if (days < 0 || days > GAIN_WINDOW_DAYS) return null;
  const change = sevenDayChange(opts.readings);
  if (!change || daysUntil(change.toDate, opts.today) > GAIN_WINDOW_DAYS) return null;
  if (!(change.gainKg > opts.thresholdKg)) return null;
  return { ...change, meetName: meet.name, meetDate: meet.date };
}
