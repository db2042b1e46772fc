// checkPlan: every rule each entry of a proposed board breaks, given the athletes' history.

import { Board, addAll, buildAth, ctxFor, rangeOf, weekNum } from './core';
import { breaksAt } from './rules/index';
import type { PlanEntry, PlanRequest, Violation } from './types';

/**
 * The board is history plus `entries` (req.planned is not added: `entries` is the board to judge).
 * Each entry is judged against everything else on it; both sides of a clash are reported. Entries of
 * athletes missing from the request are not judged (their rules are unknown).
 */
export function checkPlan(req: PlanRequest, entries: PlanEntry[]): Violation[] {
  const ctx = ctxFor(req);
  const byAthlete = new Map<string, number[]>();
  entries.forEach((e, i) => {
    if (!ctx.athletes.has(e.athleteId)) return;
    const list = byAthlete.get(e.athleteId);
    if (list) list.push(i);
    else byAthlete.set(e.athleteId, [i]);
  });
  const found: Violation[][] = [];
  for (const [athleteId, idxs] of byAthlete) {
    const input = ctx.athletes.get(athleteId)!;
    const ath = buildAth(ctx, input);
    const own = idxs.map((i) => entries[i]!);
    const [from, to] = rangeOf(ctx.req.weeks.map(weekNum), input.history, own);
    const board = new Board(ctx, from, to);
    addAll(ctx, board, input.history);
    addAll(ctx, board, own);
    for (const i of idxs) {
      const e = entries[i]!;
      const v = ctx.byId.get(e.variantId);
      const w = weekNum(e.week);
      const slot = ctx.slots.get(e.slotId)?.index ?? -1;
      if (v !== undefined) board.add(w, v, slot, -1);
      found[i] = breaksAt(ctx, ath, board, e.week, e.slotId, e.variantId);
      if (v !== undefined) board.add(w, v, slot, 1);
    }
  }
  return found.flatMap((list) => list ?? []);
}
