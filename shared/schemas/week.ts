// The whole training week: the team's sessions (set in the rules) and, per athlete and week, the speed
// work, accessories, training-max share and deload mark the coach edits, plus what the athlete logged.
import { z } from 'zod';
import { ACCOMMODATIONS, BACK_OFF_SETS_MAX, LOAD_PCT_MAX, LOAD_PCT_MIN, isValidRpe } from '../calc';
import { isoWeek } from './common';

// The words for these live with the other labels (no validation code with them, for the phone's first load).
export { ACCESSORY_CATEGORY_LABELS, SESSION_PART_LABELS, WEEKDAY_LABELS } from '../labels';

export const SESSION_PARTS = ['maxEffort', 'speed', 'supplemental', 'accessories', 'tissue'] as const;
export type SessionPart = (typeof SESSION_PARTS)[number];

export const ACCESSORY_CATEGORIES = [
  'upperBack',
  'lats',
  'triceps',
  'hamstrings',
  'abdominals',
  'grip',
  'glutes',
  'shoulders',
] as const;
export type AccessoryCategory = (typeof ACCESSORY_CATEGORIES)[number];

const sessionId = z
  .string()
  .trim()
  .regex(/^[a-z][a-z0-9-]{0,31}$/, 'Use lower-case letters, digits and dashes, starting with a letter');
const speedLift = z.enum(['squat', 'bench', 'deadlift']);

export const sessionSchema = z
  .object({
    id: sessionId,
    name: z.string().trim().min(1, 'Give the session a name').max(40, 'At most 40 characters'),
    /** 1 = Monday … 7 = Sunday. */
    weekday: z.number({ message: 'Pick a day' }).int().min(1, 'Pick a day').max(7, 'Pick a day'),
    parts: z
      .array(z.enum(SESSION_PARTS))
      .min(1, 'Pick at least one part')
      .max(SESSION_PARTS.length)
      .refine((p) => new Set(p).size === p.length, 'Each part once'),
    /** The max-effort slot this session holds, when it has a max-effort part. */
    slotId: z.string().trim().max(32).nullable().default(null),
    /** The competition lift of the speed part, when it has one. */
    speedLift: speedLift.nullable().default(null),
  })
  .superRefine((s, ctx) => {
    if (s.parts.includes('maxEffort') && !s.slotId) {
      ctx.addIssue({ code: 'custom', path: ['slotId'], message: 'Pick the max-effort slot this session holds' });
    }
    if (s.parts.includes('speed') && !s.speedLift) {
      ctx.addIssue({ code: 'custom', path: ['speedLift'], message: 'Pick the lift of the speed work' });
    }
  });
export type Session = z.output<typeof sessionSchema>;

export const sessionsSchema = z.array(sessionSchema).max(7, 'At most 7 sessions a week');

/** A four-session week (common practice for this kind of training; no published source). */
export const DEFAULT_SESSIONS: Session[] = [
  {
    id: 'lower-me',
    name: 'Lower max effort',
    weekday: 1,
    parts: ['maxEffort', 'supplemental', 'accessories'],
    slotId: 'lower',
    speedLift: null,
  },
  {
    id: 'upper-me',
    name: 'Upper max effort',
    weekday: 3,
    parts: ['maxEffort', 'accessories', 'tissue'],
    slotId: 'upper',
    speedLift: null,
  },
  {
    id: 'lower-speed',
    name: 'Lower speed',
    weekday: 5,
    parts: ['speed', 'accessories'],
    slotId: null,
    speedLift: 'squat',
  },
  {
    id: 'upper-speed',
    name: 'Upper speed',
    weekday: 6,
    parts: ['speed', 'accessories', 'tissue'],
    slotId: null,
    speedLift: 'bench',
  },
];

/** Sessions for rules saved before sessions existed: one max-effort session per slot, the default week if it fits. */
export function defaultSessionsFor(slots: readonly unknown[]): Session[] {
  const ids = slots.map((s) => (typeof s === 'object' && s && 'id' in s ? String((s as { id: unknown }).id) : ''));
  if (DEFAULT_SESSIONS.every((d) => d.slotId === null || ids.includes(d.slotId))) return DEFAULT_SESSIONS;
  return slots.slice(0, 4).map((slot, i) => {
    const { id, label } = slot as { id: string; label?: string };
    return {
      id: `me-${i + 1}`,
      name: String(label ?? id).slice(0, 40),
      weekday: 1 + 2 * i,
      parts: ['maxEffort', 'accessories'],
      slotId: id,
      speedLift: null,
    };
  });
}

const pctField = z
  .number({ message: `Enter a percentage from ${LOAD_PCT_MIN} to ${LOAD_PCT_MAX}` })
  .min(LOAD_PCT_MIN, `Use ${LOAD_PCT_MIN} to ${LOAD_PCT_MAX} %`)
  .max(LOAD_PCT_MAX, `Use ${LOAD_PCT_MIN} to ${LOAD_PCT_MAX} %`);
const repsField = (max: number) =>
  z
    .number({ message: 'Enter a number of reps' })
    .int('Whole reps')
    .min(1, 'At least 1 rep')
    .max(max, `At most ${max} reps`);
const setsField = (max: number) =>
  z
    .number({ message: 'Enter a number of sets' })
    .int('Whole sets')
    .min(1, 'At least 1 set')
    .max(max, `At most ${max} sets`);

export const speedWorkSchema = z.object({
  pct: pctField,
  sets: setsField(20),
  reps: repsField(10),
  accommodation: z.enum(ACCOMMODATIONS as unknown as ['none', 'bands', 'chains']),
});
export type SpeedWork = z.infer<typeof speedWorkSchema>;

export const accessoryWorkSchema = z
  .object({
    /** The library accessory it was chosen from; null for work typed in by hand (or saved before the library). */
    accessoryId: z.number().int().positive().nullable().default(null),
    name: z.string().trim().min(1, 'Name the exercise').max(60, 'At most 60 characters'),
    category: z.enum(ACCESSORY_CATEGORIES),
    sets: setsField(10),
    reps: repsField(100),
    loadKg: z.number({ message: 'Enter a load' }).positive('Above 0').max(500).nullable(),
    rpe: z.number({ message: 'Enter an RPE' }).refine(isValidRpe, 'RPE 6 to 10 in half steps').nullable(),
  })
  .refine((a) => a.loadKg === null || a.rpe === null, { path: ['rpe'], message: 'Give a load or an RPE, not both' });
export type AccessoryWork = z.infer<typeof accessoryWorkSchema>;

export const sessionWorkSchema = z.object({
  speed: speedWorkSchema.nullable(),
  accessories: z.array(accessoryWorkSchema).max(12, 'At most 12 accessories'),
});
export type SessionWork = z.infer<typeof sessionWorkSchema>;

export const trainingMaxPctField = z
  .number({ message: 'Enter a share from 50 to 100 %' })
  .min(50, 'At least 50 % of the estimate')
  .max(100, 'At most 100 % of the estimate');

export const athleteWeekParams = z.object({
  athleteId: z.coerce.number().int().positive(),
  week: isoWeek,
});

/** `PUT /api/athletes/:athleteId/weeks/:week`: the whole week's work, with the version that was read (0: none). */
export const athleteWeekBody = z.object({
  version: z.number().int().min(0),
  deload: z.boolean(),
  trainingMaxPct: trainingMaxPctField,
  sessions: z.record(sessionId, sessionWorkSchema),
});
export type AthleteWeekBody = z.input<typeof athleteWeekBody>;

export interface LiftMax {
  /** The best RPE-aware e1RM on the competition lift. */
  e1rmKg: number;
  trainingMaxKg: number;
}

export interface WeekSession extends Session {
  /** The ISO date the session falls on. */
  date: string;
  /** What is planned, deload already applied; null where the session has no such part. */
  speed: (SpeedWork & { lift: 'squat' | 'bench' | 'deadlift'; barKg: number | null; accommodationKg: number }) | null;
  accessories: AccessoryWork[];
}

export interface AthleteWeek {
  athleteId: number;
  week: string;
  deload: boolean;
  trainingMaxPct: number;
  maxes: Record<'squat' | 'bench' | 'deadlift', LiftMax | null>;
  /** As the coach set it (before the deload is applied), per session id. */
  work: Record<string, SessionWork>;
  sessions: WeekSession[];
  /** What the athlete logged of the week's sessions (the coach reads it beside the plan). */
  logs: SessionLog[];
  /** 0 while nothing was saved for the week (the defaults apply). */
  version: number;
  updatedAt: string | null;
}

/**
 * `PUT /api/my-week/sessions/:sessionId`: what the athlete did of one session. A count left out stays as
 * stored (none stored: nothing done), so the session card and the back-off ticks each send only their own.
 */
export const sessionLogParams = z.object({ sessionId });
export const sessionLogBody = z.object({
  week: isoWeek,
  version: z.number().int().min(0),
  speedSetsDone: z.number().int().min(0).max(20).optional(),
  accessorySetsDone: z.array(z.number().int().min(0).max(10)).max(12).optional(),
  /** Each back-off set after the max-effort top set, ticked or not, in order. */
  backOffDone: z.array(z.boolean()).max(BACK_OFF_SETS_MAX, `At most ${BACK_OFF_SETS_MAX} back-off sets`).optional(),
  done: z.boolean().optional(),
});
export type SessionLogBody = z.input<typeof sessionLogBody>;

export interface SessionLog {
  sessionId: string;
  speedSetsDone: number;
  accessorySetsDone: number[];
  backOffDone: boolean[];
  done: boolean;
  version: number;
}

/** A session on the athlete's week page: the plan and what was logged of it. */
export interface MyWeekSession extends WeekSession {
  log: SessionLog | null;
}
