// The rest of the training week around the max-effort picks: the default speed wave of a week and what a
// deload takes off. Pure; the server and the browser resolve a week with the same rules.
import type { Lift } from './types';
import { weekNumber, type IsoWeek } from './weeks';

// The shapes the engine works on (the zod contracts in shared/schemas match them).
export interface SpeedWork {
  pct: number;
  sets: number;
  reps: number;
  accommodation: 'none' | 'bands' | 'chains';
}
export interface AccessoryWork {
  accessoryId?: number | null;
  name: string;
  category: string;
  sets: number;
  reps: number;
  loadKg: number | null;
  rpe: number | null;
}
export interface SessionWork {
  speed: SpeedWork | null;
  accessories: AccessoryWork[];
}
interface SessionParts {
  parts: readonly string[];
  speedLift: Lift | null;
}

/** Default speed-day sets × reps per lift (common practice, no published source). */
export const SPEED_SETS_REPS: Readonly<Record<Lift, { sets: number; reps: number }>> = {
  squat: { sets: 10, reps: 2 },
  bench: { sets: 9, reps: 3 },
  deadlift: { sets: 8, reps: 1 },
};
/** The default wave: 50, 55, 60 % of the training max (common practice, no published source). */
export const SPEED_WAVE_START_PCT = 50;
export const SPEED_WAVE_STEP_PCT = 5;

/** Weeks in a speed wave before it starts again (common practice: about three, no published source). */
export const SPEED_WAVE_WEEKS = 3;
/** How far a deload lowers speed work, in percentage points of the training max (common practice). */
export const DELOAD_SPEED_DROP_PCT = 10;

/** Which week of the speed wave an ISO week is (1-based), counted on from a fixed origin so it never jumps. */
export function waveWeek(week: IsoWeek, weeks = SPEED_WAVE_WEEKS): number {
  return (((weekNumber(week) % weeks) + weeks) % weeks) + 1;
}

/** The speed work a session gets when the coach has not set the week: this week of the default wave. */
export function defaultSpeedWork(lift: Lift, week: IsoWeek): SpeedWork {
  const pct = SPEED_WAVE_START_PCT + SPEED_WAVE_STEP_PCT * (waveWeek(week) - 1);
  return { pct, ...SPEED_SETS_REPS[lift], accommodation: 'none' };
}

/** A session's work for the week: what the coach stored, else the defaults of its parts. */
export function sessionWorkFor<W extends SessionWork>(session: SessionParts, week: IsoWeek, stored: W | undefined): W {
  const speed =
    session.parts.includes('speed') && session.speedLift
      ? (stored?.speed ?? defaultSpeedWork(session.speedLift, week))
      : null;
  const accessories = session.parts.includes('accessories') ? (stored?.accessories ?? []) : [];
  return { ...stored, speed, accessories } as W;
}

/**
 * A deload week keeps the sessions but lightens them (common practice, no published source): speed work
 * 10 points lower (never under 30 %) with a third fewer sets, accessories one set fewer (at least one) and
 * an RPE target at most 7.
 */
export function deloaded<W extends SessionWork>(work: W): W {
  const speed = work.speed
    ? {
        ...work.speed,
        pct: Math.max(30, work.speed.pct - DELOAD_SPEED_DROP_PCT),
        sets: Math.max(1, Math.round((work.speed.sets * 2) / 3)),
      }
    : null;
  const accessories = work.accessories.map((a) => ({
    ...a,
    sets: Math.max(1, a.sets - 1),
    rpe: a.rpe === null ? null : Math.min(a.rpe, 7),
  }));
  return { ...work, speed, accessories };
}
