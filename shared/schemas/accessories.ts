// The accessory library's contracts: an accessory exercise as the form and the API know it (category, joint
// stress, default sets × reps with a load or an RPE target), the list's filters and the rotation suggestion.
import { z } from 'zod';
import { isValidRpe } from '../calc';
import { listQuery, versionField } from './common';
import { booleanQuery, optionalQueryText, optionalText, sortParam, stressSchema } from './library';
import { jointSchema } from './rules';
import { ACCESSORY_CATEGORIES, type AccessoryCategory } from './week';

export const accessoryCategorySchema = z.enum(ACCESSORY_CATEGORIES, { message: 'Pick a category' });

const wholeNumber = (what: string, min: number, max: number) =>
  z
    .number({ message: `Enter a number of ${what}` })
    .int(`Whole ${what}`)
    .min(min, `At least ${min} ${min === 1 ? what.replace(/s$/, '') : what}`)
    .max(max, `At most ${max} ${what}`);

export const accessoryFields = {
  name: z.string().trim().min(1, 'Name the exercise').max(60, 'At most 60 characters'),
  category: accessoryCategorySchema,
  stress: stressSchema,
  sets: wholeNumber('sets', 1, 10),
  reps: wholeNumber('reps', 1, 100),
  loadKg: z
    .number({ message: 'Enter a load in kg' })
    .positive('Above 0')
    .max(500, 'At most 500 kg')
    .refine((n) => Number.isInteger(n * 10), 'Use at most one decimal')
    .nullable(),
  rpe: z.number({ message: 'Enter an RPE' }).refine(isValidRpe, 'RPE 6 to 10 in half steps').nullable(),
  notes: optionalText(500),
};

const loadOrRpe = (a: { loadKg?: number | null; rpe?: number | null }) =>
  a.loadKg === null || a.loadKg === undefined || a.rpe === null || a.rpe === undefined;
const LOAD_OR_RPE = { path: ['rpe'], message: 'Give a load or an RPE, not both' };

export const accessoryBody = z.object(accessoryFields).refine(loadOrRpe, LOAD_OR_RPE);
export type AccessoryBody = z.input<typeof accessoryBody>;
export type AccessoryValues = z.output<typeof accessoryBody>;

export const accessoryPatchBody = z
  .object(accessoryFields)
  .partial()
  .extend({ archived: z.boolean().optional(), version: versionField })
  .refine(loadOrRpe, LOAD_OR_RPE);
export type AccessoryPatchBody = z.input<typeof accessoryPatchBody>;

export const accessorySortKeys = ['name', 'category', 'updatedAt'] as const;

export const accessoryListQuery = listQuery.extend({
  category: z.preprocess((v) => (v === '' ? undefined : v), accessoryCategorySchema.optional()),
  q: optionalQueryText(60),
  includeArchived: booleanQuery,
  sort: sortParam(accessorySortKeys, 'name'),
});
export type AccessoryListQuery = z.input<typeof accessoryListQuery>;
export type AccessoryListFilters = z.output<typeof accessoryListQuery>;

export const libraryAccessorySchema = z.object({
  id: z.number(),
  name: z.string(),
  category: accessoryCategorySchema,
  stress: z.partialRecord(jointSchema, z.number()),
  sets: z.number(),
  reps: z.number(),
  loadKg: z.number().nullable(),
  rpe: z.number().nullable(),
  notes: z.string().nullable(),
  archived: z.boolean(),
  version: z.number(),
  updatedAt: z.string(),
});
export type LibraryAccessory = z.infer<typeof libraryAccessorySchema>;

/** What the rotation suggests for one session of a week, and the categories it could not fill. */
export interface AccessorySuggestion {
  week: string;
  /** The rotation block the week falls in (1-based week of the block). */
  blockWeek: number;
  sessions: Record<
    string,
    {
      accessories: {
        accessoryId: number;
        name: string;
        category: AccessoryCategory;
        sets: number;
        reps: number;
        loadKg: number | null;
        rpe: number | null;
        /** Back before the repeat window is over: every one of its category was used in it. */
        early: boolean;
      }[];
      unfilled: { category: string; reason: string }[];
    }
  >;
}
