// jointBudget: per joint with a budget, the summed stress of any span of jointWindowWeeks weeks stays
// within it. Also the drag warning when a joint would come near its budget, and the load reason line.

import { EPS, weekStr, type Board, type Ctx } from '../core';
import { JOINTS } from '../types';
import * as W from '../words';
import type { LoadRule } from './rule';

/** A joint at or above this share of its budget in some span earns a drag warning. */
export const NEAR_BUDGET = 0.85;

function spanText(ctx: Ctx, start: number): string {
  return W.span(weekStr(start), weekStr(start + ctx.jointWindow - 1));
}

interface SpanWithVariant {
  k: number;
  start: number;
  total: number;
  budget: number;
}

/** Per budgeted joint the variant loads: the busiest span around w with the variant added. */
function withVariant(ctx: Ctx, board: Board, w: number, v: number): SpanWithVariant[] {
  const out: SpanWithVariant[] = [];
  for (let t = ctx.stressStart[v]!; t < ctx.stressStart[v + 1]!; t++) {
    const k = ctx.stressJoint[t]!;
    const busiest = board.busiest(k, w);
    out.push({ k, start: busiest.start, total: busiest.load + ctx.stressValue[t]!, budget: ctx.budget[k]! });
  }
  return out;
}

export const jointBudget: LoadRule = {
  kind: 'load',
  id: 'jointBudget',
  describe: (ctx, board, w, v) => {
    const out: string[] = [];
    for (const s of withVariant(ctx, board, w, v)) {
      if (s.total > s.budget + EPS)
        out.push(
          `${W.jointLoad(JOINTS[s.k]!)} ${W.num(s.total)} over budget ${W.num(s.budget)} in ${spanText(ctx, s.start)}`,
        );
    }
    return out;
  },
  warning: (ctx, board, w, v) => {
    const out: string[] = [];
    for (const s of withVariant(ctx, board, w, v)) {
      if (s.budget > 0 && s.total <= s.budget + EPS && s.total >= NEAR_BUDGET * s.budget - EPS) {
        out.push(
          `${W.jointLoad(JOINTS[s.k]!)} would reach ${W.num(s.total)} of ${W.num(s.budget)} (${W.pct(s.total / s.budget)}) in ${spanText(ctx, s.start)}`,
        );
      }
    }
    return out;
  },
  /** The busiest span around week w (the variant already on the board) on its most loaded joint. */
  reason: (ctx, board, w, v) => {
    if (ctx.budgeted.length === 0) return null;
    let top: { k: number; load: number; start: number; ratio: number } | null = null;
    for (let t = ctx.stressStart[v]!; t < ctx.stressStart[v + 1]!; t++) {
      const k = ctx.stressJoint[t]!;
      const b = board.busiest(k, w);
      const budget = ctx.budget[k]!;
      const ratio = budget > 0 ? b.load / budget : Infinity;
      if (!top || ratio > top.ratio) top = { k, load: b.load, start: b.start, ratio };
    }
    if (!top) return 'adds no load to any budgeted joint';
    const share = Number.isFinite(top.ratio) ? ` (${W.pct(top.ratio)})` : '';
    return `${W.jointLoad(JOINTS[top.k]!)} ${W.num(top.load)} of ${W.num(ctx.budget[top.k]!)} in ${spanText(ctx, top.start)}${share}`;
  },
};

/** Per-joint caps at share `ratio` of the budget (Infinity on joints without a budget). */
export function budgetCaps(ctx: Ctx, ratio: number): number[] {
  const caps = new Array<number>(JOINTS.length).fill(Infinity);
  for (const k of ctx.budgeted) {
    const b = ctx.budget[k]!;
    caps[k] = b === 0 ? 0 : Math.min(b, Math.max(0, ratio * b));
  }
  return caps;
}
