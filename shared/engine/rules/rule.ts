// The shape of a rule module: each hard rule of the engine is one module holding its check, its message,
// its drag warning and its reason words, read by the checker, the planner, the live checks and the reasons.

import type { Ath, Board, Ctx } from '../core';
import type { RuleId } from '../types';

/** A rule about one cell alone: the variant, the athlete, the week and the slot, never other entries. */
export interface CellRule {
  kind: 'cell';
  id: RuleId;
  /**
   * The planner's fast path: per variant, 1 when the rule rules it out in week w for the athlete, or
   * null when it rules nothing out that week.
   */
  blockedIn(ctx: Ctx, ath: Ath, w: number): ArrayLike<number> | null;
  /** For the one rule about the slot: whether variant v fits slot index `slot` (−1: no such slot). */
  fitsSlot?(ctx: Ctx, v: number, slot: number): boolean;
  /** Why variant v breaks the rule in the cell, one line per cause; called only when the test failed. */
  describe(ctx: Ctx, ath: Ath, w: number, slot: number, v: number, slotId: string): string[];
  /** Words for a pick's reasons when the rule shaped the choice in week w, or null. */
  reason?(ctx: Ctx, ath: Ath, w: number, v: number): string | null;
}

/** A rule that keeps an item (a variant, a family) from coming back within a span of weeks. */
export interface WindowRule {
  kind: 'window';
  id: RuleId;
  /** The span in weeks: two uses closer than this break the rule (0: off). */
  window(ctx: Ctx): number;
  /** How many items there are, and per variant its item. */
  itemCount(ctx: Ctx): number;
  items(ctx: Ctx): Int32Array;
  uses(board: Board, item: number): number[] | undefined;
  /** The message when v in week w clashes with the use in week other. */
  describe(ctx: Ctx, v: number, w: number, other: number): string;
  /** The drag warning when v in week w would be just outside the window of the use in week other, or null. */
  warning(ctx: Ctx, v: number, w: number, board: Board): string | null;
  /** Recency words for a pick: weeks since the last use (undefined: never), and whether it was the least recent. */
  reason(ctx: Ctx, v: number, gap: number | undefined, leastRecent: boolean): string;
}

/** A rule about the summed load of the entries around a week. */
export interface LoadRule {
  kind: 'load';
  id: RuleId;
  describe(ctx: Ctx, board: Board, w: number, v: number): string[];
  warning(ctx: Ctx, board: Board, w: number, v: number): string[];
  reason(ctx: Ctx, board: Board, w: number, v: number): string | null;
}

/** A rule about the entry's variant id itself. */
export interface LibraryRule {
  kind: 'library';
  id: RuleId;
  describe(variantId: string): string;
}

export type Rule = CellRule | WindowRule | LoadRule | LibraryRule;
