// Contracts of the plan and board API: one plan entry per athlete × ISO week × max-effort slot, its change
// history, plan generation and the board's snapshot.
import { z } from 'zod';
import type { Emphasis, Joint, RiskTier, RuleId } from '../engine/types';
import { isIsoWeek, weeksBetween } from '../engine/weeks';
import { idParam, isoWeek, listQuery, type ListResponse } from './common';
import type { VariantTraits } from './library';
import type { AthleteRuleOverrides, TeamRules } from './rules';

export const planSourceSchema = z.enum(['engine', 'coach']);
export type PlanSource = z.infer<typeof planSourceSchema>;

export const slotIdField = z
  .string()
  .trim()
  .regex(/^[a-z][a-z0-9-]{0,31}$/, 'Use a slot id like "lower"');

/** The furthest a board or a list may reach in one request. */
export const MAX_RANGE_WEEKS = 160;
/** Changes one batch may carry: enough to undo a whole plan run. */
export const MAX_BATCH = 2000;
/** Weeks one generation may fill at once. */
export const MAX_GENERATE_WEEKS = 26;

/** Why a coach keeps a pick that breaks a rule: said in a few words, stored with the pick. */
export const reasonField = z
  .string()
  .trim()
  .min(3, 'Say why in a few words')
  .max(500, 'Keep the reason under 500 characters');

/** An id inside a JSON body (in paths ids arrive as strings and use idParam). */
const bodyId = (message: string) => z.number({ message }).int().positive().max(Number.MAX_SAFE_INTEGER);

/** A version read from the server; 0 (or leaving it out) means "this cell had no entry when I looked". */
const readVersion = z.number({ message: 'Must be a number' }).int().min(0).default(0);

export const planCellParams = z.object({
  athleteId: idParam,
  week: isoWeek,
  slotId: slotIdField,
});
export type PlanCell = z.infer<typeof planCellParams>;

/** What one save writes into a cell. Without `source` it is a coach pick. */
const cellWrite = {
  version: readVersion,
  reason: reasonField.optional(),
  pinned: z.boolean().optional(),
  /** Undo puts back what was there before, engine picks included. */
  source: planSourceSchema.optional(),
  reasons: z.array(z.string().max(300)).max(12).optional(),
};

export const savePlanBody = z.object({ variantId: bodyId('Pick a variant'), ...cellWrite });
export type SavePlanBody = z.input<typeof savePlanBody>;

export const clearPlanQuery = z.object({
  version: z.coerce.number({ message: 'Must be a number' }).int().positive('Give the version you read'),
});

export const planChangeSchema = planCellParams.extend({
  athleteId: bodyId('Pick an athlete'),
  /** null clears the cell. */
  variantId: bodyId('Pick a variant').nullable(),
  ...cellWrite,
});
export type PlanChange = z.input<typeof planChangeSchema>;

export const planBatchBody = z
  .object({ changes: z.array(planChangeSchema).min(1, 'Send at least one change').max(MAX_BATCH) })
  .superRefine((b, ctx) => {
    const seen = new Set<string>();
    b.changes.forEach((c, i) => {
      const key = `${c.athleteId}|${c.week}|${c.slotId}`;
      if (seen.has(key)) ctx.addIssue({ code: 'custom', path: ['changes', i], message: 'Each cell may change once' });
      seen.add(key);
    });
  });
export type PlanBatchBody = z.input<typeof planBatchBody>;

function rangeCheck(r: { from?: string | undefined; to?: string | undefined }, ctx: z.RefinementCtx, max: number) {
  // A malformed week has its own message already; the span is only measured between two real weeks.
  if (!r.from || !r.to || !isIsoWeek(r.from.trim()) || !isIsoWeek(r.to.trim())) return;
  const span = weeksBetween(r.from, r.to);
  if (span < 0) ctx.addIssue({ code: 'custom', path: ['to'], message: 'Must not be before "from"' });
  else if (span >= max) ctx.addIssue({ code: 'custom', path: ['to'], message: `Ask for at most ${max} weeks` });
}

const PLAN_SORTS = ['week', '-week', 'athlete', '-athlete', 'updated', '-updated'] as const;

export const planListQuery = listQuery
  .extend({
    from: isoWeek.optional(),
    to: isoWeek.optional(),
    athleteId: idParam.optional(),
    slotId: slotIdField.optional(),
    source: planSourceSchema.optional(),
    sort: z.enum(PLAN_SORTS).default('week'),
  })
  .superRefine((q, ctx) => rangeCheck(q, ctx, MAX_RANGE_WEEKS));
export type PlanListQuery = z.infer<typeof planListQuery>;

export const planHistoryQuery = listQuery;

export const boardQuery = z.object({ from: isoWeek, to: isoWeek }).superRefine((q, ctx) => rangeCheck(q, ctx, 27));
export type BoardQuery = z.infer<typeof boardQuery>;

/**
 * Which weeks to fill: the week after this one, every week up to each athlete's next meet, every week
 * from next week to the last one that holds a pick, or an explicit range.
 */
export const generateWeeksSchema = z.union([
  z.enum(['next', 'toMeet', 'ahead']),
  z.object({ from: isoWeek, to: isoWeek }).superRefine((r, ctx) => rangeCheck(r, ctx, MAX_GENERATE_WEEKS)),
]);

export const generateBody = z.object({
  weeks: generateWeeksSchema,
  athleteIds: z.array(bodyId('Pick an athlete')).max(500).optional(),
  /** Draw a new plan seed and re-pick every unpinned engine pick in those weeks. */
  reshuffle: z.boolean().default(false),
});
export type GenerateBody = z.input<typeof generateBody>;

// ---- responses ----

export interface PlanEntryDto {
  id: number;
  athleteId: number;
  week: string;
  slotId: string;
  /** null: the cell was cleared. */
  variantId: number | null;
  source: PlanSource;
  pinned: boolean;
  reason: string | null;
  reasons: string[];
  version: number;
  updatedBy: number | null;
  updatedByName: string | null;
  updatedAt: string;
}

export interface PlanHistoryRow {
  id: number;
  version: number;
  oldVariantId: number | null;
  oldVariantName: string | null;
  newVariantId: number | null;
  newVariantName: string | null;
  source: PlanSource;
  pinned: boolean;
  reason: string | null;
  changedBy: number | null;
  changedByName: string | null;
  changedAt: string;
}

export type PlanList = ListResponse<PlanEntryDto>;
export type PlanHistoryList = ListResponse<PlanHistoryRow>;

export interface BoardVariant extends VariantTraits {
  id: number;
  archived: boolean;
}

export interface BoardRestriction {
  /** A joint and its cap, or both null for a restriction by emphasis or family only. */
  joint: Joint | null;
  maxStress: number | null;
  emphasis: Emphasis[];
  families: string[];
  fromDate: string;
  toDate: string | null;
  note: string | null;
}

export interface BoardAthlete {
  id: number;
  name: string;
  /** What the athlete can use: their own equipment that the gym has. */
  equipment: string[];
  restrictions: BoardRestriction[];
  meet: { id: number; name: string; date: string; week: string } | null;
  ruleOverrides: AthleteRuleOverrides;
  /** The heaviest risk tier the planner may pick; null: no ceiling. */
  maxRisk: RiskTier | null;
  /** Rest or deload weeks (ISO weeks, oldest first): no max-effort pick. */
  restWeeks: string[];
}

/** A plan entry outside the board's weeks, as the engine needs it. */
export interface BoardContextEntry {
  athleteId: number;
  week: string;
  slotId: string;
  variantId: number;
  pinned: boolean;
}

export interface BoardSlot {
  id: string;
  label: string;
  lifts: ('squat' | 'bench' | 'deadlift')[];
}

export interface BoardData {
  currentWeek: string;
  from: string;
  to: string;
  weeks: string[];
  rules: TeamRules;
  seed: string;
  rulesVersion: number;
  slots: BoardSlot[];
  variants: BoardVariant[];
  athletes: BoardAthlete[];
  /** Every entry in the board's weeks, cleared cells included. */
  entries: PlanEntryDto[];
  /** Every entry with a variant outside the board's weeks, before and after. */
  context: BoardContextEntry[];
}

export interface GenerateChange {
  entry: PlanEntryDto;
  /** What the cell held before; null when it had no entry. */
  previous: Pick<PlanEntryDto, 'variantId' | 'source' | 'pinned' | 'reason' | 'reasons'> | null;
  swap: { from: number; rule: RuleId } | null;
}

export interface GenerateResult {
  weeks: string[];
  seed: string;
  changes: GenerateChange[];
  /** Cells whose pick stayed as it was. */
  kept: number;
  unfilled: {
    athleteId: number;
    week: string;
    slotId: string;
    blockedBy: RuleId[];
    dropped: { variantId: number; rule: RuleId; message: string } | null;
  }[];
  /** Athletes left out, and why (no meet ahead for "Plan to meet"). */
  skipped: { athleteId: number; reason: string }[];
}
