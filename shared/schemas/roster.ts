// The roster's contracts: athletes (with equipment, a linked account and rule overrides), their
// restrictions, and the read-only history of picks, top sets and bodyweights on the Athlete page.
import { z } from 'zod';
import { idParam, isoDate, isoWeek, listQuery, versionField } from './common';
import { booleanQuery, optionalQueryText, optionalText, sortParam } from './library';
import { athleteRuleOverridesSchema, equipmentListSchema, jointSchema, liftSchema } from './rules';

export const sexSchema = z.enum(['M', 'F']);
export const divisionSchema = z.enum(['open', 'junior', 'subjunior']);
export const levelSchema = z.enum(['novice', 'intermediate', 'advanced', 'elite']);

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
  level: levelSchema,
  equipment: equipmentListSchema,
  ruleOverrides: athleteRuleOverridesSchema,
  notes: optionalText(2000),
  /** The team member's account this roster entry belongs to, or null for none. */
  userId: idParam.nullish().transform((v) => v ?? null),
};

export const athleteBody = z.object({
  ...athleteFields,
  division: athleteFields.division.default('open'),
  level: athleteFields.level.default('intermediate'),
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

export const athleteSortKeys = ['name', 'level', 'division', 'createdAt'] as const;

export const athleteListQuery = listQuery.extend({
  q: optionalQueryText(120),
  level: z.preprocess((v) => (v === '' ? undefined : v), levelSchema.optional()),
  includeArchived: booleanQuery,
  sort: sortParam(athleteSortKeys, 'name'),
});
export type AthleteListQuery = z.input<typeof athleteListQuery>;

export const athleteParams = z.object({ id: idParam });
export const restrictionParams = z.object({ id: idParam, restrictionId: idParam });

const restrictionFields = {
  joint: jointSchema,
  maxStress: z
    .number({ message: 'Enter 0 to 3' })
    .int('Use a whole number from 0 to 3')
    .min(0, 'Use 0 to 3')
    .max(3, 'Use 0 to 3'),
  fromDate: isoDate,
  toDate: isoDate.nullish().transform((v) => v ?? null),
  note: optionalText(500),
};

const datesInOrder = (r: { fromDate?: string; toDate?: string | null }) =>
  !r.fromDate || !r.toDate || r.toDate >= r.fromDate;
const ORDER_ISSUE = { path: ['toDate'], message: 'The end cannot be before the start' };

export const restrictionBody = z.object(restrictionFields).refine(datesInOrder, ORDER_ISSUE);
export type RestrictionBody = z.input<typeof restrictionBody>;

export const restrictionPatchBody = z
  .object(restrictionFields)
  .partial()
  .extend({ version: versionField })
  .refine(datesInOrder, ORDER_ISSUE);
export type RestrictionPatchBody = z.input<typeof restrictionPatchBody>;

export const restrictionSchema = z.object({
  id: z.number(),
  athleteId: z.number(),
  joint: jointSchema,
  maxStress: z.number(),
  fromDate: z.string(),
  toDate: z.string().nullable(),
  note: z.string().nullable(),
  /** In force today: started and not yet ended. */
  active: z.boolean(),
  version: z.number(),
});
export type Restriction = z.infer<typeof restrictionSchema>;

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
  sex: 'M' | 'F';
  birthYear: number | null;
  division: z.infer<typeof divisionSchema>;
  level: z.infer<typeof levelSchema>;
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
