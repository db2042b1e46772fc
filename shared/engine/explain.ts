// Live checks for the coach's board while dragging: what a drop would break, and softer warnings,
// from indexes built once per request so each target cell costs microseconds.

import {
  Board,
  addAll,
  buildAth,
  cellViolations,
  ctxFor,
  entriesOf,
  memo,
  nearest,
  rangeOf,
  wn,
  ws,
  type Ath,
  type Ctx,
} from './core';
import { JOINTS, type PlanEntry, type PlanRequest, type Violation } from './types';
import * as W from './words';

export interface CandidateRating {
  status: 'clean' | 'warning' | 'break';
  violations: Violation[];
  warnings: string[];
}

export interface CandidateChecks {
  /** What putting variantId in the cell would break; the cell's current board entry is ignored. */
  explain(athleteId: string, week: string, slotId: string, variantId: string): Violation[];
  /** explain plus warnings a coach wants while dragging; status is the worst of the two. */
  rate(athleteId: string, week: string, slotId: string, variantId: string): CandidateRating;
}

/** A joint at or above this share of its budget in some span earns a warning. */
export const NEAR_BUDGET = 0.85;

interface AthleteIndex {
  ath: Ath;
  board: Board;
  /** "week|slot" → the board entries in that cell. */
  cells: Map<string, PlanEntry[]>;
}

/**
 * Indexes the request once (the library at once, each athlete on first use). Treat the request as an
 * immutable value: build a new one (or call this again) after the board changes.
 */
export function prepareCandidateChecks(req: PlanRequest): CandidateChecks {
  const ctx = ctxFor(req);
  const index = new Map<string, AthleteIndex | null>();
  const get = (athleteId: string): AthleteIndex | null => {
    let hit = index.get(athleteId);
    if (hit !== undefined) return hit;
    const input = ctx.athletes.get(athleteId);
    hit = null;
    if (input) {
      const planned = entriesOf(req.planned, athleteId);
      const [lo, hi] = rangeOf(req.weeks.map(wn), input.history, planned);
      const board = new Board(ctx, lo, hi);
      addAll(ctx, board, input.history);
      addAll(ctx, board, planned);
      const cells = new Map<string, PlanEntry[]>();
      for (const e of planned) {
        const key = `${e.week}|${e.slotId}`;
        const list = cells.get(key);
        if (list) list.push(e);
        else cells.set(key, [e]);
      }
      hit = { ath: buildAth(ctx, input), board, cells };
    }
    index.set(athleteId, hit);
    return hit;
  };

  /** Takes the cell's own board entries off (a drop would replace them); restore() puts them back. */
  const lifted: number[] = [];
  const clear = (x: AthleteIndex, w: number, slot: number, key: string): void => {
    lifted.length = 0;
    for (const e of x.cells.get(key) ?? []) {
      const v = ctx.byId.get(e.variantId);
      if (v === undefined) continue;
      x.board.add(w, v, slot, -1);
      lifted.push(v);
    }
  };
  const restore = (x: AthleteIndex, w: number, slot: number): void => {
    for (const v of lifted) x.board.add(w, v, slot, 1);
  };

  const explain = (athleteId: string, week: string, slotId: string, variantId: string): Violation[] => {
    const x = get(athleteId);
    if (!x) return [];
    const w = wn(week);
    const slot = ctx.slots.get(slotId)?.idx ?? -1;
    clear(x, w, slot, `${week}|${slotId}`);
    try {
      return cellViolations(ctx, x.ath, x.board, week, slotId, variantId);
    } finally {
      restore(x, w, slot);
    }
  };

  const rate = (athleteId: string, week: string, slotId: string, variantId: string): CandidateRating => {
    const x = get(athleteId);
    if (!x) return { status: 'clean', violations: [], warnings: [] };
    const w = wn(week);
    const slot = ctx.slots.get(slotId)?.idx ?? -1;
    clear(x, w, slot, `${week}|${slotId}`);
    try {
      const violations = cellViolations(ctx, x.ath, x.board, week, slotId, variantId);
      const v = ctx.byId.get(variantId);
      const warnings = v === undefined ? [] : softWarnings(ctx, x.board, w, slotId, v);
      const status = violations.length ? 'break' : warnings.length ? 'warning' : 'clean';
      return { status, violations, warnings };
    } finally {
      restore(x, w, slot);
    }
  };

  return { explain, rate };
}

/** Not rule breaks, but worth a look: a joint near its budget, a window only just kept, no variety. */
function softWarnings(ctx: Ctx, board: Board, w: number, slotId: string, v: number): string[] {
  const out: string[] = [];
  const x = ctx.variants[v]!;
  for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
    const k = ctx.sJ[t]!;
    const b = board.busiest(k, w);
    const total = b.load + ctx.sV[t]!;
    const budget = ctx.budget[k]!;
    if (budget > 0 && total <= budget + 1e-9 && total >= NEAR_BUDGET * budget - 1e-9) {
      const span = W.span(ws(b.start), ws(b.start + ctx.J - 1));
      out.push(
        `${W.jointLoad(JOINTS[k]!)} would reach ${W.num(total)} of ${W.num(budget)} (${W.pct(total / budget)}) in ${span}`,
      );
    }
  }
  if (ctx.R > 1) {
    const u = nearest(board.vUses[v], w, ctx.R + 2);
    if (u !== undefined && Math.abs(u - w) >= ctx.R) {
      out.push(`${x.name} is also in ${ws(u)}, just outside the ${ctx.R}-week repeat window`);
    }
  }
  if (ctx.F > 0) {
    const u = nearest(board.fUses[ctx.fam[v]!], w, ctx.F + 2);
    if (u !== undefined && Math.abs(u - w) >= ctx.F) {
      out.push(`the ${x.family} family is also in ${ws(u)}, just outside its ${ctx.F}-week window`);
    }
  }
  const slot = ctx.slots.get(slotId);
  const prev = slot ? board.at(w - 1, slot.idx) : undefined;
  if (prev !== undefined && x.emphasis && ctx.variants[prev]!.emphasis === x.emphasis) {
    out.push(`same emphasis (${W.emphasisName(x.emphasis)}) as last week's ${slotId} pick`);
  }
  return out;
}

const prepared = new WeakMap<PlanRequest, { key: unknown[]; value: CandidateChecks }>();

/** What would break if variantId were put in the cell; reuses the prepared checks of the request. */
export function explainCandidate(
  req: PlanRequest,
  athleteId: string,
  week: string,
  slotId: string,
  variantId: string,
): Violation[] {
  const key = [
    req.planned,
    req.planned?.length,
    req.athletes,
    req.athletes.length,
    req.variants,
    req.variants.length,
    req.rules,
    req.slots,
  ];
  return memo(prepared, req, key, () => prepareCandidateChecks(req)).explain(athleteId, week, slotId, variantId);
}
