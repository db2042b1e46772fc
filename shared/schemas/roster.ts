// The roster's contracts: athletes (with equipment, a linked account and rule overrides), their
// restrictions, and the read-only history of picks, top sets and bodyweights on the Athlete page.
import type { Sex } from '../calc/classes';
import { z } from 'zod';
import { idParam, isoDate, isoWeek, listQuery, versionField } from './common';
import { booleanQuery, emphasisSchema, optionalQueryText, optionalText, sortParam } from './library';
import { athleteRuleOverridesSchema, equipmentListSchema, jointSchema, liftSchema, riskSchema } from './rules';

export const sexSchema = z.enum(['M', 'F']);
export const divisionSchema = z.enum(['open', 'junior', 'subjunior']);
/** The heaviest risk tier the planner may pick for the athlete; null: no ceiling. */
export const maxRiskSchema = riskSchema.nullish().transform((v) => v ?? null);

const thisYear = new Date().getUTCFullYear();

export const athleteFields = {
  name: z.string().trim().min(1, 'Enter the athlete’s name').max(120, 'Use at most 120 characters'),
  sex: sexSchema,
  birthYear: z
    .number({ message: 'Enter a year like 1998' })
    .int('Enter a year like 1998')
    .min(1900, 'Enter a year like 1998')
    .max(thisYear, 'That year has not come yet')
    .nullish()
    .transform((v) => v ?? null),
  division: divisionSchema,
  maxRisk: maxRiskSchema,
  equipment: equipmentListSchema,
  ruleOverrides: athleteRuleOverridesSchema,
  notes: optionalText(2000),
  /** The team member's account this roster entry belongs to, or null for none. */
  userId: idParam.nullish().transform((v) => v ?? null),
};

export const athleteBody = z.object({
  ...athleteFields,
  division: athleteFields.division.default('open'),
  maxRisk: athleteFields.maxRisk.optional(),
  /** Left out: the gym's equipment list. */
  equipment: athleteFields.equipment.optional(),
  ruleOverrides: athleteFields.ruleOverrides.default({}),
  userId: athleteFields.userId.optional(),
});
export type AthleteBody = z.input<typeof athleteBody>;

export const athletePatchBody = z
  .object(athleteFields)
  .partial()
  .extend({ archived: z.boolean().optional(), version: versionField });
export type AthletePatchBody = z.input<typeof athletePatchBody>;

export const athleteSortKeys = ['name', 'maxRisk', 'division', 'createdAt'] as const;

export const athleteListQuery = listQuery.extend({
  q: optionalQueryText(120),
  includeArchived: booleanQuery,
  sort: sortParam(athleteSortKeys, 'name'),
});
export type AthleteListQuery = z.input<typeof athleteListQuery>;

export const athleteParams = z.object({ id: idParam });
export const restrictionParams = z.object({ id: idParam, restrictionId: idParam });

/** A family name as the library spells it. */
const familyName = z.string().trim().min(1, 'Name the family').max(60, 'Use at most 60 characters');

const restrictionFields = {
  /** A joint and its stress cap go together; both null when the restriction is by emphasis or family only. */
  joint: jointSchema.nullish().transform((v) => v ?? null),
  maxStress: z
    .number({ message: 'Enter 0 to 3' })
    .int('Use a whole number from 0 to 3')
    .min(0, 'Use 0 to 3')
    .max(3, 'Use 0 to 3')
    .nullish()
    .transform((v) => v ?? null),
  /** No pick with one of these emphases while it is in force. */
  emphasis: z
    .array(emphasisSchema)
    .max(3)
    .transform((l) => [...new Set(l)]),
  /** No pick of these families while it is in force. */
  families: z
    .array(familyName)
    .max(12, 'At most 12 families')
    .transform((l) => [...new Set(l)]),
  fromDate: isoDate,
  toDate: isoDate.nullish().transform((v) => v ?? null),
  note: optionalText(500),
};

export interface RestrictionShape {
  joint?: string | null | undefined;
  maxStress?: number | null | undefined;
  emphasis?: readonly string[] | undefined;
  families?: readonly string[] | undefined;
  fromDate?: string | undefined;
  toDate?: string | null | undefined;
}

/**
 * What is wrong with a whole restriction, per field: it must restrict something (a joint with its cap,
 * an emphasis or a family), a joint needs its cap and a cap its joint, and it cannot end before it starts.
 * Used by the body schemas and by the server after merging a partial edit into the stored row.
 */
export function restrictionProblems(r: RestrictionShape): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  const hasJoint = r.joint != null;
  const hasCap = r.maxStress != null;
  if (hasJoint && !hasCap) out.maxStress = ['Enter the highest stress allowed, 0 to 3'];
  if (hasCap && !hasJoint) out.joint = ['Pick the joint this cap is for'];
  if (!hasJoint && !hasCap && !r.emphasis?.length && !r.families?.length) {
    out.joint = ['Restrict a joint, an emphasis or a family'];
  }
  if (r.fromDate && r.toDate && r.toDate < r.fromDate) out.toDate = ['The end cannot be before the start'];
  return out;
}

function addProblems(r: RestrictionShape, ctx: z.RefinementCtx) {
  for (const [path, messages] of Object.entries(restrictionProblems(r))) {
    for (const message of messages) ctx.addIssue({ code: 'custom', path: [path], message });
  }
}

export const restrictionBody = z
  .object({
    ...restrictionFields,
    emphasis: restrictionFields.emphasis.default([]),
    families: restrictionFields.families.default([]),
  })
  .superRefine(addProblems);
export type RestrictionBody = z.input<typeof restrictionBody>;

/** A partial edit: only the order of the dates it names is checked here; the merged row is checked on save. */
export const restrictionPatchBody = z
  .object(restrictionFields)
  .partial()
  .extend({ version: versionField })
  .superRefine((r, ctx) => {
    if (r.fromDate && r.toDate && r.toDate < r.fromDate) {
      ctx.addIssue({ code: 'custom', path: ['toDate'], message: 'The end cannot be before the start' });
    }
  });
export type RestrictionPatchBody = z.input<typeof restrictionPatchBody>;

export const restrictionSchema = z.object({
  id: z.number(),
  athleteId: z.number(),
  joint: jointSchema.nullable(),
  maxStress: z.number().nullable(),
  emphasis: z.array(emphasisSchema),
  families: z.array(z.string()),
  fromDate: z.string(),
  toDate: z.string().nullable(),
  /** The ISO weeks the dates fall in: the planner applies the restriction to these weeks. */
  fromWeek: z.string(),
  toWeek: z.string().nullable(),
  note: z.string().nullable(),
  /** In force today: started and not yet ended. */
  active: z.boolean(),
  version: z.number(),
});
export type Restriction = z.infer<typeof restrictionSchema>;

/** `PUT|DELETE /api/athletes/:athleteId/rest-weeks/:week`. */
export const restWeekParams = z.object({ athleteId: idParam, week: isoWeek });

export interface RestWeek {
  athleteId: number;
  week: string;
  createdAt: string;
}

/** A meet the athlete is entered in. */
export interface AthleteMeet {
  meetId: number;
  entryId: number;
  name: string;
  date: string;
  weightClass: string | null;
}

export interface AthleteAccount {
  id: number;
  name: string;
  email: string;
}

export interface Athlete {
  id: number;
  name: string;
  sex: Sex;
  birthYear: number | null;
  division: z.infer<typeof divisionSchema>;
  maxRisk: 1 | 2 | 3 | null;
  equipment: string[];
  ruleOverrides: z.infer<typeof athleteRuleOverridesSchema>;
  notes: string | null;
  archived: boolean;
  account: AthleteAccount | null;
  restrictions: Restriction[];
  /** Upcoming meets first (soonest first), then past ones (latest first). */
  meets: AthleteMeet[];
  latestBodyweight: { weightKg: number; measuredOn: string } | null;
  version: number;
  updatedAt: string;
}

/** A team member with the athlete role, and the roster entry their account is linked to. */
export interface LinkableAccount extends AthleteAccount {
  athleteId: number | null;
}

export const athleteHistoryQuery = z.object({
  from: z.preprocess((v) => (v === '' ? undefined : v), isoWeek.optional()),
  to: z.preprocess((v) => (v === '' ? undefined : v), isoWeek.optional()),
});

export interface HistoryPick {
  id: number;
  week: string;
  slotId: string;
  variantId: number | null;
  variantName: string | null;
  variantArchived: boolean;
  lift: z.infer<typeof liftSchema> | null;
  family: string | null;
  source: 'engine' | 'coach';
  pinned: boolean;
  reason: string | null;
}

export interface HistoryTopSet {
  id: number;
  week: string;
  performedOn: string;
  variantId: number;
  variantName: string;
  lift: z.infer<typeof liftSchema>;
  weightKg: number;
  reps: number;
  rpe: number | null;
  e1rmKg: number;
}

export interface AthleteHistory {
  picks: HistoryPick[];
  topSets: HistoryTopSet[];
  bodyweights: { measuredOn: string; weightKg: number }[];
}
