// The meets' contracts: a meet, who is entered with which weight class and division, and the attempt
// plan per lift, with the common-practice attempt suggestion from a current estimated max.
import { z } from 'zod';
import { attemptProblem, ATTEMPT_STEP_KG, estimateOneRepMaxAtRpe, estimateOneRepMax } from '../calc';
import { idParam, isoDate, listQuery, versionField } from './common';
import { optionalQueryText, optionalText, sortParam } from './library';
import { divisionSchema, sexSchema } from './roster';

export const meetFields = {
  name: z.string().trim().min(1, 'Give the meet a name').max(160, 'Use at most 160 characters'),
  date: isoDate,
  location: optionalText(160),
  federation: optionalText(120),
  notes: optionalText(2000),
  /** Classic or equipped: which points coefficients meet day uses. */
  equipment: z.enum(['classic', 'equipped']).default('classic'),
};
export const meetBody = z.object(meetFields);
export type MeetBody = z.input<typeof meetBody>;
export const meetPatchBody = z
  .object({ ...meetFields, equipment: z.enum(['classic', 'equipped']) })
  .partial()
  .extend({ version: versionField });
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

/** A weight on the 2.5 kg grid, or else a record attempt in 0.5 kg steps. */
export const isRecordWeight = (kg: number) => Math.round(kg * 1000) % Math.round(ATTEMPT_STEP_KG * 1000) !== 0;

/** Each attempt loadable and on the grid, each after the first at least 2.5 kg over the one before. */
const attemptList = z
  .array(attemptKgSchema)
  .max(3, 'Plan at most three attempts')
  .superRefine((list, ctx) => {
    list.forEach((kg, i) => {
      const prev = i === 0 ? null : { kg: list[i - 1]!, good: true };
      const problem = attemptProblem(kg, prev, { record: isRecordWeight(kg) });
      if (problem) ctx.addIssue({ code: 'custom', message: problem, path: [i] });
    });
  });

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

/** The top set an attempt plan starts from, with the RPE-aware estimate made from it. */
export interface CurrentMax {
  e1rmKg: number;
  variantName: string;
  performedOn: string;
  weightKg: number;
  reps: number;
  rpe: number | null;
  /** The set was on the competition lift itself (not a close variant). */
  competitionLift: boolean;
  /** Older than the freshness window: the plan may no longer match the athlete. */
  stale: boolean;
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
  equipment: 'classic' | 'equipped';
  resultsSavedAt: string | null;
  entries: MeetEntry[];
  version: number;
  updatedAt: string;
}

/** Variants at least this close to the competition lift count toward its current max. */
export const CURRENT_MAX_MIN_SPECIFICITY = 0.85;
/** A competition-lift estimate from within this many weeks is fresh. */
export const FRESH_MAX_WEEKS = 6;
/** How far back a top set is still shown as a (stale) starting point, in weeks. */
export const CURRENT_MAX_WEEKS = 26;
/** Accommodating resistance: a set with these is not a max on the competition lift. */
export const ACCOMMODATION_EQUIPMENT: readonly string[] = ['chains', 'bands'];

/** A top set a plan could start from, with what is known of its variant. */
export interface MaxCandidate {
  variantName: string;
  specificity: number;
  equipment: readonly string[];
  weightKg: number;
  reps: number;
  rpe: number | null;
  performedOn: string;
}

/**
 * The RPE-aware e1RM of a set (reps + reps in reserve to failure, Epley; without an RPE, the reps as done),
 * to the hundredth of a kg. Sets past the formula's range count as their reps as done.
 */
export function candidateE1rm(c: Pick<MaxCandidate, 'weightKg' | 'reps' | 'rpe'>): number {
  let e: number;
  try {
    e = c.rpe === null ? estimateOneRepMax(c.weightKg, c.reps) : estimateOneRepMaxAtRpe(c.weightKg, c.reps, c.rpe);
  } catch {
    e = c.weightKg;
  }
  return Math.round(e * 100) / 100;
}

/**
 * The starting point for a lift's attempts: sets with chains or bands never count; a set on the competition
 * lift (specificity 1) within the fresh window beats any close variant; then a close variant within the
 * window; only then the newest older set, marked stale. Within a tier, the highest RPE-aware e1RM wins.
 */
export function pickCurrentMax(candidates: readonly MaxCandidate[], freshSince: string): CurrentMax | null {
  const usable = candidates.filter(
    (c) =>
      c.specificity >= CURRENT_MAX_MIN_SPECIFICITY && !c.equipment.some((e) => ACCOMMODATION_EQUIPMENT.includes(e)),
  );
  const toMax = (c: MaxCandidate, stale: boolean): CurrentMax => ({
    e1rmKg: candidateE1rm(c),
    variantName: c.variantName,
    performedOn: c.performedOn,
    weightKg: c.weightKg,
    reps: c.reps,
    rpe: c.rpe,
    competitionLift: c.specificity >= 1,
    stale,
  });
  const best = (list: MaxCandidate[]) =>
    list.reduce<MaxCandidate | null>((b, c) => {
      if (!b) return c;
      const d = candidateE1rm(c) - candidateE1rm(b);
      return d > 0 || (d === 0 && c.performedOn > b.performedOn) ? c : b;
    }, null);
  const fresh = usable.filter((c) => c.performedOn >= freshSince);
  const tiers = [fresh.filter((c) => c.specificity >= 1), fresh];
  for (const tier of tiers) {
    const b = best(tier);
    if (b) return toMax(b, false);
  }
  const newest = usable.reduce<MaxCandidate | null>(
    (n, c) =>
      !n || c.performedOn > n.performedOn || (c.performedOn === n.performedOn && candidateE1rm(c) > candidateE1rm(n))
        ? c
        : n,
    null,
  );
  return newest ? toMax(newest, true) : null;
}

/**
 * Common practice, with no single published source (percentages from memory): open with a weight
 * the athlete could triple on a bad day, about 91% of the current max; a second attempt about 96%;
 * a third at about the current max (to the hundredth of a kilo). Each is rounded down to the 2.5 kg steps
 * meets load in, and each is at least 2.5 kg over the one before (the federation's rule after a good lift),
 * so a small max may put the third a step or two over it; never under the 25 kg bar with collars.
 */
export const ATTEMPT_FRACTIONS = [0.91, 0.96, 1] as const;
const EMPTY_BAR_KG = 25;

export function suggestAttempts(currentMaxKg: number): [number, number, number] {
  if (!Number.isFinite(currentMaxKg) || currentMaxKg <= 0) {
    throw new RangeError(`a current max must be a positive number of kg, got ${currentMaxKg}`);
  }
  // Maxes are kept to the hundredth of a kilo; products are cleaned to 4 decimals so float noise
  // (227.49999… for 227.5) cannot pull an attempt down a step.
  const max = Math.round(currentMaxKg * 100) / 100;
  const round = (kg: number) => Math.floor(Math.round(kg * 1e4) / 1e4 / ATTEMPT_STEP_KG) * ATTEMPT_STEP_KG;
  const [a, b, c] = ATTEMPT_FRACTIONS.map((f) => round(max * f)) as [number, number, number];
  const first = Math.max(EMPTY_BAR_KG, a);
  const second = Math.max(first + ATTEMPT_STEP_KG, b);
  return [first, second, Math.max(second + ATTEMPT_STEP_KG, c)];
}
