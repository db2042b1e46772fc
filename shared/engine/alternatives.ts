// "What fits here": every library variant that suits a cell's slot, rated for that cell (clean, warning,
// break) with the reasons, sorted clean → warning → break and, within each, by the planner's own soft-goal
// score (comfort, lift balance, variety, effect), so the first clean variant is the one the engine would pick.

import { prepareCandidateChecks, type CandidateChecks } from './explain';
import type { PlanEntry, PlanRequest, RuleId, Variant, Violation } from './types';
import { weekNumber } from './weeks';

export type AlternativeStatus = 'clean' | 'warning' | 'break';

export interface Alternative {
  variantId: string;
  name: string;
  status: AlternativeStatus;
  violations: Violation[];
  warnings: string[];
  /** What the coach reads: the rules it breaks, the cautions, or why it is a good fit. */
  reasons: string[];
}

export interface AlternativesSummary {
  clean: number;
  warning: number;
  break: number;
  /** When nothing is clean: the rules that rule variants out, most common first. */
  blockedBy: { rule: RuleId; count: number }[];
}

const STATUS_ORDER: Record<AlternativeStatus, number> = { clean: 0, warning: 1, break: 2 };

/** How far (in weeks) the nearest use of each variant and family is from the cell; absent = never used. */
interface Usage {
  variant: Map<string, number>;
  family: Map<string, number>;
}

function usageAround(req: PlanRequest, athleteId: string, week: string, slotId: string): Usage {
  const athlete = req.athletes.find((a) => a.id === athleteId);
  const familyOf = new Map(req.variants.map((v) => [v.id, v.family]));
  const here = weekNumber(week);
  const usage: Usage = { variant: new Map(), family: new Map() };
  const note = (map: Map<string, number>, key: string, d: number) => {
    const seen = map.get(key);
    if (seen === undefined || d < seen) map.set(key, d);
  };
  const entries: PlanEntry[] = [...(athlete?.history ?? []), ...(req.planned ?? [])];
  for (const e of entries) {
    if (e.athleteId !== athleteId || (e.week === week && e.slotId === slotId)) continue;
    const d = Math.abs(weekNumber(e.week) - here);
    note(usage.variant, e.variantId, d);
    const family = familyOf.get(e.variantId);
    if (family !== undefined) note(usage.family, family, d);
  }
  return usage;
}

function fitReason(v: Variant, usage: Usage): string {
  const d = usage.family.get(v.family);
  const when =
    d === undefined
      ? `the ${v.family} family is not on this athlete's plan nearby`
      : `the ${v.family} family is ${d} week${d === 1 ? '' : 's'} away`;
  return `Fits every rule; ${when}`;
}

/**
 * The library ranked for one cell. Variants whose lift the slot does not take, and archived ones, are
 * left out: they never fit here. Pass `checks` when they are already prepared for this request.
 */
export function rankAlternatives(
  req: PlanRequest,
  athleteId: string,
  week: string,
  slotId: string,
  checks: CandidateChecks = prepareCandidateChecks(req),
): Alternative[] {
  const slot = req.slots.find((s) => s.id === slotId);
  if (!slot) return [];
  const usage = usageAround(req, athleteId, week, slotId);
  const rated = req.variants
    .filter((v) => slot.lifts.includes(v.lift) && !v.archived)
    .map((v) => ({
      v,
      rating: checks.rate(athleteId, week, slotId, v.id),
      score: checks.score(athleteId, week, slotId, v.id),
    }));
  rated.sort(
    (a, b) =>
      STATUS_ORDER[a.rating.status] - STATUS_ORDER[b.rating.status] ||
      a.score - b.score ||
      a.v.name.localeCompare(b.v.name),
  );
  return rated.map(({ v, rating }) => ({
    variantId: v.id,
    name: v.name,
    status: rating.status,
    violations: rating.violations,
    warnings: rating.warnings,
    reasons:
      rating.status === 'clean'
        ? [fitReason(v, usage)]
        : [...rating.violations.map((x) => x.message), ...rating.warnings],
  }));
}

/** Counts per status and, when nothing is clean, which rules block the most variants. */
export function summariseAlternatives(items: Pick<Alternative, 'status' | 'violations'>[]): AlternativesSummary {
  const out: AlternativesSummary = { clean: 0, warning: 0, break: 0, blockedBy: [] };
  const rules = new Map<RuleId, number>();
  for (const item of items) {
    out[item.status] += 1;
    for (const rule of new Set(item.violations.map((v) => v.rule))) rules.set(rule, (rules.get(rule) ?? 0) + 1);
  }
  if (out.clean === 0) {
    out.blockedBy = [...rules].map(([rule, count]) => ({ rule, count })).sort((a, b) => b.count - a.count);
  }
  return out;
}
