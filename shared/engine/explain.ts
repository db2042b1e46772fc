// Live checks for the coach's board while dragging: what a drop would break, softer warnings, and the
// planner's own preference for a variant in a cell, from indexes built once per request so each target
// cell costs microseconds.

import {
  Board,
  addAll,
  buildAth,
  ctxFor,
  entriesOf,
  lastBefore,
  memo,
  rangeOf,
  taperAt,
  weekNum,
  type Ath,
} from './core';
import { balancedLifts, bitCount, fairShareOf, newPreferenceInput, preference, type BalanceView } from './goals';
import { blockedIn, breaksAt, isRestWeek, ruleWarnings } from './rules/index';
import { LIFTS, type PlanEntry, type PlanRequest, type Violation } from './types';
import * as W from './words';

export { NEAR_BUDGET } from './rules/index';

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
  /**
   * The planner's soft-goal preference for variantId in the cell given everything else on the board
   * (lower = preferred; the seeded tie-break left out). Infinity for an unknown athlete, slot or variant.
   */
  score(athleteId: string, week: string, slotId: string, variantId: string): number;
}

/** Per athlete and slot, over the request's weeks: what the soft goals measure against. */
interface SlotFacts {
  /** Lifts of the slot with an eligible variant in some planned week (lift bits). */
  required: number;
  eligibleFamilies: number;
  /** Mean specificity of the variants eligible outside taper weeks. */
  eligibleMean: number;
  /** Planned weeks that are not rest weeks. */
  weeks: number;
}

interface AthleteIndex {
  ath: Ath;
  board: Board;
  /** "week|slot" → the board entries in that cell. */
  cells: Map<string, PlanEntry[]>;
  slotFacts: (SlotFacts | undefined)[];
}

/**
 * Indexes the request once (the library at once, each athlete on first use). Treat the request as an
 * immutable value: build a new one (or call this again) after the board changes.
 */
export function prepareCandidateChecks(req: PlanRequest): CandidateChecks {
  const ctx = ctxFor(req);
  const planWeeks = [...new Set(req.weeks)].map(weekNum);
  const planSet = new Set(planWeeks);
  const planFirst = Math.min(...planWeeks);
  const planLast = Math.max(...planWeeks);
  const index = new Map<string, AthleteIndex | null>();
  const get = (athleteId: string): AthleteIndex | null => {
    let hit = index.get(athleteId);
    if (hit !== undefined) return hit;
    const input = ctx.athletes.get(athleteId);
    hit = null;
    if (input) {
      const planned = entriesOf(req.planned, athleteId);
      const [from, to] = rangeOf(planWeeks, input.history, planned);
      const board = new Board(ctx, from, to);
      addAll(ctx, board, input.history);
      addAll(ctx, board, planned);
      const cells = new Map<string, PlanEntry[]>();
      for (const e of planned) {
        const key = `${e.week}|${e.slotId}`;
        const list = cells.get(key);
        if (list) list.push(e);
        else cells.set(key, [e]);
      }
      hit = { ath: buildAth(ctx, input), board, cells, slotFacts: [] };
    }
    index.set(athleteId, hit);
    return hit;
  };

  const factsOf = (x: AthleteIndex, slot: number): SlotFacts => {
    const known = x.slotFacts[slot];
    if (known) return known;
    let required = 0;
    let weeks = 0;
    const families = new Set<number>();
    const outsideTaper = new Set<number>();
    for (const w of planWeeks) {
      if (isRestWeek(x.ath, w)) continue;
      weeks++;
      const blocked = blockedIn(ctx, x.ath, w);
      const taper = taperAt(ctx, x.ath, w) !== null;
      for (const v of ctx.slotVariants[slot]!) {
        if (blocked && blocked[v]) continue;
        required |= ctx.liftBit[v]!;
        families.add(ctx.family[v]!);
        if (!taper) outsideTaper.add(v);
      }
    }
    let sum = 0;
    for (const v of outsideTaper) sum += ctx.specificity[v]!;
    const facts = {
      required,
      eligibleFamilies: families.size,
      eligibleMean: outsideTaper.size ? sum / outsideTaper.size : 0,
      weeks,
    };
    x.slotFacts[slot] = facts;
    return facts;
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
  /** Runs `f` with the cell's own entries off the board. */
  const withCellCleared = <T>(x: AthleteIndex, week: string, slotId: string, f: (w: number, slot: number) => T): T => {
    const w = weekNum(week);
    const slot = ctx.slots.get(slotId)?.index ?? -1;
    clear(x, w, slot, `${week}|${slotId}`);
    try {
      return f(w, slot);
    } finally {
      restore(x, w, slot);
    }
  };

  const explain = (athleteId: string, week: string, slotId: string, variantId: string): Violation[] => {
    const x = get(athleteId);
    if (!x) return [];
    return withCellCleared(x, week, slotId, () => breaksAt(ctx, x.ath, x.board, week, slotId, variantId));
  };

  const balanceWarning = (x: AthleteIndex, w: number, slot: number, v: number): string | null => {
    if (ctx.liftBalanceWeeks < 1 || slot < 0 || !planSet.has(w)) return null;
    const facts = factsOf(x, slot);
    if (bitCount(facts.required) < 2 || !(ctx.liftBit[v]! & facts.required)) return null;
    const view: BalanceView = {
      span: ctx.liftBalanceWeeks,
      required: facts.required,
      planFirst,
      planLast,
      liftAt: (u) => {
        const at = x.board.at(u, slot);
        return at === undefined ? 0 : ctx.liftBit[at]!;
      },
      openAt: (u) => planSet.has(u) && !isRestWeek(x.ath, u) && x.board.at(u, slot) === undefined,
    };
    if (balancedLifts(view, w, ctx.liftBit[v]!) !== 0) return null;
    const missing = LIFTS.filter((l, i) => facts.required & (1 << i) && l !== ctx.variants[v]!.lift);
    const slotDef = ctx.slotList[slot]!;
    return `lift balance: the ${slotDef.id} slot should hold ${slotDef.lifts.join(' and ')} in any ${W.weeks(ctx.liftBalanceWeeks)}; this leaves no week for ${missing.join(' or ')}`;
  };

  const warningsFor = (x: AthleteIndex, w: number, slot: number, v: number): string[] => {
    const out = ruleWarnings(ctx, x.board, w, v);
    const balance = balanceWarning(x, w, slot, v);
    if (balance) out.push(balance);
    const prev = slot >= 0 ? x.board.at(w - 1, slot) : undefined;
    const emphasis = ctx.variants[v]!.emphasis;
    if (prev !== undefined && emphasis && ctx.variants[prev]!.emphasis === emphasis) {
      out.push(`same emphasis (${W.emphasisName(emphasis)}) as last week's ${ctx.slotList[slot]!.id} pick`);
    }
    return out;
  };

  const rate = (athleteId: string, week: string, slotId: string, variantId: string): CandidateRating => {
    const x = get(athleteId);
    if (!x) return { status: 'clean', violations: [], warnings: [] };
    return withCellCleared(x, week, slotId, (w, slot) => {
      const violations = breaksAt(ctx, x.ath, x.board, week, slotId, variantId);
      const v = ctx.byId.get(variantId);
      const warnings = v === undefined ? [] : warningsFor(x, w, slot, v);
      const status = violations.length ? 'break' : warnings.length ? 'warning' : 'clean';
      return { status, violations, warnings };
    });
  };

  const input = newPreferenceInput();
  /** The last cell scored: its family counts and specificity surplus, computed once for all variants. */
  let scoredCell: { athleteId: string; key: string; familyPicks: Map<number, number>; surplus: number } | null = null;
  const cellTotals = (x: AthleteIndex, athleteId: string, key: string, w: number, slot: number, facts: SlotFacts) => {
    if (scoredCell && scoredCell.athleteId === athleteId && scoredCell.key === key) return scoredCell;
    const familyPicks = new Map<number, number>();
    let surplus = 0;
    for (const u of planWeeks) {
      const at = u === w ? undefined : x.board.at(u, slot);
      if (at === undefined) continue;
      familyPicks.set(ctx.family[at]!, (familyPicks.get(ctx.family[at]!) ?? 0) + 1);
      if (!taperAt(ctx, x.ath, u)) surplus += ctx.specificity[at]! - facts.eligibleMean;
    }
    scoredCell = { athleteId, key, familyPicks, surplus };
    return scoredCell;
  };

  const score = (athleteId: string, week: string, slotId: string, variantId: string): number => {
    const x = get(athleteId);
    const v = ctx.byId.get(variantId);
    const slotInfo = ctx.slots.get(slotId);
    if (!x || v === undefined || !slotInfo) return Infinity;
    return withCellCleared(x, week, slotId, (w, slot) => {
      const facts = factsOf(x, slot);
      const totals = cellTotals(x, athleteId, `${week}|${slotId}`, w, slot, facts);
      const familyLast = lastBefore(x.board.familyUses[ctx.family[v]!], w);
      const variantLast = lastBefore(x.board.variantUses[v], w);
      let ratio = 0;
      for (let t = ctx.stressStart[v]!; t < ctx.stressStart[v + 1]!; t++) {
        const k = ctx.stressJoint[t]!;
        const b = ctx.budget[k]!;
        if (b > 0) ratio = Math.max(ratio, (x.board.busiest(k, w).load + ctx.stressValue[t]!) / b);
      }
      const before = x.board.at(w - 1, slot) ?? -1;
      const after = x.board.at(w + 1, slot) ?? -1;
      input.familyGap = familyLast === undefined ? Infinity : w - familyLast;
      input.variantGap = variantLast === undefined ? Infinity : w - variantLast;
      input.loadRatio = ratio;
      input.comfortRatio = ctx.comfortRatio;
      input.familyPicks = totals.familyPicks.get(ctx.family[v]!) ?? 0;
      input.fairShare = fairShareOf(facts.weeks, facts.eligibleFamilies);
      input.taper = taperAt(ctx, x.ath, w) !== null;
      input.specificity = ctx.specificity[v]!;
      input.eligibleMean = facts.eligibleMean;
      input.surplus = totals.surplus;
      input.emphasis = ctx.emphasis[v]!;
      input.emphasisBefore = before < 0 ? -1 : ctx.emphasis[before]!;
      input.emphasisAfter = after < 0 ? -1 : ctx.emphasis[after]!;
      input.bar = ctx.bar[v]!;
      input.barBefore = before < 0 ? -1 : ctx.bar[before]!;
      input.barAfter = after < 0 ? -1 : ctx.bar[after]!;
      input.noise = 0;
      return -preference(input);
    });
  };

  return { explain, rate, score };
}

const prepared = new WeakMap<PlanRequest, { key: unknown[]; value: CandidateChecks }>();

function checksFor(req: PlanRequest): CandidateChecks {
  const key = [
    req.planned,
    req.planned?.length,
    req.athletes,
    req.athletes.length,
    req.variants,
    req.variants.length,
    req.rules,
    req.slots,
    req.weeks,
  ];
  return memo(prepared, req, key, () => prepareCandidateChecks(req));
}

/** What would break if variantId were put in the cell; reuses the prepared checks of the request. */
export function explainCandidate(
  req: PlanRequest,
  athleteId: string,
  week: string,
  slotId: string,
  variantId: string,
): Violation[] {
  return checksFor(req).explain(athleteId, week, slotId, variantId);
}

/**
 * The planner's soft-goal preference for variantId in the cell given everything else (lower =
 * preferred); reuses the prepared checks of the request, so scoring a whole library for one cell is cheap.
 */
export function candidateScore(
  req: PlanRequest,
  athleteId: string,
  week: string,
  slotId: string,
  variantId: string,
): number {
  return checksFor(req).score(athleteId, week, slotId, variantId);
}
