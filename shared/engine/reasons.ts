// Why each cell of a generated plan holds what it holds, in a coach's words and with the numbers.

import { type Ath, type Board, type Ctx, lastBefore, specText, taperAt, ws } from './core';
import type { Pick } from './search';
import { JOINTS, type Violation } from './types';
import * as W from './words';

function ago(gap: number | undefined): string {
  return gap === undefined ? 'not used before' : `${W.weeks(gap)} ago`;
}

/** The busiest span around week w on the joint the variant loads most, against its budget. */
export function loadReason(ctx: Ctx, board: Board, w: number, v: number): string | null {
  if (ctx.budgeted.length === 0) return null;
  let top: { k: number; load: number; start: number; ratio: number } | null = null;
  for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
    const k = ctx.sJ[t]!;
    const b = board.busiest(k, w);
    const budget = ctx.budget[k]!;
    const ratio = budget > 0 ? b.load / budget : Infinity;
    if (!top || ratio > top.ratio) top = { k, load: b.load, start: b.start, ratio };
  }
  if (!top) return 'adds no load to any budgeted joint';
  const span = W.span(ws(top.start), ws(top.start + ctx.J - 1));
  const share = Number.isFinite(top.ratio) ? ` (${W.pct(top.ratio)})` : '';
  return `${W.jointLoad(JOINTS[top.k]!)} ${W.num(top.load)} of ${W.num(ctx.budget[top.k]!)} in ${span}${share}`;
}

/** Reasons for a variant the engine picked, read off the finished board. */
export function pickReasons(
  ctx: Ctx,
  ath: Ath,
  board: Board,
  w: number,
  slot: number,
  v: number,
  pick?: Pick,
): string[] {
  const x = ctx.variants[v]!;
  const out: string[] = [];
  const famGap = gapOf(lastBefore(board.fUses[ctx.fam[v]!], w), w);
  // "Least recently used" was true among the candidates at pick time; a later pick may have changed it.
  out.push(
    pick?.leastFam && (famGap ?? Infinity) === pick.famGap
      ? `least recently used ${x.family} family (${ago(famGap)})`
      : `${x.family} family last used ${ago(famGap)}`,
  );
  const varGap = gapOf(lastBefore(board.vUses[v], w), w);
  out.push(varGap === undefined ? `${x.name} not done before` : `${x.name} last done ${ago(varGap)}`);
  const load = loadReason(ctx, board, w, v);
  if (load) out.push(load);
  const taper = taperAt(ctx, ath, w);
  if (taper) {
    const min = Number.isFinite(taper.minSpec) ? ` (at least ${specText(taper.minSpec)})` : '';
    const max = Number.isFinite(taper.maxRisk) ? ` (at most ${taper.maxRisk})` : '';
    out.push(`${W.meetDistance(taper.d)}: specificity ${specText(x.specificity)}${min}, risk ${x.risk}${max}`);
  }
  const prev = board.at(w - 1, slot);
  if (prev !== undefined) {
    const p = ctx.variants[prev]!;
    if (x.emphasis && p.emphasis && x.emphasis !== p.emphasis) {
      out.push(`changes emphasis from ${W.emphasisName(p.emphasis)} to ${W.emphasisName(x.emphasis)}`);
    }
    if (x.bar && p.bar && x.bar !== p.bar) out.push(`changes bar from ${p.bar} to ${x.bar}`);
  }
  return out;
}

function gapOf(last: number | undefined, w: number): number | undefined {
  return last === undefined ? undefined : w - last;
}

export function keptReasons(ctx: Ctx, board: Board, w: number, v: number): string[] {
  const load = loadReason(ctx, board, w, v);
  return ['kept from the board: still within every rule', ...(load ? [load] : [])];
}

export function pinnedReasons(violations: Violation[]): string[] {
  return ['coach pick (pinned)', ...violations.map((x) => `kept although ${x.message}`)];
}

export function swapReason(ctx: Ctx, fromId: string, message: string): string {
  const v = ctx.byId.get(fromId);
  return `replaces ${v === undefined ? fromId : ctx.variants[v]!.name}: ${message}`;
}
