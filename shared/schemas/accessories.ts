// The accessory library's contracts: an accessory exercise as the form and the API know it (category, joint
// stress, default sets × reps with a load or an RPE target), the list's filters and the rotation suggestion.
import { z } from 'zod';
import { isValidRpe } from '../calc';
import { listQuery, versionField } from './common';
import { JOINTS, type Joint } from '../engine/types';
import {
  booleanQuery,
  csvNumber,
  escapeCsvCell,
  nameKey,
  normaliseCsvHeader,
  optionalQueryText,
  optionalText,
  sortParam,
  stressSchema,
  unescapeCsvCell,
  type CsvProblem,
} from './library';
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

// ---------------------------------------------------------------------------------------------------
// CSV

/** The accessory library's CSV columns, in export order. */
export const ACCESSORY_CSV_COLUMNS = [
  'name',
  'category',
  'sets',
  'reps',
  'load_kg',
  'rpe',
  'shoulder_stress',
  'elbow_stress',
  'wrist_stress',
  'lower_back_stress',
  'hip_stress',
  'knee_stress',
  'notes',
  'archived',
] as const;
type AccessoryCsvColumn = (typeof ACCESSORY_CSV_COLUMNS)[number];
const ACCESSORY_CSV_REQUIRED: readonly AccessoryCsvColumn[] = ['name', 'category', 'sets', 'reps'];
const JOINT_COLUMN: Record<Joint, AccessoryCsvColumn> = {
  shoulder: 'shoulder_stress',
  elbow: 'elbow_stress',
  wrist: 'wrist_stress',
  lowerBack: 'lower_back_stress',
  hip: 'hip_stress',
  knee: 'knee_stress',
};

export interface AccessoryCsvRow {
  accessory: AccessoryValues;
  archived: boolean;
}

/** `Upper back`, `upper-back` or `upperBack` → `upperBack`. */
const squash = (s: string) => s.toLowerCase().replace(/[\s_-]+/g, '');
const CATEGORY_WORDS = new Map<string, AccessoryCategory>(ACCESSORY_CATEGORIES.map((c) => [squash(c), c]));

/** An accessory as one CSV record, every cell a string, in column order. */
export function accessoryToCsvRecord(
  a: Omit<AccessoryValues, 'stress'> & { stress: Partial<Record<Joint, number>>; archived: boolean },
): string[] {
  const rec: Record<AccessoryCsvColumn, string> = {
    name: a.name,
    category: a.category,
    sets: String(a.sets),
    reps: String(a.reps),
    load_kg: a.loadKg === null ? '' : String(a.loadKg),
    rpe: a.rpe === null ? '' : String(a.rpe),
    shoulder_stress: String(a.stress.shoulder ?? 0),
    elbow_stress: String(a.stress.elbow ?? 0),
    wrist_stress: String(a.stress.wrist ?? 0),
    lower_back_stress: String(a.stress.lowerBack ?? 0),
    hip_stress: String(a.stress.hip ?? 0),
    knee_stress: String(a.stress.knee ?? 0),
    notes: a.notes ?? '',
    archived: a.archived ? 'yes' : 'no',
  };
  return ACCESSORY_CSV_COLUMNS.map((c) => escapeCsvCell(rec[c]));
}

/**
 * A parsed CSV table (header first) → valid rows and every problem: header problems, bad values, a name
 * twice. One problem anywhere refuses the whole file.
 */
export function readAccessoryTable(table: string[][]): { valid: AccessoryCsvRow[]; problems: CsvProblem[] } {
  const [header = [], ...data] = table;
  const keys = header.map(normaliseCsvHeader);
  const problems: CsvProblem[] = [];
  const known = new Set<string>(ACCESSORY_CSV_COLUMNS);
  keys.forEach((k, i) => {
    if (k && !known.has(k)) problems.push({ row: 1, field: header[i]!, message: `Unknown column "${header[i]}"` });
    else if (k && keys.indexOf(k) !== i)
      problems.push({ row: 1, field: k, message: `The column "${k}" appears twice` });
  });
  for (const col of ACCESSORY_CSV_REQUIRED) {
    if (!keys.includes(col)) problems.push({ row: 1, field: col, message: `The column "${col}" is missing` });
  }
  const valid: AccessoryCsvRow[] = [];
  const firstRowOf = new Map<string, number>();
  data.forEach((cells, i) => {
    const row = i + 2;
    if (cells.every((c) => c.trim() === '')) return;
    const cell = (c: AccessoryCsvColumn) => unescapeCsvCell(cells[keys.indexOf(c)] ?? '');
    const archivedRaw = cell('archived').trim().toLowerCase();
    const rowProblems: CsvProblem[] = [];
    if (!['', 'no', 'yes', 'y', 'n', 'true', 'false', '0', '1'].includes(archivedRaw))
      rowProblems.push({ row, field: 'archived', message: 'Use yes or no' });
    const candidate = {
      name: cell('name'),
      category: CATEGORY_WORDS.get(squash(cell('category').trim())) ?? cell('category').trim(),
      stress: Object.fromEntries(JOINTS.map((j) => [j, csvNumber(cell(JOINT_COLUMN[j]), 0)])),
      sets: csvNumber(cell('sets'), undefined),
      reps: csvNumber(cell('reps'), undefined),
      loadKg: csvNumber(cell('load_kg'), undefined) ?? null,
      rpe: csvNumber(cell('rpe'), undefined) ?? null,
      notes: cell('notes'),
    };
    const parsed = accessoryBody.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [head, sub] = issue.path;
        const field =
          head === 'stress' ? JOINT_COLUMN[sub as Joint] : head === 'loadKg' ? 'load_kg' : String(head ?? 'row');
        const message = field === 'category' ? `Use one of: ${ACCESSORY_CATEGORIES.join(', ')}` : issue.message;
        if (!rowProblems.some((p) => p.field === field)) rowProblems.push({ row, field, message });
      }
    } else {
      const key = nameKey(parsed.data.name);
      const first = firstRowOf.get(key);
      if (first !== undefined)
        rowProblems.push({ row, field: 'name', message: `The same name is already on row ${first}` });
      else firstRowOf.set(key, row);
    }
    if (rowProblems.length > 0 || !parsed.success) problems.push(...rowProblems);
    else valid.push({ accessory: parsed.data, archived: ['yes', 'y', 'true', '1'].includes(archivedRaw) });
  });
  if (data.every((c) => c.every((x) => x.trim() === '')) && problems.length === 0) {
    problems.push({ row: 2, field: 'row', message: 'The file has a header but no rows' });
  }
  return { valid, problems };
}
