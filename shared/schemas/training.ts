// What athletes report: top sets, bodyweights and next-day connective-tissue check-ins, and the series
// drawn from them. Weights travel in kilograms in answers; a logged weight arrives in the athlete's unit.
import { z } from 'zod';
import { E1RM_MAX_REPS, RPE_MAX, RPE_MIN, isValidRpe } from '../calc';
import type { TissueKind, TissuePrescription, TissueSuggestion } from '../engine/tissue';
import { idParam, isoDate, isoWeek, unitSchema } from './common';
import { jointSchema, liftSchema } from './rules';

/** Heaviest weight a top set may be logged with, per unit: well above any recorded lift. */
export const MAX_LOGGED_WEIGHT = { kg: 600, lb: 1320 } as const;
export const MAX_TOP_SET_REPS = E1RM_MAX_REPS.epley;

/** Form text reads as a number too: an empty field is missing, and a decimal comma is a point. */
const blankToUndefined = (v: unknown) =>
  typeof v === 'string' ? (v.trim() === '' ? undefined : v.trim().replace(',', '.')) : v;

const weightInput = z.preprocess(
  blankToUndefined,
  z.coerce
    .number({ message: 'Enter the weight' })
    .refine(Number.isFinite, 'Enter the weight')
    .positive('The weight must be more than 0'),
);

export const rpeField = z.coerce
  .number({ message: 'Pick an RPE' })
  .refine(isValidRpe, `RPE runs from ${RPE_MIN} to ${RPE_MAX} in half steps`);

export const schemeSchema = z.enum(['single', 'triple', 'five']);
export type Scheme = z.infer<typeof schemeSchema>;
export const SCHEME_REPS: Readonly<Record<Scheme, number>> = { single: 1, triple: 3, five: 5 };

export const logTopSetBody = z
  .object({
    planEntryId: idParam,
    unit: unitSchema,
    weight: weightInput,
    reps: z.preprocess(
      blankToUndefined,
      z.coerce
        .number({ message: 'Enter the reps' })
        .int('Whole reps only')
        .min(1, 'At least 1 rep')
        .max(MAX_TOP_SET_REPS, `At most ${MAX_TOP_SET_REPS} reps: beyond that an e1RM would only mislead`),
    ),
    rpe: z.preprocess((v) => (v === '' || v === undefined ? null : v), rpeField.nullable()),
    note: z.string().trim().max(500, 'At most 500 characters').optional(),
  })
  .superRefine((b, ctx) => {
    if (b.weight > MAX_LOGGED_WEIGHT[b.unit]) {
      ctx.addIssue({ code: 'custom', path: ['weight'], message: `At most ${MAX_LOGGED_WEIGHT[b.unit]} ${b.unit}` });
    }
    if (b.rpe != null && b.reps + (RPE_MAX - b.rpe) > MAX_TOP_SET_REPS) {
      ctx.addIssue({
        code: 'custom',
        path: ['rpe'],
        message: `Reps plus reps left in the tank must be at most ${MAX_TOP_SET_REPS}`,
      });
    }
  });
export type LogTopSetBody = z.input<typeof logTopSetBody>;
export type LogTopSetInput = z.output<typeof logTopSetBody>;

export interface TopSet {
  id: number;
  planEntryId: number | null;
  variantId: number;
  variantName: string;
  lift: z.infer<typeof liftSchema>;
  week: string;
  performedOn: string;
  weightKg: number;
  reps: number;
  rpe: number | null;
  e1rmKg: number;
  note: string | null;
  videoId: number | null;
  version: number;
}

/** A variant's records: best estimated max, and heaviest weight lifted (more reps breaks a tie). */
export interface VariantRecord {
  bestE1rm: TopSet | null;
  heaviest: TopSet | null;
}

export interface LoggedTopSet {
  topSet: TopSet;
  /** The e1RM beats every earlier top set on this variant. */
  newRecord: boolean;
  /** The weight beats every earlier top set on this variant (or ties it with more reps). */
  newHeaviest: boolean;
  /** No earlier top set on this variant: the first mark to beat. */
  firstOnVariant: boolean;
  previousBest: TopSet | null;
}

export const topSetSortSchema = z.enum(['newest', 'oldest', 'e1rm']);
export const topSetListQuery = z.object({
  athleteId: idParam.optional(),
  variantId: idParam.optional(),
  lift: liftSchema.optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
  sort: topSetSortSchema.default('newest'),
});

// ---- bodyweight ---------------------------------------------------------------------------------------

export const MAX_BODYWEIGHT = { kg: 300, lb: 660 } as const;

export const bodyweightDateParams = z.object({ measuredOn: isoDate });

const bodyweightFields = z.object({ unit: unitSchema, weight: weightInput });

function checkBodyweight(b: { unit: 'kg' | 'lb'; weight: number }, ctx: z.RefinementCtx) {
  if (b.weight > MAX_BODYWEIGHT[b.unit]) {
    ctx.addIssue({ code: 'custom', path: ['weight'], message: `At most ${MAX_BODYWEIGHT[b.unit]} ${b.unit}` });
  }
  if (b.weight < (b.unit === 'kg' ? 20 : 44)) {
    ctx.addIssue({ code: 'custom', path: ['weight'], message: 'That is too light for a bodyweight' });
  }
}

export const logBodyweightBody = bodyweightFields.superRefine(checkBodyweight);
/** The same with the day, as the form holds it (the day travels in the path). */
export const bodyweightForm = bodyweightFields.extend({ measuredOn: isoDate }).superRefine(checkBodyweight);
export type BodyweightFormValues = z.input<typeof bodyweightForm>;
export type LogBodyweightBody = z.input<typeof logBodyweightBody>;

export interface Bodyweight {
  id: number;
  measuredOn: string;
  weightKg: number;
}

export const bodyweightListQuery = z.object({
  athleteId: idParam.optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
  sort: z.enum(['newest', 'oldest']).default('newest'),
});

// ---- connective-tissue check-ins ------------------------------------------------------------------------

export const tissueKindSchema = z.enum(['highRep', 'isometric', 'loadedStretch']);

export const tissueCheckinBody = z.object({
  week: isoWeek,
  soreness: z.preprocess(
    blankToUndefined,
    z.coerce
      .number({ message: 'Pick how sore it is' })
      .int('Whole numbers only')
      .min(0, 'From 0 (none)')
      .max(10, 'To 10 (worst)'),
  ),
  painJoints: z
    .array(jointSchema)
    .max(6)
    .transform((l) => [...new Set(l)]),
  note: z.string().trim().max(500, 'At most 500 characters').optional(),
});
export type TissueCheckinBody = z.input<typeof tissueCheckinBody>;

export interface TissueCheckinRow {
  id: number;
  week: string;
  kind: TissueKind;
  soreness: number;
  painJoints: z.infer<typeof jointSchema>[];
  note: string | null;
  createdAt: string;
}

/** One athlete's connective-tissue work for a week, as stored, with the notes and coach suggestions. */
export interface TissueWorkWeek {
  week: string;
  kind: TissueKind | null;
  items: TissuePrescription[];
  notes: string[];
  suggestions: TissueSuggestion[];
}

// ---- series -------------------------------------------------------------------------------------------

export interface E1rmPoint {
  topSetId: number;
  week: string;
  performedOn: string;
  e1rmKg: number;
  weightKg: number;
  reps: number;
  variantId: number;
  variantName: string;
  /** 0..1: how close the variant is to the competition lift. */
  specificity: number;
}

export interface Series {
  e1rm: Record<z.infer<typeof liftSchema>, E1rmPoint[]>;
  bodyweight: Bodyweight[];
}

export interface VariantHistory {
  variantId: number;
  variantName: string;
  lift: z.infer<typeof liftSchema>;
  specificity: number;
  count: number;
  lastOn: string;
  record: VariantRecord;
}
