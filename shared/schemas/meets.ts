// The meets' contracts: a meet, who is entered with which weight class and division, and the attempt
// plan per lift, with the common-practice attempt suggestion from a current estimated max.
import { z } from 'zod';
import { idParam, isoDate, listQuery, versionField } from './common';
import { optionalQueryText, optionalText, sortParam } from './library';
import { divisionSchema, sexSchema } from './roster';

export const meetFields = {
  name: z.string().trim().min(1, 'Give the meet a name').max(160, 'Use at most 160 characters'),
  date: isoDate,
  location: optionalText(160),
  federation: optionalText(120),
  notes: optionalText(2000),
};
export const meetBody = z.object(meetFields);
export type MeetBody = z.input<typeof meetBody>;
export const meetPatchBody = z.object(meetFields).partial().extend({ version: versionField });
export type MeetPatchBody = z.input<typeof meetPatchBody>;

export const meetSortKeys = ['date', 'name'] as const;
export const meetListQuery = listQuery.extend({
  when: z.preprocess((v) => (v === '' ? undefined : v), z.enum(['upcoming', 'past', 'all']).default('all')),
  q: optionalQueryText(160),
  sort: sortParam(meetSortKeys, 'date'),
});
export type MeetListQuery = z.input<typeof meetListQuery>;

export const meetParams = z.object({ id: idParam });
export const meetEntryParams = z.object({ id: idParam, entryId: idParam });

/** Attempts are planned in kilograms; record attempts may use 0.5 kg steps, so that is the finest allowed. */
export const attemptKgSchema = z
  .number({ message: 'Enter a weight in kg' })
  .positive('Enter a weight above 0')
  .max(600, 'Use at most 600 kg')
  .refine((n) => Math.abs(n * 2 - Math.round(n * 2)) < 1e-9, 'Use steps of 0.5 kg');

const attemptList = z
  .array(attemptKgSchema)
  .max(3, 'Plan at most three attempts')
  .refine((a) => a.every((w, i) => i === 0 || w >= a[i - 1]!), 'Each attempt should be at least the one before');

export const attemptPlanSchema = z
  .object({ squat: attemptList.optional(), bench: attemptList.optional(), deadlift: attemptList.optional() })
  .strict();
export type AttemptPlan = z.infer<typeof attemptPlanSchema>;

/** `83`, `120+`: a category label; the server checks it against the athlete's sex and division. */
export const weightClassSchema = z
  .string()
  .trim()
  .regex(/^\d{2,3}\+?$/, 'Pick a weight class like 63 or 120+')
  .nullish()
  .transform((v) => v || null);

export const meetEntryBody = z.object({
  athleteId: idParam,
  weightClass: weightClassSchema,
  division: divisionSchema.optional(),
  attempts: attemptPlanSchema.default({}),
});
export type MeetEntryBody = z.input<typeof meetEntryBody>;

export const meetEntryPatchBody = z.object({
  weightClass: weightClassSchema.optional(),
  division: divisionSchema.optional(),
  attempts: attemptPlanSchema.optional(),
  version: versionField,
});
export type MeetEntryPatchBody = z.input<typeof meetEntryPatchBody>;

export type CompetitionLift = 'squat' | 'bench' | 'deadlift';
export const COMPETITION_LIFTS: readonly CompetitionLift[] = ['squat', 'bench', 'deadlift'];

export interface CurrentMax {
  e1rmKg: number;
  variantName: string;
  performedOn: string;
}

export interface MeetEntry {
  id: number;
  meetId: number;
  athlete: { id: number; name: string; sex: z.infer<typeof sexSchema>; division: z.infer<typeof divisionSchema> };
  weightClass: string | null;
  division: z.infer<typeof divisionSchema>;
  attempts: AttemptPlan;
  latestBodyweight: { weightKg: number; measuredOn: string } | null;
  /** From the latest bodyweight, by the federation's categories for the entry's division. */
  suggestedClass: string | null;
  /** The best recent e1RM on a variant close to each competition lift, when there is one. */
  currentMax: Record<CompetitionLift, CurrentMax | null>;
  version: number;
}

export interface Meet {
  id: number;
  name: string;
  date: string;
  location: string | null;
  federation: string | null;
  notes: string | null;
  entries: MeetEntry[];
  version: number;
  updatedAt: string;
}

/** Variants at least this close to the competition lift count toward its current max. */
export const CURRENT_MAX_MIN_SPECIFICITY = 0.85;
/** How far back a top set still counts as current, in weeks. */
export const CURRENT_MAX_WEEKS = 12;

/**
 * Common practice, with no single published source (percentages from memory): open with a weight
 * the athlete could triple on a bad day, about 91% of the current max; a second attempt about 96%;
 * a third at about the current max (to the hundredth of a kilo). Each is rounded down to the 2.5 kg steps meets load in.
 */
export const ATTEMPT_FRACTIONS = [0.91, 0.96, 1] as const;
export const ATTEMPT_STEP_KG = 2.5;

export function suggestAttempts(currentMaxKg: number): [number, number, number] {
  if (!Number.isFinite(currentMaxKg) || currentMaxKg <= 0) {
    throw new RangeError(`a current max must be a positive number of kg, got ${currentMaxKg}`);
  }
  // Maxes are kept to the hundredth of a kilo; products are cleaned to 4 decimals so float noise
  // (227.49999… for 227.5) cannot pull an attempt down a step.
  const max = Math.round(currentMaxKg * 100) / 100;
  const round = (kg: number) => Math.floor(Math.round(kg * 1e4) / 1e4 / ATTEMPT_STEP_KG) * ATTEMPT_STEP_KG;
  const [a, b, c] = ATTEMPT_FRACTIONS.map((f) => round(max * f)) as [number, number, number];
  return [a, Math.max(a, b), Math.max(a, b, c)];
}
