// The exercise library's contracts: a variant as the form and the API know it, the list's filters,
// and the library's CSV columns with the pure row ⇄ variant mapping used by import preview, import and export.
import { z } from 'zod';
import { JOINTS, type Joint } from '../engine/types';
import { listQuery, versionField } from './common';
import { jointSchema, liftSchema, riskSchema } from './rules';
import { schemeSchema, type Scheme } from './training';

export const emphasisSchema = z.enum(['bottom', 'midRange', 'lockout']);
export type EmphasisValue = z.infer<typeof emphasisSchema>;

/** An empty query parameter means "no filter". */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
export const optionalQueryText = (max: number) => z.preprocess(blankToUndefined, z.string().trim().max(max).optional());

/** `true`/`false` (or 1/0) in a query string. */
export const booleanQuery = z
  .preprocess(blankToUndefined, z.enum(['true', 'false', '1', '0']).optional())
  .transform((v) => v === 'true' || v === '1');

/** Free text that may be left empty: trimmed, and stored as null when nothing is left. */
export const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Use at most ${max} characters`)
    .nullish()
    .transform((v) => (v ? v : null));

/** `sort=name` ascending, `sort=-name` descending, over the keys a list allows. */
export function sortParam<const K extends string>(keys: readonly K[], fallback: K | `-${K}`) {
  const allowed = [...keys, ...keys.map((k) => `-${k}` as const)] as [K | `-${K}`, ...(K | `-${K}`)[]];
  return z.preprocess(blankToUndefined, z.enum(allowed).default(fallback as never)) as z.ZodType<K | `-${K}`, unknown>;
}

/** Splits `-name` into its key and direction. */
export function readSort<K extends string>(sort: K | `-${K}`): { key: K; desc: boolean } {
  return sort.startsWith('-') ? { key: sort.slice(1) as K, desc: true } : { key: sort as K, desc: false };
}

/** Equipment names are listed with semicolons in the library's CSV, so a name cannot hold one. */
export const equipmentItemSchema = z
  .string()
  .trim()
  .min(1, 'Equipment names cannot be empty')
  .max(40, 'Use at most 40 characters')
  .refine((s) => !s.includes(';'), 'Equipment names cannot contain a semicolon');

export const stressLevelSchema = z
  .number({ message: 'Enter 0 to 3' })
  .int('Use a whole number from 0 to 3')
  .min(0, 'Use 0 to 3')
  .max(3, 'Use 0 to 3');

/** Stress per joint, 0–3; zeros are dropped so an absent joint and a 0 mean the same stored value. */
export const stressSchema = z.partialRecord(jointSchema, stressLevelSchema).transform((s) => {
  const out: Partial<Record<Joint, number>> = {};
  for (const j of JOINTS) if (s[j]) out[j] = s[j];
  return out;
});

const twoDecimals = (n: number) => Math.abs(n * 100 - Math.round(n * 100)) < 1e-6;

export const variantFields = {
  name: z.string().trim().min(1, 'Give the variant a name').max(120, 'Use at most 120 characters'),
  lift: liftSchema,
  family: z.string().trim().min(1, 'Name the family it belongs to').max(60, 'Use at most 60 characters'),
  bar: z.string().trim().min(1, 'Name the bar').max(40, 'Use at most 40 characters'),
  equipment: z
    .array(equipmentItemSchema)
    .max(12, 'At most 12 items')
    .transform((list) => [...new Set(list)]),
  emphasis: emphasisSchema,
  stress: stressSchema,
  risk: riskSchema,
  specificity: z
    .number({ message: 'Enter a number from 0 to 1' })
    .min(0, 'Use 0 to 1')
    .max(1, 'Use 0 to 1')
    .refine(twoDecimals, 'Use at most two decimals')
    .transform((n) => Math.round(n * 100) / 100),
  scheme: schemeSchema,
  notes: optionalText(2000),
  /** Only for the last N weeks before an athlete's meet (openers, meet rehearsals); null: any week. */
  meetPhaseWeeks: z
    .number({ message: 'Enter a number of weeks' })
    .int('Use whole weeks')
    .min(1, 'Use 1 to 16 weeks')
    .max(16, 'Use 1 to 16 weeks')
    .nullish()
    .transform((v) => v ?? null),
};

export const variantBody = z.object({ ...variantFields, meetPhaseWeeks: variantFields.meetPhaseWeeks.optional() });
export type VariantBody = z.input<typeof variantBody>;
export type VariantValues = z.output<typeof variantBody>;

export const variantPatchBody = z
  .object(variantFields)
  .partial()
  .extend({ archived: z.boolean().optional(), version: versionField });
export type VariantPatchBody = z.input<typeof variantPatchBody>;

export const variantSortKeys = ['name', 'lift', 'family', 'risk', 'specificity', 'updatedAt'] as const;
export type VariantSortKey = (typeof variantSortKeys)[number];

const riskFilter = z.preprocess(
  (v) => {
    const raw = blankToUndefined(v);
    if (raw === undefined) return undefined;
    const parts = (Array.isArray(raw) ? raw : String(raw).split(',')).map((x) => Number(String(x).trim()));
    return parts;
  },
  z.array(riskSchema, { message: 'Use risk 1, 2 or 3' }).max(3).optional(),
);

export const variantListQuery = listQuery.extend({
  lift: z.preprocess(blankToUndefined, liftSchema.optional()),
  family: optionalQueryText(60),
  /** Variants that use this item of equipment; `none` for those that need none. */
  equipment: optionalQueryText(40),
  risk: riskFilter,
  q: optionalQueryText(100),
  includeArchived: booleanQuery,
  sort: sortParam(variantSortKeys, 'name'),
});
export type VariantListQuery = z.input<typeof variantListQuery>;
export type VariantListFilters = z.output<typeof variantListQuery>;

/** What a coach narrows the variants by, as the screens hold it (blank = any): the library page and the board's drawer. */
export interface VariantNarrowing {
  q: string;
  lift: '' | z.infer<typeof liftSchema>;
  family: string;
  equipment: string;
  risk: '' | '1' | '2' | '3';
}

/** What describes a variant to the engine and on every screen: the library, the board and the demo. */
export const variantTraitsSchema = z.object({
  name: z.string(),
  lift: liftSchema,
  family: z.string(),
  bar: z.string(),
  equipment: z.array(z.string()),
  emphasis: emphasisSchema,
  stress: z.partialRecord(jointSchema, z.number()),
  risk: riskSchema,
  specificity: z.number(),
  scheme: schemeSchema,
  meetPhaseWeeks: z.number().nullable(),
});
export type VariantTraits = z.infer<typeof variantTraitsSchema>;

export const libraryVariantSchema = variantTraitsSchema.extend({
  id: z.number(),
  notes: z.string().nullable(),
  archived: z.boolean(),
  /** Used by a plan entry or a top set: deleting it archives it instead. */
  inHistory: z.boolean(),
  version: z.number(),
  updatedAt: z.string(),
});
export type LibraryVariant = z.infer<typeof libraryVariantSchema>;

export interface VariantFacets {
  families: string[];
  bars: string[];
  equipment: string[];
}

export type VariantDeleteResult = { result: 'deleted' } | { result: 'archived'; item: LibraryVariant };

// ---------------------------------------------------------------------------------------------------
// CSV

/** The library's CSV columns, in export order. */
export const LIBRARY_CSV_COLUMNS = [
  'name',
  'lift',
  'family',
  'bar',
  'equipment',
  'emphasis',
  'shoulder_stress',
  'elbow_stress',
  'wrist_stress',
  'lower_back_stress',
  'hip_stress',
  'knee_stress',
  'risk',
  'specificity',
  'top_set',
  'notes',
  'archived',
  'meet_phase_weeks',
] as const;
export type LibraryCsvColumn = (typeof LIBRARY_CSV_COLUMNS)[number];
export const LIBRARY_CSV_REQUIRED: readonly LibraryCsvColumn[] = [
  'name',
  'lift',
  'family',
  'bar',
  'emphasis',
  'risk',
  'specificity',
];

const STRESS_COLUMN: Record<Joint, LibraryCsvColumn> = {
  shoulder: 'shoulder_stress',
  elbow: 'elbow_stress',
  wrist: 'wrist_stress',
  lowerBack: 'lower_back_stress',
  hip: 'hip_stress',
  knee: 'knee_stress',
};

export const CSV_EQUIPMENT_SEPARATOR = ';';
export const LIBRARY_CSV_MAX_BYTES = 5 * 1024 * 1024;
export const LIBRARY_CSV_MAX_ROWS = 5000;

export interface CsvProblem {
  /** The line in the file as a spreadsheet numbers it: the header is row 1. */
  row: number;
  field: string;
  message: string;
}

export const csvProblemSchema = z.object({ row: z.number().int(), field: z.string(), message: z.string() });

/** A CSV import refused (422) carries the problems row by row. */
export const csvImportErrorSchema = z.object({ rows: z.array(csvProblemSchema) });

/** A valid library row: a variant and whether it is archived. */
export interface LibraryCsvRow {
  variant: VariantValues;
  archived: boolean;
}

// A cell that starts like a formula would run as one in a spreadsheet: export prefixes it with an
// apostrophe, and import removes exactly one, so cells that already begin with apostrophes survive too.
const FORMULA_START = /^[=+\-@\t\r]/;
const ESCAPED_FORMULA = /^'+[=+\-@\t\r]/;

export function escapeCsvCell(value: string): string {
  return FORMULA_START.test(value) || ESCAPED_FORMULA.test(value) ? `'${value}` : value;
}

export function unescapeCsvCell(value: string): string {
  return ESCAPED_FORMULA.test(value) ? value.slice(1) : value;
}

/** `Lower back stress` → `lower_back_stress`: headers are read forgivingly. */
export function normaliseCsvHeader(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, '_');
}

/** Problems with the header row (missing required columns, unknown or repeated ones). */
export function checkLibraryCsvHeader(headers: string[]): CsvProblem[] {
  const problems: CsvProblem[] = [];
  const seen = new Set<string>();
  const known = new Set<string>(LIBRARY_CSV_COLUMNS);
  for (const raw of headers) {
    const h = normaliseCsvHeader(raw);
    if (h === '') continue;
    if (!known.has(h)) problems.push({ row: 1, field: raw, message: `Unknown column "${raw}"` });
    else if (seen.has(h)) problems.push({ row: 1, field: h, message: `The column "${h}" appears twice` });
    seen.add(h);
  }
  for (const col of LIBRARY_CSV_REQUIRED) {
    if (!seen.has(col)) problems.push({ row: 1, field: col, message: `The column "${col}" is missing` });
  }
  return problems;
}

const EMPHASIS_WORDS: Record<string, EmphasisValue> = {
  bottom: 'bottom',
  midrange: 'midRange',
  'mid-range': 'midRange',
  mid_range: 'midRange',
  'mid range': 'midRange',
  lockout: 'lockout',
};
const YES = new Set(['yes', 'y', 'true', '1']);
const NO = new Set(['no', 'n', 'false', '0', '']);

export function csvNumber(raw: string | undefined, fallback: number | undefined): number | undefined {
  const s = (raw ?? '').trim().replace(',', '.');
  if (s === '') return fallback;
  // Number('') is 0 and Number('0x1') is 1: only plain decimals count.
  return /^-?\d+(\.\d+)?$|^-?\.\d+$/.test(s) ? Number(s) : Number.NaN;
}

/** Which CSV column a zod issue path points at. */
function columnOf(path: readonly PropertyKey[]): string {
  const [head, sub] = path;
  if (head === 'stress' && typeof sub === 'string' && sub in STRESS_COLUMN) return STRESS_COLUMN[sub as Joint];
  if (head === 'scheme') return 'top_set';
  if (head === 'meetPhaseWeeks') return 'meet_phase_weeks';
  return String(head ?? 'row');
}

/**
 * One data row (keys are normalised headers, values the raw cells) → a valid variant, or the problems
 * with it. `row` is the file's line number for the messages.
 */
export function parseLibraryCsvRow(
  record: Record<string, string | undefined>,
  row: number,
): { ok: true; value: LibraryCsvRow } | { ok: false; problems: CsvProblem[] } {
  const cell = (c: LibraryCsvColumn) => unescapeCsvCell(record[c] ?? '');
  const problems: CsvProblem[] = [];
  const stress: Partial<Record<Joint, number | undefined>> = {};
  for (const j of JOINTS) stress[j] = csvNumber(cell(STRESS_COLUMN[j]), 0);
  const emphasisRaw = cell('emphasis').trim();
  const archivedRaw = cell('archived').trim().toLowerCase();
  if (!YES.has(archivedRaw) && !NO.has(archivedRaw)) {
    problems.push({ row, field: 'archived', message: 'Use yes or no' });
  }
  const schemeRaw = cell('top_set').trim().toLowerCase();
  const candidate = {
    name: cell('name'),
    lift: cell('lift').trim().toLowerCase(),
    family: cell('family'),
    bar: cell('bar'),
    equipment: cell('equipment')
      .split(CSV_EQUIPMENT_SEPARATOR)
      .map((s) => s.trim())
      .filter(Boolean),
    emphasis: EMPHASIS_WORDS[emphasisRaw.toLowerCase()] ?? emphasisRaw,
    stress,
    risk: csvNumber(cell('risk'), undefined),
    specificity: csvNumber(cell('specificity'), undefined),
    scheme: schemeRaw === '' ? 'single' : schemeRaw,
    notes: cell('notes'),
    // Blank: any week; a file without the column leaves the stored value alone.
    meetPhaseWeeks:
      record.meet_phase_weeks === undefined ? undefined : (csvNumber(cell('meet_phase_weeks'), undefined) ?? null),
  };
  const parsed = variantBody.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = columnOf(issue.path);
      // One message per column is enough to fix it.
      if (!problems.some((p) => p.field === field)) problems.push({ row, field, message: csvMessage(field, issue) });
    }
  }
  if (problems.length > 0 || !parsed.success) return { ok: false, problems };
  return { ok: true, value: { variant: parsed.data, archived: YES.has(archivedRaw) } };
}

function csvMessage(field: string, issue: z.core.$ZodIssue): string {
  switch (field) {
    case 'lift':
      return 'Use squat, bench or deadlift';
    case 'emphasis':
      return 'Use bottom, mid-range or lockout';
    case 'top_set':
      return 'Use single, triple or five';
    case 'risk':
      return 'Use risk 1, 2 or 3';
    case 'meet_phase_weeks':
      return 'Use 1 to 16 weeks, or leave it blank for any week';
    default:
      return issue.message;
  }
}

/** A variant as one CSV record, every cell a string, in LIBRARY_CSV_COLUMNS order. */
export function variantToCsvRecord(v: {
  name: string;
  lift: string;
  family: string;
  bar: string;
  equipment: string[];
  emphasis: EmphasisValue;
  stress: Partial<Record<Joint, number>>;
  risk: number;
  specificity: number;
  scheme: Scheme;
  notes: string | null;
  archived: boolean;
  meetPhaseWeeks?: number | null | undefined;
}): Record<LibraryCsvColumn, string> {
  const stress = (j: Joint) => String(v.stress[j] ?? 0);
  const rec: Record<LibraryCsvColumn, string> = {
    name: v.name,
    lift: v.lift,
    family: v.family,
    bar: v.bar,
    equipment: v.equipment.join(`${CSV_EQUIPMENT_SEPARATOR} `),
    emphasis: v.emphasis === 'midRange' ? 'mid-range' : v.emphasis,
    shoulder_stress: stress('shoulder'),
    elbow_stress: stress('elbow'),
    wrist_stress: stress('wrist'),
    lower_back_stress: stress('lowerBack'),
    hip_stress: stress('hip'),
    knee_stress: stress('knee'),
    risk: String(v.risk),
    specificity: String(v.specificity),
    top_set: v.scheme,
    notes: v.notes ?? '',
    archived: v.archived ? 'yes' : 'no',
    meet_phase_weeks: v.meetPhaseWeeks == null ? '' : String(v.meetPhaseWeeks),
  };
  for (const k of LIBRARY_CSV_COLUMNS) rec[k] = escapeCsvCell(rec[k]);
  return rec;
}

/** Names are unique per team regardless of case and accents (the database compares them that way). */
export function nameKey(name: string): string {
  return name.trim().normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
}

/** The separator of a CSV file, read from its header line (spreadsheets in some locales save with `;`). */
export function detectCsvDelimiter(text: string): ',' | ';' | '\t' {
  const firstLine = text.replace(/^\uFEFF/, '').split(/\r?\n/, 1)[0] ?? '';
  const count = (ch: string) => firstLine.split(ch).length - 1;
  const tabs = count('\t');
  const semis = count(';');
  const commas = count(',');
  if (tabs > commas && tabs > semis) return '\t';
  if (semis > commas) return ';';
  return ',';
}

export interface LibraryTable {
  /** Every data row with what it became: a valid row, or its problems. */
  rows: { row: number; cells: Record<string, string>; parsed: ReturnType<typeof parseLibraryCsvRow> }[];
  problems: CsvProblem[];
  valid: LibraryCsvRow[];
}

/**
 * A parsed CSV table (header row first, then data rows, as string arrays) → the library rows and every
 * problem: header problems, extra cells, invalid values, and a name that appears twice.
 */
export function readLibraryTable(table: string[][]): LibraryTable {
  const [header = [], ...data] = table;
  const problems: CsvProblem[] = [...checkLibraryCsvHeader(header)];
  const keys = header.map(normaliseCsvHeader);
  const rows: LibraryTable['rows'] = [];
  const valid: LibraryCsvRow[] = [];
  const firstRowOf = new Map<string, number>();
  data.forEach((cellsIn, i) => {
    const row = i + 2;
    if (cellsIn.every((c) => c.trim() === '')) return;
    const cells: Record<string, string> = {};
    keys.forEach((k, j) => {
      if (k) cells[k] = cellsIn[j] ?? '';
    });
    const rowProblems: CsvProblem[] = [];
    if (cellsIn.slice(keys.length).some((c) => c.trim() !== '')) {
      rowProblems.push({ row, field: 'row', message: 'This row has more cells than the header has columns' });
    }
    let parsed = parseLibraryCsvRow(cells, row);
    if (parsed.ok) {
      const key = nameKey(parsed.value.variant.name);
      const first = firstRowOf.get(key);
      if (first !== undefined) {
        rowProblems.push({ row, field: 'name', message: `The same name is already on row ${first}` });
      } else firstRowOf.set(key, row);
    }
    if (rowProblems.length > 0) {
      parsed = { ok: false, problems: [...rowProblems, ...(parsed.ok ? [] : parsed.problems)] };
    }
    if (parsed.ok) valid.push(parsed.value);
    else problems.push(...parsed.problems);
    rows.push({ row, cells, parsed });
  });
  if (rows.length === 0 && problems.length === 0) {
    problems.push({ row: 2, field: 'row', message: 'The file has a header but no rows' });
  }
  return { rows, problems, valid };
}

/** The 422 body of an import with bad rows. */
export interface InvalidRowsError {
  error: { code: 'invalid_rows'; message: string; rows: CsvProblem[] };
}

export interface LibraryImportResult {
  created: number;
  updated: number;
  unchanged: number;
}
