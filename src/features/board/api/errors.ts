// The bodies of the board's refusals, decoded: a stale version (409) carries what is in the cells now,
// a rule break without a reason (422) the rules each cell would break.
import { z } from 'zod';
import type { PlanEntryDto } from '../../../../shared/schemas';
import type { ApiError } from '../../../lib/api-client';

const entrySchema = z.custom<PlanEntryDto>(
  (v) => typeof v === 'object' && v !== null && 'variantId' in v && 'version' in v,
);

const conflictSchema = z.object({
  current: z.union([
    z.array(z.object({ athleteId: z.number(), week: z.string(), slotId: z.string(), entry: entrySchema.nullable() })),
    entrySchema.nullable(),
  ]),
});

const ruleBreakSchema = z.object({
  violations: z.array(z.object({ athleteId: z.number(), week: z.string(), slotId: z.string(), message: z.string() })),
});

export type ConflictCells = { athleteId: number; week: string; slotId: string; entry: PlanEntryDto | null }[];

/** A 409's cells as they are now: a list for a batch; for a single cell, the entry there (or none). */
export function decodeConflict(err: ApiError): { cells: ConflictCells } | { single: PlanEntryDto | null } {
  const parsed = conflictSchema.safeParse(err.body ?? {});
  if (!parsed.success) return { single: null };
  const current = parsed.data.current;
  return Array.isArray(current) ? { cells: current } : { single: current };
}

/** A 422 rule break's violations, one per rule and cell. */
export function decodeRuleBreak(err: ApiError) {
  const parsed = ruleBreakSchema.safeParse(err.body ?? {});
  return parsed.success ? parsed.data.violations : [];
}
