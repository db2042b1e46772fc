// What the Meet day screen shows, worked out from the server's state plus the marks still waiting to be
// sent: each lift's attempts, the next offer, the running total and points, and the lifting order.
import {
  MEET_LIFTS,
  nextOffer,
  standingOf,
  type JudgedAttempt,
  type MeetLift,
  type NextOffer,
  type Standing,
} from '../../../../shared/calc';
import type { DayEntry, MeetDay } from '../../../../shared/schemas';
import type { QueuedMark } from '../api/mark-queue';

export { LIFT_NAME } from '../../../../shared/labels';
export const ATTEMPT_NAME = ['1st', '2nd', '3rd'] as const;

export interface ViewAttempt {
  attemptNo: number;
  weightKg: number;
  result: 'good' | 'missed';
  record: boolean;
  /** Marked here but not yet on the server. */
  waiting: boolean;
  id: number | null;
  version: number | null;
}

export interface LifterView {
  entry: DayEntry;
  attempts: Record<MeetLift, ViewAttempt[]>;
  standing: Standing;
  offers: Record<MeetLift, NextOffer | null>;
}

function merged(entry: DayEntry, lift: MeetLift, waiting: readonly QueuedMark[]): ViewAttempt[] {
  const out: ViewAttempt[] = entry.attempts[lift].map((a) => ({ ...a, waiting: false }));
  for (const m of waiting) {
    if (m.entryId !== entry.entryId || m.lift !== lift) continue;
    if (out.some((a) => a.attemptNo === m.attemptNo)) continue; // the server already has one: it counts
    out.push({ ...m, waiting: true, id: null, version: null });
  }
  return out.sort((a, b) => a.attemptNo - b.attemptNo);
}

const judged = (list: ViewAttempt[]): JudgedAttempt[] =>
  list.map((a) => ({ kg: a.weightKg, good: a.result === 'good' }));

export function lifterView(day: MeetDay, entry: DayEntry, waiting: readonly QueuedMark[]): LifterView {
  const attempts = {
    squat: merged(entry, 'squat', waiting),
    bench: merged(entry, 'bench', waiting),
    deadlift: merged(entry, 'deadlift', waiting),
  };
  const offers = Object.fromEntries(
    MEET_LIFTS.map((lift) => [
      lift,
      nextOffer(judged(attempts[lift]), entry.plan[lift]?.[0] ?? null, entry.jumps[lift], {
        record: attempts[lift].at(-1)?.record ?? false,
      }),
    ]),
  ) as Record<MeetLift, NextOffer | null>;
  const standing = standingOf(
    { squat: judged(attempts.squat), bench: judged(attempts.bench), deadlift: judged(attempts.deadlift) },
    entry.weighInKg,
    entry.athlete.sex,
    { equipment: day.meet.equipment },
  );
  return { entry, attempts, standing, offers };
}

/**
 * The order lifters come up on one lift within a flight: everyone's next attempt of the lowest round
 * first, lightest weight first, then by lot number; lifters who are done go last.
 */
export function liftingOrder(views: LifterView[], lift: MeetLift, chosenKg: (v: LifterView) => number | null) {
  const key = (v: LifterView) => {
    const done = v.attempts[lift].length;
    return [done, chosenKg(v) ?? Number.POSITIVE_INFINITY, v.entry.lot ?? Number.POSITIVE_INFINITY] as const;
  };
  return [...views].sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    for (let i = 0; i < ka.length; i++) if (ka[i] !== kb[i]) return ka[i]! < kb[i]! ? -1 : 1;
    return a.entry.athlete.name.localeCompare(b.entry.athlete.name);
  });
}

export function flightsOf(views: LifterView[]): [string, LifterView[]][] {
  const map = new Map<string, LifterView[]>();
  for (const v of views) map.set(v.entry.flight, [...(map.get(v.entry.flight) ?? []), v]);
  return [...map].sort(([a], [b]) => a.localeCompare(b));
}

export const points = (n: number | null) => (n === null ? '—' : n.toFixed(2));
