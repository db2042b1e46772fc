// Exhaustive reference planner for small cases (one athlete, a few variants, weeks and slots): tries
// every assignment with plain loops, to check the engine's completeness and its peak load ratio.

import { JOINTS, type PlanRequest, type Variant } from '../../../shared/engine/types';
import { weeksBetween } from '../../../shared/engine/weeks';

export interface ExhaustiveResult {
  feasible: boolean; // some complete plan breaks no rule
  bestPeak: number; // lowest peak load ratio over those plans (Infinity when none)
  nodes: number;
}

interface Placed {
  at: number; // weeks from the first planned week
  v: Variant | undefined;
  id: string;
}

export function exhaustive(req: PlanRequest, nodeLimit = 5_000_000): ExhaustiveResult {
  return search(req, nodeLimit, false);
}

/** The most cells any rule-clean plan fills (cells may stay empty). */
export function mostFilled(req: PlanRequest, nodeLimit = 5_000_000): number {
  return search(req, nodeLimit, true).filled;
}

function search(req: PlanRequest, nodeLimit: number, allowEmpty: boolean): ExhaustiveResult & { filled: number } {
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

  const cells: { at: number; options: Variant[] }[] = [];
  req.weeks.forEach((week, at) => {
    for (const slot of req.slots) {
      const options = req.variants.filter((v) => {
        if (!slot.lifts.includes(v.lift)) return false;
        if (!v.equipment.every((e) => athlete.equipment.includes(e))) return false;
        if (
          athlete.restrictions.some(
            (r) => r.joint !== undefined && (v.stress[r.joint] ?? 0) > (r.maxStress ?? Infinity),
          )
        )
          return false;
        if (athlete.meetWeek) {
          const d = weeksBetween(week, athlete.meetWeek);
          for (const t of rules.taper) {
            if (d < 0 || d > t.weeksOut) continue;
            if (v.risk > t.maxRisk) return false;
            if (t.minSpecificity !== undefined && v.specificity < t.minSpecificity) return false;
          }
        }
        return true;
      });
      cells.push({ at, options });
    }
  });

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
    if (feasible && now >= bestPeak - 1e-12) return;
    if (k === cells.length) {
      feasible = true;
      bestPeak = now;
      return;
    }
    const cell = cells[k]!;
    for (const v of cell.options) {
      if (!fits(v, cell.at)) continue;
      placed.push({ at: cell.at, v, id: v.id });
      go(k + 1);
      placed.pop();
    }
  };
  go(0);
  return { feasible, bestPeak, nodes, filled: most };
}
