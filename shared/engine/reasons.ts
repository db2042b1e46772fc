// Why each cell of a generated plan holds what it holds, in a coach's words and with the numbers: first
// the goal that decided against the runner-up, then the facts (recency, load, taper, changes).

import { lastBefore, specText, type Ath, type Board, type Ctx } from './core';
import { family, jointBudget, meetPhase, repeat, taperSpecificity } from './rules/index';
import type { Pick } from './search';
import type { Violation } from './types';
import * as W from './words';

/** The soft goals a plan keeps, as they apply to one cell. */
export interface CellGoals {
  comfort: boolean;
  balance: boolean;
}

/** The first reason line: which goal made this pick win over the runner-up. */
function decidedLine(ctx: Ctx, slot: number, v: number, pick: Pick | undefined, taper: boolean): string | null {
  if (!pick) return null;
  if (pick.runnerUp < 0) return pick.candidates === 1 ? 'the only variant that fits here' : null;
  const x = ctx.variants[v]!;
  const other = ctx.variants[pick.runnerUp]!;
  const slotId = ctx.slotList[slot]!.id;
  switch (pick.decided) {
    case 'comfort':
      return `chosen for comfort: lighter on the joints than ${other.name}, as no plan keeps every joint under ${W.pct(ctx.comfortRatio)} of budget`;
    case 'fairShare':
      return `chosen for variety: the ${other.family} family already has its fair share of ${slotId} picks`;
    case 'familyRecency':
      return `chosen for variety: the ${x.family} family was used less recently than ${other.family}`;
    case 'variantRecency':
      return `chosen for variety: done less recently than ${other.name}`;
    case 'specificity':
      return taper
        ? `chosen for effect: more specific for the meet (${specText(x.specificity)}) than ${other.name} (${specText(other.specificity)})`
        : `chosen for effect: specificity ${specText(x.specificity)} keeps the ${slotId} picks' mean at or above the library's`;
    case 'vary':
      return 'chosen for effect: varies emphasis or bar from the weeks around it';
    default:
      return `chosen by the seeded tie-break between equal choices (${other.name} was as good)`;
  }
}

/** Reasons for a variant the engine picked, read off the finished board. */
export function pickReasons(
  ctx: Ctx,
  ath: Ath,
  board: Board,
  w: number,
  slot: number,
  v: number,
  pick: Pick | undefined,
  goals: CellGoals,
): string[] {
  const x = ctx.variants[v]!;
  const out: string[] = [];
  const taperLine = taperSpecificity.reason!(ctx, ath, w, v);
  const decided = decidedLine(ctx, slot, v, pick, taperLine !== null);
  if (decided) out.push(decided);
  const familyGap = gapOf(lastBefore(board.familyUses[ctx.family[v]!], w), w);
  // "Least recently used" was true among the candidates at pick time; a later pick may have changed it.
  const leastRecent = !!pick?.leastRecentFamily && (familyGap ?? Infinity) === pick.familyGap;
  out.push(family.reason(ctx, v, familyGap, leastRecent));
  out.push(repeat.reason(ctx, v, gapOf(lastBefore(board.variantUses[v], w), w), false));
  const load = jointBudget.reason(ctx, board, w, v);
  if (load) out.push(load);
  if (goals.comfort && ctx.budgeted.length > 0)
    out.push(`comfort: every joint stays at or under ${W.pct(ctx.comfortRatio)} of its budget`);
  if (goals.balance) {
    const lifts = ctx.slotList[slot]!.lifts.join(' and ');
    out.push(`lift balance: ${lifts} each at least once in any ${W.weeks(ctx.liftBalanceWeeks)}`);
  }
  if (taperLine) out.push(taperLine);
  const phase = meetPhase.reason!(ctx, ath, w, v);
  if (phase) out.push(phase);
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
  const load = jointBudget.reason(ctx, board, w, v);
  return ['kept from the board: still within every rule', ...(load ? [load] : [])];
}

export function pinnedReasons(violations: Violation[]): string[] {
  return ['coach pick (pinned)', ...violations.map((x) => `kept although ${x.message}`)];
}

export function swapReason(ctx: Ctx, fromId: string, message: string): string {
  const v = ctx.byId.get(fromId);
  return `replaces ${v === undefined ? fromId : ctx.variants[v]!.name}: ${message}`;
}
