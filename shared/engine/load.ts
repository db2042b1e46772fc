// Rolling joint loads for the board's joint-load strip and for judging plans by their peak load ratio.

import { Board, addAll, ctxFor, entriesOf, rangeOf, weekNum, type Ctx } from './core';
import { peakOf, ratioOf } from './search';
import { JOINTS, type Joint, type PlanEntry, type PlanRequest } from './types';

export interface JointLoadPoint {
  week: string;
  joint: Joint;
  load: number;
  budget: number;
  ratio: number;
}

function boardOf(ctx: Ctx, athleteId: string, weekNums: number[], entries: PlanEntry[]): Board {
  const history = ctx.athletes.get(athleteId)?.history ?? [];
  const own = entriesOf(entries, athleteId);
  const [from, to] = rangeOf(weekNums, history, own);
  const board = new Board(ctx, from, to);
  addAll(ctx, board, history);
  addAll(ctx, board, own);
  return board;
}

/**
 * For each week and each joint with a budget: the summed stress of the span of jointWindowWeeks
 * ending that week, from the athlete's history plus the given entries (not req.planned).
 */
export function jointLoadSeries(
  req: PlanRequest,
  athleteId: string,
  weeks: string[],
  entries: PlanEntry[],
): JointLoadPoint[] {
  const ctx = ctxFor(req);
  const nums = weeks.map(weekNum);
  const board = boardOf(ctx, athleteId, nums, entries);
  const out: JointLoadPoint[] = [];
  weeks.forEach((week, i) => {
    for (const k of ctx.budgeted) {
      const load = board.spanLoad(k, nums[i]! - ctx.jointWindow + 1);
      const budget = ctx.budget[k]!;
      out.push({ week, joint: JOINTS[k]!, load, budget, ratio: ratioOf(load, budget) });
    }
  });
  return out;
}

/**
 * The highest ratio of summed stress to budget over every joint with a budget and every span of
 * jointWindowWeeks that overlaps `weeks` (default req.weeks), counting history and the given entries.
 */
export function peakLoadRatio(
  req: PlanRequest,
  athleteId: string,
  entries: PlanEntry[],
  weeks: string[] = req.weeks,
): number {
  const ctx = ctxFor(req);
  if (weeks.length === 0) return 0;
  const nums = weeks.map(weekNum);
  return peakOf(ctx, boardOf(ctx, athleteId, nums, entries), Math.min(...nums), Math.max(...nums));
}
