// Meet day's contracts: marking an attempt good or missed (with an idempotency key), the weigh-in, the
// athlete's usual jumps, and the live state of every entered athlete.
import { z } from 'zod';
import type { AgeGroup, MeetLift } from '../calc';
import { idParam, versionField } from './common';
import { attemptKgSchema, weightClassSchema, type AttemptPlan } from './meets';
import { divisionSchema, sexSchema } from './roster';

export const meetLiftSchema = z.enum(['squat', 'bench', 'deadlift']);
export const attemptResultSchema = z.enum(['good', 'missed'], { message: 'Mark the attempt good or missed' });

export const meetDayParams = z.object({ id: idParam });
export const meetDayEntryParams = z.object({ id: idParam, entryId: idParam });
export const meetDayAttemptParams = z.object({ id: idParam, attemptId: idParam });

/** A client-made key (a UUID or similar) naming one mark, so a resend never counts twice. */
export const idempotencyKeySchema = z
  .string()
  .trim()
  .min(8, 'The mark key is too short')
  .max(64, 'The mark key is too long')
  .regex(/^[A-Za-z0-9_-]+$/, 'The mark key may use letters, digits, - and _');

export const markBody = z.object({
  key: idempotencyKeySchema,
  entryId: idParam,
  lift: meetLiftSchema,
  attemptNo: z.number().int().min(1, 'Attempts are 1 to 3').max(3, 'Attempts are 1 to 3'),
  weightKg: attemptKgSchema,
  record: z.boolean().default(false),
  result: attemptResultSchema,
});
export type MarkBody = z.input<typeof markBody>;

export const undoMarkQuery = z.object({ version: z.coerce.number().int().positive() });

export const weighInBody = z.object({
  bodyweightKg: z
    .number({ message: 'Enter the bodyweight in kg' })
    .min(30, 'Enter a bodyweight of at least 30 kg')
    .max(300, 'Use at most 300 kg')
    .refine((n) => Math.abs(n * 100 - Math.round(n * 100)) < 1e-6, 'Use at most two decimals'),
  weightClass: weightClassSchema.optional(),
  flight: z
    .string()
    .trim()
    .regex(/^[A-Z]{1,2}$/, 'Use a flight letter like A or B')
    .optional(),
  lot: z.number().int().min(1, 'Lot numbers start at 1').max(999, 'Use at most 999').nullish(),
  version: versionField,
});
export type WeighInBody = z.input<typeof weighInBody>;

/** A jump between attempts: 2.5 kg steps from 2.5 to 50 kg. */
const jumpKg = z
  .number({ message: 'Enter a jump in kg' })
  .min(2.5, 'A jump is at least 2.5 kg')
  .max(50, 'Use at most 50 kg')
  .refine((n) => Math.abs(n / 2.5 - Math.round(n / 2.5)) < 1e-9, 'Jumps go in 2.5 kg steps');
const jumpPair = z.tuple([jumpKg, jumpKg]);
export const attemptJumpsSchema = z.object({ squat: jumpPair, bench: jumpPair, deadlift: jumpPair }).strict();
export type AttemptJumps = z.infer<typeof attemptJumpsSchema>;
export const jumpsBody = z.object({ jumps: attemptJumpsSchema, version: versionField.nullish() });
export type JumpsBody = z.input<typeof jumpsBody>;

/** Common practice (no single source): about 5 kg to the second attempt and 2.5 kg to the third on bench, more on squat and deadlift. */
export const DEFAULT_JUMPS: AttemptJumps = { squat: [10, 7.5], bench: [5, 2.5], deadlift: [10, 7.5] };

export interface DayAttempt {
  id: number;
  attemptNo: number;
  weightKg: number;
  record: boolean;
  result: 'good' | 'missed';
  version: number;
}

export interface DayEntry {
  entryId: number;
  athlete: {
    id: number;
    name: string;
    sex: z.infer<typeof sexSchema>;
    birthYear: number | null;
  };
  /** From the birth year and the meet's year; null without a birth year. */
  ageGroup: AgeGroup | null;
  division: z.infer<typeof divisionSchema>;
  weightClass: string | null;
  weighInKg: number | null;
  flight: string;
  lot: number | null;
  plan: AttemptPlan;
  jumps: AttemptJumps;
  /** null until the coach saves the athlete's own jumps (the defaults are shown). */
  jumpsVersion: number | null;
  attempts: Record<MeetLift, DayAttempt[]>;
  version: number;
}

export interface MeetDay {
  meet: {
    id: number;
    name: string;
    date: string;
    equipment: 'classic' | 'equipped';
    resultsSavedAt: string | null;
  };
  entries: DayEntry[];
}

export interface MarkResult {
  /** The same key sent again: the stored result, nothing new written. */
  replay: boolean;
  attempt: DayAttempt & { entryId: number; lift: MeetLift };
}
