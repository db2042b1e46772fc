// The rule registry: every hard rule once, in the order their breaks are reported. checkPlan, the
// planner, the live drag checks and the reasons all read the rules from here.

import { nearest, weekNum, type Ath, type Board, type Ctx } from '../core';
import type { RuleId, Violation } from '../types';
import { archived } from './archived';
import { equipment } from './equipment';
import { family } from './family';
import { jointBudget } from './joint-budget';
import { liftMismatch } from './lift-mismatch';
import { meetPhase } from './meet-phase';
import { repeat } from './repeat';
import { restWeek } from './rest-week';
import { restriction } from './restriction';
import { riskCeiling } from './risk-ceiling';
import type { CellRule, Rule, WindowRule } from './rule';
import { taperRisk } from './taper-risk';
import { taperSpecificity } from './taper-specificity';
import { unknownVariant } from './unknown-variant';

export type { CellRule, LoadRule, Rule, WindowRule } from './rule';
export { NEAR_BUDGET, budgetCaps, jointBudget } from './joint-budget';
export { fitsSlot } from './lift-mismatch';
export { isRestWeek } from './rest-week';
export { family, meetPhase, repeat, taperSpecificity, unknownVariant };

/** Every rule, in the order a cell's breaks are listed (the first is the one a swap names). */
export const RULES: readonly Rule[] = [
  unknownVariant,
  archived,
  restWeek,
  liftMismatch,
  equipment,
  restriction,
  riskCeiling,
  meetPhase,
  taperRisk,
  taperSpecificity,
  repeat,
  family,
  jointBudget,
];
export const CELL_RULES: readonly CellRule[] = RULES.filter((r): r is CellRule => r.kind === 'cell');
export const WINDOW_RULES: readonly WindowRule[] = RULES.filter((r): r is WindowRule => r.kind === 'window');

interface ActiveCellRules {
  rules: CellRule[];
  masks: ArrayLike<number>[];
  /** Per variant, 1 when some cell rule (but the slot's) rules it out; null when none does. */
  blocked: ArrayLike<number> | null;
}

/** The cell rules that rule something out in week w for the athlete, with their masks (cached per week). */
function activeIn(ctx: Ctx, ath: Ath, w: number): ActiveCellRules {
  let hit = ath.cellTests.get(w) as ActiveCellRules | undefined;
  if (hit) return hit;
  hit = { rules: [], masks: [], blocked: null };
  for (const rule of CELL_RULES) {
    const mask = rule.blockedIn(ctx, ath, w);
    if (!mask) continue;
    hit.rules.push(rule);
    hit.masks.push(mask);
  }
  // The rules' own masks are shared: combine into a new array only when there are several.
  if (hit.masks.length === 1) hit.blocked = hit.masks[0]!;
  else if (hit.masks.length > 1) {
    const combined = Array.from(hit.masks[0]!);
    for (const mask of hit.masks) for (let v = 0; v < combined.length; v++) combined[v]! |= mask[v]!;
    hit.blocked = combined;
  }
  ath.cellTests.set(w, hit);
  return hit;
}

/**
 * The planner's fast path: per variant, 1 when a cell rule rules it out in week w (the slot's own variant
 * list covers the slot rule); null when no cell rule rules anything out.
 */
export function blockedIn(ctx: Ctx, ath: Ath, w: number): ArrayLike<number> | null {
  return activeIn(ctx, ath, w).blocked;
}

/**
 * Every rule that putting variantId in (week, slotId) would break, against what is on the board.
 * The caller takes the cell's own entry off the board first.
 */
export function breaksAt(
  ctx: Ctx,
  ath: Ath,
  board: Board,
  week: string,
  slotId: string,
  variantId: string,
): Violation[] {
  const out: Violation[] = [];
  const note = (rule: RuleId, message: string) =>
    out.push({ rule, athleteId: ath.input.id, week, slotId, variantId, message });
  const v = ctx.byId.get(variantId);
  if (v === undefined) {
    note(unknownVariant.id, unknownVariant.describe(variantId));
    return out;
  }
  const w = weekNum(week);
  const slot = ctx.slots.get(slotId)?.index ?? -1;
  const active = activeIn(ctx, ath, w);
  for (const rule of RULES) {
    switch (rule.kind) {
      case 'cell': {
        const i = active.rules.indexOf(rule);
        const broken = rule.fitsSlot ? !rule.fitsSlot(ctx, v, slot) : i >= 0 && active.masks[i]![v] === 1;
        if (broken) for (const m of rule.describe(ctx, ath, w, slot, v, slotId)) note(rule.id, m);
        break;
      }
      case 'window': {
        const window = rule.window(ctx);
        const other = nearest(rule.uses(board, rule.items(ctx)[v]!), w, window);
        if (other !== undefined) note(rule.id, rule.describe(ctx, v, w, other));
        break;
      }
      case 'load':
        for (const m of rule.describe(ctx, board, w, v)) note(rule.id, m);
        break;
      case 'library':
        break;
    }
  }
  return out;
}

/** The drag warnings of the rules: a window only just kept, a joint near its budget. */
export function ruleWarnings(ctx: Ctx, board: Board, w: number, v: number): string[] {
  const out = jointBudget.warning(ctx, board, w, v);
  for (const rule of WINDOW_RULES) {
    const line = rule.warning(ctx, v, w, board);
    if (line) out.push(line);
  }
  return out;
}
