// Exhaustive reference planner for small cases (one athlete, a few variants, weeks and slots): tries
// every assignment with plain loops, to check the engine's completeness, its peak load ratio and the
// version-2 goals (comfort, lift balance), written here again from the rules' plain definitions.

import {
  JOINTS,
  type AthleteInput,
  type PlanEntry,
  type PlanRequest,
  type Variant,
} from '../../../shared/engine/types';
import { weekNumber, weeksBetween } from '../../../shared/engine/weeks';

export interface ExhaustiveResult {
  feasible: boolean; // some complete plan breaks no rule
  bestPeak: number; // lowest peak load ratio over those plans (Infinity when none)
  nodes: number;
  /** Some complete rule-clean plan keeps every joint at or under the comfort ratio. */
  comfortable: boolean;
  /** Some complete rule-clean plan is in lift balance, and comfortable too when any plan can be. */
  balanced: boolean;
}

/** Whether a restriction (version 2: joint cap, emphases, families, weeks) rules variant v out in `week`. */
export function restricts(a: AthleteInput, v: Variant, week: string): boolean {
  return a.restrictions.some((r) => {
    if (r.fromWeek && weekNumber(week) < weekNumber(r.fromWeek)) return false;
    if (r.toWeek && weekNumber(week) > weekNumber(r.toWeek)) return false;
    if (r.joint !== undefined && r.maxStress !== undefined && (v.stress[r.joint] ?? 0) > r.maxStress) return true;
    if (r.emphasis && v.emphasis && r.emphasis.includes(v.emphasis)) return true;
    return !!r.families?.includes(v.family);
  });
}

/** Whether the cell rules (everything but windows and budgets) let variant v into `week` for athlete a. */
export function cellAllows(req: PlanRequest, a: AthleteInput, v: Variant, week: string): boolean {
  if (!v.equipment.every((e) => a.equipment.includes(e))) return false;
  if (restricts(a, v, week)) return false;
  if (v.archived) return false;
  if (a.maxRisk !== undefined && v.risk > a.maxRisk) return false;
  if (a.restWeeks?.includes(week)) return false;
  const d = a.meetWeek ? weeksBetween(week, a.meetWeek) : undefined;
  if (v.meetPhaseWeeks !== undefined && (d === undefined || d < 0 || d > v.meetPhaseWeeks)) return false;
  if (d !== undefined) {
    for (const t of req.rules.taper) {
      if (d < 0 || d > t.weeksOut) continue;
      if (v.risk > t.maxRisk) return false;
      if (t.minSpecificity !== undefined && v.specificity < t.minSpecificity) return false;
    }
  }
  return true;
}

/**
 * Lift balance, from its definition: for each slot with several lifts, every span of liftBalanceWeeks
 * weeks ending in a planned week holds each required lift (the slot's lifts the athlete has an eligible
 * variant for in some planned week), unless the span has fewer cells (entries in history, planned
 * weeks that are not rest weeks) than required lifts.
 */
export function isBalanced(req: PlanRequest, entries: PlanEntry[]): boolean {
  const n = req.rules.liftBalanceWeeks;
  if (!n) return true;
  const a = req.athletes[0]!;
  const byId = new Map(req.variants.map((v) => [v.id, v]));
  const first = req.weeks[0]!;
  const at = (e: PlanEntry) => weeksBetween(first, e.week);
  for (const slot of req.slots) {
    const required = new Set(
      slot.lifts.filter((l) =>
        req.variants.some((v) => v.lift === l && req.weeks.some((w) => cellAllows(req, a, v, w))),
      ),
    );
    if (required.size < 2) continue;
    const own = [...a.history, ...entries].filter((e) => e.slotId === slot.id && byId.has(e.variantId));
    for (let end = 0; end < req.weeks.length; end++) {
      const start = end - n + 1;
      let cells = 0;
      for (let x = start; x <= end; x++) {
        const planned = x >= 0 && !a.restWeeks?.includes(req.weeks[x]!);
        if (planned || own.some((e) => at(e) === x)) cells++;
      }
      if (cells < required.size) continue;
      const lifts = new Set(own.filter((e) => at(e) >= start && at(e) <= end).map((e) => byId.get(e.variantId)!.lift));
      for (const l of required) if (!lifts.has(l)) return false;
    }
  }
  return true;
}

interface Placed {
  at: number; // weeks from the first planned week
  v: Variant | undefined;
  id: string;
}

/** With `goals`, every complete plan is visited to settle comfort and balance (slower); else the best peak. */
export function exhaustive(req: PlanRequest, nodeLimit = 5_000_000, goals = false): ExhaustiveResult {
  return search(req, nodeLimit, false, goals);
}

/** The most cells any rule-clean plan fills (cells may stay empty). */
export function mostFilled(req: PlanRequest, nodeLimit = 5_000_000): number {
  return search(req, nodeLimit, true, false).filled;
}

function search(
  req: PlanRequest,
  nodeLimit: number,
  allowEmpty: boolean,
  goals: boolean,
): ExhaustiveResult & { filled: number } {
  const athlete = req.athletes[0]!;
  const rules = req.rules;
  const first = req.weeks[0]!;
  const byId = new Map(req.variants.map((v) => [v.id, v]));
  const placed: Placed[] = athlete.history.map((e) => ({
    at: weeksBetween(first, e.week),
    v: byId.get(e.variantId),
    id: e.variantId,
  }));
  const J = Math.max(1, rules.jointWindowWeeks);
  const stressOf = (v: Variant | undefined, j: (typeof JOINTS)[number]) => (v ? (v.stress[j] ?? 0) : 0);
  const budgets = JOINTS.filter((j) => rules.jointBudget[j] !== undefined);

  const cells: { at: number; week: string; slotId: string; options: Variant[] }[] = [];
  req.weeks.forEach((week, at) => {
    if (athlete.restWeeks?.includes(week)) return; // rest weeks hold no pick
    for (const slot of req.slots) {
      const options = req.variants.filter((v) => slot.lifts.includes(v.lift) && cellAllows(req, athlete, v, week));
      cells.push({ at, week, slotId: slot.id, options });
    }
  });
  const comfort = rules.comfortRatio ?? 0.8;
  const chosen: PlanEntry[] = [];
  let comfortable = false;
  let balanced = false;

  const spanLoad = (j: (typeof JOINTS)[number], start: number) => {
    let s = 0;
    for (const p of placed) if (p.at >= start && p.at < start + J) s += stressOf(p.v, j);
    return s;
  };
  const fits = (v: Variant, at: number) => {
    for (const p of placed) {
      const d = Math.abs(p.at - at);
      if (p.id === v.id && d < Math.max(1, rules.repeatWindowWeeks)) return false;
      if (p.v && p.v.family === v.family && d < rules.familyWindowWeeks) return false;
    }
    for (const j of budgets) {
      if (stressOf(v, j) === 0) continue;
      for (let st = at - J + 1; st <= at; st++)
        if (spanLoad(j, st) + stressOf(v, j) > rules.jointBudget[j]! + 1e-9) return false;
    }
    return true;
  };
  const peak = () => {
    let best = 0;
    for (const j of budgets) {
      const b = rules.jointBudget[j]!;
      for (let st = -J + 1; st < req.weeks.length; st++) {
        const load = spanLoad(j, st);
        best = Math.max(best, b > 0 ? load / b : load > 0 ? Infinity : 0);
      }
    }
    return best;
  };

  let bestPeak = Infinity;
  let feasible = false;
  let nodes = 0;
  let filled = 0;
  let most = -1;
  const go = (k: number): void => {
    if (++nodes > nodeLimit) throw new Error('exhaustive search too large');
    if (allowEmpty) {
      if (filled + cells.length - k <= most) return;
      if (k === cells.length) {
        most = filled;
        return;
      }
      const cell = cells[k]!;
      for (const v of cell.options) {
        if (!fits(v, cell.at)) continue;
        placed.push({ at: cell.at, v, id: v.id });
        filled++;
        go(k + 1);
        filled--;
        placed.pop();
      }
      go(k + 1);
      return;
    }
    const now = peak();
    if (!goals && feasible && now >= bestPeak - 1e-12) return;
    if (k === cells.length) {
      feasible = true;
      bestPeak = Math.min(bestPeak, now);
      const cozy = now <= comfort + 1e-9;
      if (cozy && !comfortable) balanced = false; // balance now counts only among comfortable plans
      if (cozy) comfortable = true;
      if ((cozy || !comfortable) && isBalanced(req, chosen)) balanced = true;
      return;
    }
    const cell = cells[k]!;
    for (const v of cell.options) {
      if (!fits(v, cell.at)) continue;
      placed.push({ at: cell.at, v, id: v.id });
      chosen.push({ athleteId: athlete.id, week: cell.week, slotId: cell.slotId, variantId: v.id });
      go(k + 1);
      chosen.pop();
      placed.pop();
    }
  };
  go(0);
  return { feasible, bestPeak, nodes, filled: most, comfortable, balanced };
}
