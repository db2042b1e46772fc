// The rest of the training week around the max-effort picks: the default speed wave of a week and what a
// deload takes off. Pure; the server and the browser resolve a week with the same rules.
import { speedWave, type SpeedWaveOptions } from '../calc';
import type { AccessoryWork, Session, SessionWork, SpeedWork } from '../schemas/week';
import { weekNumber, type IsoWeek } from './weeks';

/** Weeks in a speed wave before it starts again (common practice: about three, no published source). */
export const SPEED_WAVE_WEEKS = 3;
/** How far a deload lowers speed work, in percentage points of the training max (common practice). */
export const DELOAD_SPEED_DROP_PCT = 10;

/** Which week of the speed wave an ISO week is (1-based), counted on from a fixed origin so it never jumps. */
export function waveWeek(week: IsoWeek, weeks = SPEED_WAVE_WEEKS): number {
  return (((weekNumber(week) % weeks) + weeks) % weeks) + 1;
}

/** The speed work a session gets when the coach has not set the week: this week of the default wave. */
export function defaultSpeedWork(lift: SpeedWaveOptions['lift'], week: IsoWeek): SpeedWork {
  // A nominal 100 kg max: only the percentage, sets and reps are taken from the wave.
  const wave = speedWave(100, { weeks: SPEED_WAVE_WEEKS, lift });
  const w = wave[waveWeek(week) - 1]!;
  return { pct: w.pct, sets: w.sets, reps: w.reps, accommodation: 'none' };
}

/** A session's work for the week: what the coach stored, else the defaults of its parts. */
export function sessionWorkFor(session: Session, week: IsoWeek, stored: SessionWork | undefined): SessionWork {
  const speed =
    session.parts.includes('speed') && session.speedLift
      ? (stored?.speed ?? defaultSpeedWork(session.speedLift, week))
      : null;
  const accessories = session.parts.includes('accessories') ? (stored?.accessories ?? []) : [];
  return { speed, accessories };
}

/**
 * A deload week keeps the sessions but lightens them (common practice, no published source): speed work
 * 10 points lower (never under 30 %) with a third fewer sets, accessories one set fewer (at least one) and
 * an RPE target at most 7.
 */
export function deloaded(work: SessionWork): SessionWork {
  const speed = work.speed
    ? {
        ...work.speed,
        pct: Math.max(30, work.speed.pct - DELOAD_SPEED_DROP_PCT),
        sets: Math.max(1, Math.round((work.speed.sets * 2) / 3)),
      }
    : null;
  const accessories = work.accessories.map((a): AccessoryWork => ({
    ...a,
    sets: Math.max(1, a.sets - 1),
    rpe: a.rpe === null ? null : Math.min(a.rpe, 7),
  }));
  return { speed, accessories };
}
