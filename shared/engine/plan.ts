// generatePlan: keeps pinned and still-valid board entries, replaces the rest and fills the open
// cells, athlete by athlete, each from its own seeded stream. Rest weeks are left empty.

import { Board, addAll, buildAth, ctxFor, entriesOf, rangeOf, weekNum, type Ath, type Ctx } from './core';
import { keptReasons, pickReasons, pinnedReasons, swapReason } from './reasons';
import { athleteRng } from './rng';
import { breaksAt, isRestWeek } from './rules/index';
import { Search, solve, type GoalsKept, type OpenCell, type Pick } from './search';
import { RULE_IDS, type AthleteInput, type PlanEntry, type PlanRequest, type PlanResult, type RuleId } from './types';

interface Dropped {
  variantId: string;
  rule: RuleId;
  message: string;
}

/**
 * Plans every athlete × week × slot of the request. Decisions beyond the rules themselves:
 * - Unpinned board entries are judged in week order (slot order within a week) against history, the
 *   pinned entries and the entries kept before them, so of two clashing entries the earlier stays.
 * - An unpinned entry that must go and has no valid replacement leaves its cell in `unfilled`, with the
 *   removed entry and its rule in `dropped`; it is never kept as a silent break.
 * - Board entries outside the requested weeks or slots count toward the rules but are not returned.
 * - Of several board entries for one cell, the first pinned one (else the first) is the cell's entry.
 * - In a rest week an unpinned board entry is removed (listed in `cleared`), a pinned one stays.
 */
export function generatePlan(req: PlanRequest): PlanResult {
  const ctx = ctxFor(req);
  const weeks = [...new Set(req.weeks)];
  weeks.forEach(weekNum);
  const result: PlanResult = { entries: [], unfilled: [], swaps: [], cleared: [] };
  const done = new Set<string>();
  for (const a of req.athletes) {
    if (done.has(a.id)) continue;
    done.add(a.id);
    planAthlete(ctx, a, weeks, result);
  }
  return result;
}

function planAthlete(ctx: Ctx, input: AthleteInput, weeks: string[], result: PlanResult): void {
  const ath = buildAth(ctx, input);
  const slots = ctx.slotList;
  const slotCount = slots.length;
  const nums = weeks.map(weekNum);
  const weekIdx = new Map(weeks.map((w, i) => [w, i]));
  const planned = entriesOf(ctx.req.planned, input.id);
  const atCell: (PlanEntry | undefined)[] = new Array(weeks.length * slotCount);
  const context: PlanEntry[] = [];
  for (const e of planned) {
    const weekIndex = weekIdx.get(e.week);
    const slot = ctx.slots.get(e.slotId);
    if (weekIndex === undefined || !slot) {
      context.push(e);
      continue;
    }
    const i = weekIndex * slotCount + slot.index;
    const cur = atCell[i];
    if (!cur || (!cur.pinned && e.pinned)) atCell[i] = e;
  }
  const [from, to] = rangeOf(nums, input.history, planned);
  const board = new Board(ctx, from, to);
  addAll(ctx, board, input.history);
  addAll(ctx, board, context);
  const pinned = atCell.filter((e): e is PlanEntry => !!e?.pinned);
  addAll(ctx, board, pinned);

  const kind: CellKind[] = new Array(weeks.length * slotCount).fill('open');
  const dropped: (Dropped | undefined)[] = new Array(weeks.length * slotCount);
  for (let i = 0; i < kind.length; i++) {
    if (isRestWeek(ath, nums[Math.floor(i / slotCount)]!) && !atCell[i]?.pinned) {
      kind[i] = 'rest';
      const e = atCell[i];
      if (e)
        result.cleared.push({
          athleteId: input.id,
          week: e.week,
          slotId: e.slotId,
          variantId: e.variantId,
          rule: 'restWeek',
        });
    }
  }
  atCell.forEach((e, i) => {
    if (!e || kind[i] === 'rest') return;
    if (e.pinned) {
      kind[i] = 'pinned';
      return;
    }
    const found = breaksAt(ctx, ath, board, e.week, e.slotId, e.variantId);
    if (found.length === 0) {
      kind[i] = 'kept';
      addAll(ctx, board, [e]);
    } else {
      dropped[i] = { variantId: e.variantId, rule: found[0]!.rule, message: found[0]!.message };
    }
  });

  const open: OpenCell[] = [];
  for (let i = 0; i < weeks.length * slotCount; i++) {
    if (kind[i] !== 'open') continue;
    const weekIndex = Math.floor(i / slotCount);
    open.push({
      at: i,
      w: nums[weekIndex]!,
      week: weeks[weekIndex]!,
      slot: i % slotCount,
      slotId: slots[i % slotCount]!.id,
    });
  }
  const rng = athleteRng(ctx.req.rules.seed, input.id);
  const search = new Search(ctx, ath, board, open, Math.min(...nums), Math.max(...nums), rng);
  const cells = search.cells;
  const solved = cells.length ? solve(search, ctx) : null;
  const sol = solved?.solution ?? null;
  const kept: GoalsKept = solved?.kept ?? { comfort: false, balance: false };

  // Cell index (weeks × slots) → the variant chosen there and how it won.
  const chosen = new Map<number, { v: number; pick?: Pick }>();
  cells.forEach((cell, q) => {
    const v = sol ? sol.assign[q]! : -1;
    if (v < 0) return;
    search.commit(cell, v);
    chosen.set(cell.at, { v, pick: sol!.picks[q] });
  });
  // A cell the bounded search left empty is filled afterwards if anything still fits there.
  for (const cell of cells) {
    if (chosen.has(cell.at)) continue;
    const best = search.bestNow(cell);
    if (!best) continue;
    search.commit(cell, best.v);
    chosen.set(cell.at, best);
  }
  emit(ctx, ath, board, weeks, nums, atCell, kind, dropped, chosen, kept, search, result);
}

type CellKind = 'pinned' | 'kept' | 'open' | 'rest';

function emit(
  ctx: Ctx,
  ath: Ath,
  board: Board,
  weeks: string[],
  nums: number[],
  atCell: (PlanEntry | undefined)[],
  kind: CellKind[],
  dropped: (Dropped | undefined)[],
  chosen: Map<number, { v: number; pick?: Pick }>,
  kept: GoalsKept,
  search: Search,
  result: PlanResult,
): void {
  const athleteId = ath.input.id;
  const slotCount = ctx.slotList.length;
  for (let i = 0; i < weeks.length * slotCount; i++) {
    if (kind[i] === 'rest') continue;
    const week = weeks[Math.floor(i / slotCount)]!;
    const w = nums[Math.floor(i / slotCount)]!;
    const slot = i % slotCount;
    const slotId = ctx.slotList[slot]!.id;
    const e = atCell[i];
    if (kind[i] === 'pinned' && e) {
      const v = ctx.byId.get(e.variantId);
      if (v !== undefined) board.add(w, v, slot, -1);
      const found = breaksAt(ctx, ath, board, week, slotId, e.variantId);
      if (v !== undefined) board.add(w, v, slot, 1);
      result.entries.push({
        athleteId,
        week,
        slotId,
        variantId: e.variantId,
        pinned: true,
        reasons: pinnedReasons(found),
      });
      continue;
    }
    if (kind[i] === 'kept' && e) {
      const v = ctx.byId.get(e.variantId)!;
      result.entries.push({ athleteId, week, slotId, variantId: e.variantId, reasons: keptReasons(ctx, board, w, v) });
      continue;
    }
    const got = chosen.get(i);
    const gone = dropped[i];
    if (got) {
      const variantId = ctx.variants[got.v]!.id;
      const reasons = pickReasons(ctx, ath, board, w, slot, got.v, got.pick, {
        comfort: kept.comfort,
        balance: kept.balance && search.balance[slot] !== null,
      });
      if (gone) {
        reasons.unshift(swapReason(ctx, gone.variantId, gone.message));
        result.swaps.push({ athleteId, week, slotId, from: gone.variantId, to: variantId, rule: gone.rule });
      }
      result.entries.push({ athleteId, week, slotId, variantId, reasons });
      continue;
    }
    result.unfilled.push({
      athleteId,
      week,
      slotId,
      blockedBy: blockedBy(ctx, ath, board, week, slotId),
      ...(gone ? { dropped: gone } : {}),
    });
  }
}

/** The rules that rule out every variant of a fitting lift (or liftMismatch when none fits the slot). */
function blockedBy(ctx: Ctx, ath: Ath, board: Board, week: string, slotId: string): RuleId[] {
  const mask = ctx.slots.get(slotId)!.liftMask;
  const rules = new Set<RuleId>();
  ctx.variants.forEach((x, v) => {
    if ((ctx.liftBit[v]! & mask) === 0) return;
    for (const f of breaksAt(ctx, ath, board, week, slotId, x.id)) rules.add(f.rule);
  });
  if (rules.size === 0) rules.add('liftMismatch');
  return RULE_IDS.filter((r) => rules.has(r));
}
