// The per-athlete planner: depth-first search over the open cells (tightest first, then week order)
// with forward checking and a joint-load lower bound. It looks first for a complete rule-clean plan that
// keeps every joint under the comfort line and every multi-lift slot in lift balance, and gives those
// goals up in that order only when no such plan is found; among the candidates of a cell it follows the
// variety and effect score of ./goals.

import { EPS, JOINT_COUNT, lastBefore, taperAt, type Ath, type Board, type Ctx } from './core';
import {
  TERM_COUNT,
  balancedLifts,
  bitCount,
  decidingTerm,
  fairShareOf,
  newPreferenceInput,
  preference,
  type BalanceView,
  type Term,
} from './goals';
import { WINDOW_RULES, blockedIn, budgetCaps, type WindowRule } from './rules/index';

/** Effort bounds, in candidate evaluations, per athlete (not per request, so athletes stay independent). */
export const EFFORT = {
  /** Complete (40 per domain entry) and partial (2 per entry) searches, in candidate evaluations. */
  completeMin: 20_000,
  complete: 300_000,
  partialMin: 5_000,
  partial: 50_000,
  /** Giving up cells one by one may spend this many complete searches' effort in all. */
  dropRounds: 3,
  /** Each tightening run: this many dives' worth of effort, within [tightenMin, tighten]. */
  tightenPerDive: 4,
  tightenMin: 3_000,
  tighten: 40_000,
  /** All tightening together: this many dives' worth, but at least tightenFloor. */
  tightenTotalPerDive: 8,
  tightenFloor: 20_000,
  tightenTries: 7,
  /** Stop bisecting once the best peak is within this share of a cap proven (or given up as) infeasible. */
  resolution: 0.02,
};

export interface OpenCell {
  at: number; // the caller's index for the cell
  w: number;
  week: string;
  slot: number;
  slotId: string;
}

export interface Cell extends OpenCell {
  domain: number[]; // variants the cell rules and the fixed entries allow
  noise: number[]; // seeded noise per domain variant, for ties and reshuffles
  minStress: number[]; // per joint, the least stress any domain variant adds
  taper: boolean;
}

/** How a pick won, for its reasons. */
export interface Pick {
  familyGap: number; // weeks since the family was last used before this week (Infinity: never)
  leastRecentFamily: boolean; // no valid candidate's family was less recently used
  variantGap: number;
  /** The goal on which the pick beat the runner-up, and the runner-up (−1: it was the only candidate). */
  decided: Term | null;
  runnerUp: number;
  /** How many valid candidates the cell had (0: not counted). */
  candidates: number;
}

export interface Solution {
  assign: number[]; // variant per cell, −1 when empty
  picks: (Pick | undefined)[];
  peak: number;
  empties: number;
}

/** Which soft goals a plan was found to keep. */
export interface GoalsKept {
  comfort: boolean;
  balance: boolean;
}

const NO_STRESS = zeros(JOINT_COUNT);
const CELL_KEY = 1024;

export class Search {
  private readonly cellCount: number;
  /** The board's load plus, per open cell, the least stress it may add (the joint-load lower bound). */
  private readonly boundLoad: number[][];
  private cap: number[];
  private readonly fullCaps: number[];
  private useMinStress = true;
  private partial = false;
  private balanceOn = false;
  private limit = 0;
  aborted = false;
  /** Effort spent by the last run. */
  lastRunWork = 0;
  private order: number[] = [];
  /** Per cell, how often the search found it left with nothing: the first to give up when stuck. */
  readonly wipe: number[];
  private readonly familyLast: number[];
  work = 0;
  private empties = 0;
  private bestEmpties = Infinity;
  private readonly assign: number[];
  private readonly picks: (Pick | undefined)[];
  private readonly spanBuffers: number[][];
  private readonly aliveBuffer = zeros(JOINT_COUNT);
  best: Solution | null = null;
  /** Per window rule, per planned week × item: how many entries keep the item out of that week. */
  private readonly blocked: { rule: WindowRule; window: number; items: number; itemOf: Int32Array; counts: number[] }[];
  private familyGap = 0;
  private variantGap = 0;
  private readonly input = newPreferenceInput();
  private readonly terms = new Float64Array(TERM_COUNT);
  private readonly otherTerms = new Float64Array(TERM_COUNT);
  /** Per slot × family: picks in the planned weeks (fixed and searched); per slot: the fair share. */
  private readonly familyPicks: number[];
  private readonly fairShare: number[];
  /** Per slot: mean specificity of the eligible variants outside taper weeks, and the picks' surplus over it. */
  private readonly eligibleMean: number[];
  private readonly surplus: number[];
  /** Per slot, the lift-balance view (null: the goal does not apply to the slot). */
  readonly balance: (BalanceView | null)[];
  private readonly openAt = new Map<number, number>();
  private readonly horizon: number;

  readonly cells: Cell[];
  /** Cells with few candidates first, then week order (see the constructor). */
  readonly searchOrder: number[];

  /** Open cells that nothing fits, even before any pick, are left out of `cells` (they stay unfilled). */
  constructor(
    private readonly ctx: Ctx,
    private readonly ath: Ath,
    private readonly board: Board,
    open: OpenCell[],
    private readonly first: number,
    private readonly last: number,
    rng: () => number,
  ) {
    this.boundLoad = board.load.map((a) => zeros(a.length));
    this.fullCaps = budgetCaps(ctx, 1);
    this.cap = this.fullCaps;
    const weeks = open.length ? last - first + 1 : 0;
    this.blocked = WINDOW_RULES.map((rule) => {
      const items = rule.itemCount(ctx);
      const entry = { rule, window: rule.window(ctx), items, itemOf: rule.items(ctx), counts: zeros(weeks * items) };
      for (let item = 0; item < items; item++) {
        const uses = rule.uses(board, item);
        if (uses) for (const u of uses) this.block(entry, item, u, 1);
      }
      return entry;
    });
    const slotCount = ctx.slotList.length;
    this.familyPicks = zeros(slotCount * ctx.familyNames.length);
    this.fairShare = zeros(slotCount).fill(Infinity);
    this.eligibleMean = zeros(slotCount);
    this.surplus = zeros(slotCount);
    const { cells, required } = this.domains(open, rng);
    this.cells = cells;
    this.cellCount = cells.length;
    cells.forEach((c, i) => this.openAt.set(c.w * CELL_KEY + c.slot, i));
    this.assign = zeros(this.cellCount).fill(-1);
    this.picks = new Array<Pick | undefined>(this.cellCount);
    this.spanBuffers = cells.map(() => zeros(JOINT_COUNT));
    this.wipe = zeros(this.cellCount);
    this.familyLast = zeros(ctx.familyNames.length);
    this.balance = ctx.slotList.map((_, slot) => {
      if (ctx.liftBalanceWeeks < 1 || bitCount(required[slot]!) < 2) return null;
      return {
        span: ctx.liftBalanceWeeks,
        required: required[slot]!,
        planFirst: first,
        planLast: last,
        liftAt: (w: number) => {
          const v = board.at(w, slot);
          return v === undefined ? 0 : ctx.liftBit[v]!;
        },
        openAt: (w: number) => {
          const i = this.openAt.get(w * CELL_KEY + slot);
          return i !== undefined && this.assign[i]! < 0;
        },
      };
    });
    this.horizon = Math.max(ctx.repeatWindow, ctx.familyWindow, ctx.jointWindow, ctx.liftBalanceWeeks);
    // Cells with few candidates first (tightest first), so that a corner is found before effort goes
    // into the weeks around it; the rest in week order, which suits the recency and variety goals.
    const tight = 2 * Math.max(ctx.repeatWindow, ctx.familyWindow, 1);
    const rank = (c: Cell) => (c.domain.length <= tight ? c.domain.length : Infinity);
    this.searchOrder = this.cells.map((_, i) => i).sort((a, b) => rank(this.cells[a]!) - rank(this.cells[b]!) || a - b);
  }

  /** Whether some slot has the lift-balance goal. */
  get hasBalance(): boolean {
    return this.balance.some((b) => b !== null);
  }

  /**
   * Each open cell's candidates (the cell rules, then the fixed entries), and per slot the goals' facts:
   * the lifts with an eligible variant, the eligible families and mean specificity, the fair share.
   */
  private domains(open: OpenCell[], rng: () => number): { cells: Cell[]; required: number[] } {
    const ctx = this.ctx;
    const slotCount = ctx.slotList.length;
    const cells: Cell[] = [];
    const spanMax = zeros(JOINT_COUNT);
    const count = ctx.variants.length;
    // Per slot × variant: 1 eligible in some open cell, 2 also outside taper weeks.
    const eligible = zeros(slotCount * count);
    const weeksOfSlot = zeros(slotCount);
    const required = zeros(slotCount);
    for (const o of open) {
      weeksOfSlot[o.slot]!++;
      const blocked = blockedIn(ctx, this.ath, o.w);
      const taper = taperAt(ctx, this.ath, o.w);
      this.spanMaxes(this.board.load, o.w, spanMax);
      const list = ctx.slotVariants[o.slot]!;
      const domain = zeros(list.length);
      let n = 0;
      for (let i = 0; i < list.length; i++) {
        const v = list[i]!;
        if (blocked && blocked[v]) continue;
        const at = o.slot * count + v;
        if (!taper) eligible[at] = 2;
        else if (eligible[at] === 0) eligible[at] = 1;
        required[o.slot]! |= ctx.liftBit[v]!;
        if (this.valid(v, o.w, spanMax, NO_STRESS)) domain[n++] = v;
      }
      if (n === 0) continue;
      const minStress = zeros(JOINT_COUNT);
      for (const k of ctx.budgeted) {
        let least = Infinity;
        for (let i = 0; i < n && least > 0; i++) least = Math.min(least, ctx.stress[domain[i]! * JOINT_COUNT + k]!);
        minStress[k] = least;
      }
      cells.push({
        at: o.at,
        w: o.w,
        week: o.week,
        slot: o.slot,
        slotId: o.slotId,
        domain: domain.slice(0, n),
        noise: noise(rng, n),
        minStress,
        taper: taper !== null,
      });
    }
    for (let slot = 0; slot < slotCount; slot++) {
      const families = new Set<number>();
      let sum = 0;
      let outsideTaper = 0;
      for (const v of ctx.slotVariants[slot]!) {
        const mark = eligible[slot * count + v]!;
        if (mark === 0) continue;
        families.add(ctx.family[v]!);
        if (mark === 2) {
          sum += ctx.specificity[v]!;
          outsideTaper++;
        }
      }
      // The slot's cells in the planned weeks: the open ones and those the board already fills.
      for (let w = this.first; w <= this.last && open.length; w++) {
        const v = this.board.at(w, slot);
        if (v === undefined) continue;
        weeksOfSlot[slot]!++;
        this.familyPicks[slot * ctx.familyNames.length + ctx.family[v]!]!++;
      }
      this.fairShare[slot] = fairShareOf(weeksOfSlot[slot]!, families.size);
      this.eligibleMean[slot] = outsideTaper ? sum / outsideTaper : 0;
    }
    return { cells, required };
  }

  /** Counts, per planned week, the entries that keep `item` out of it under one window rule. */
  private block(entry: (typeof this.blocked)[number], item: number, u: number, sign: 1 | -1): void {
    const from = Math.max(this.first, u - entry.window + 1);
    const to = Math.min(this.last, u + entry.window - 1);
    for (let x = from; x <= to; x++) entry.counts[(x - this.first) * entry.items + item]! += sign;
  }

  /** Largest summed stress of the spans holding week w, per budgeted joint, from array set `loads`. */
  private spanMaxes(loads: number[][], w: number, out: number[]): void {
    const span = this.ctx.jointWindow;
    const base = this.board.first;
    for (const k of this.ctx.budgeted) {
      const a = loads[k]!;
      // Week w − span + 1 … w + span − 1 as indexes into a; outside the array the load is 0.
      const from = w - span + 1 - base;
      let s = 0;
      for (let i = from; i < from + span; i++) if (i >= 0 && i < a.length) s += a[i]!;
      let best = s;
      for (let i = from + 1; i <= w - base; i++) {
        const add = i + span - 1;
        if (add >= 0 && add < a.length) s += a[add]!;
        if (i - 1 >= 0 && i - 1 < a.length) s -= a[i - 1]!;
        if (s > best) best = s;
      }
      out[k] = best;
    }
  }

  /** The window rules and the joint caps (the rules that depend on other entries) for v at week w. */
  private valid(v: number, w: number, spanMax: number[], minStress: number[]): boolean {
    const ctx = this.ctx;
    const week = w - this.first;
    const blocked = this.blocked;
    for (let r = 0; r < blocked.length; r++) {
      const b = blocked[r]!;
      if (b.counts[week * b.items + b.itemOf[v]!] !== 0) return false;
    }
    const cap = this.cap;
    for (let t = ctx.stressStart[v]!; t < ctx.stressStart[v + 1]!; t++) {
      const k = ctx.stressJoint[t]!;
      if (spanMax[k]! + ctx.stressValue[t]! - minStress[k]! > cap[k]! + EPS) return false;
    }
    return true;
  }

  /** The lifts a pick in cell c may have under the lift-balance goal (all when it is off). */
  private liftsAllowed(c: Cell): number {
    const view = this.balanceOn ? this.balance[c.slot] : null;
    return view ? balancedLifts(view, c.w, 7) : 7;
  }

  /** For every family, the last week before w that used it (−Infinity: never), for score(). */
  private lastUses(w: number): void {
    const uses = this.board.familyUses;
    for (let f = 0; f < this.familyLast.length; f++) this.familyLast[f] = lastBefore(uses[f], w) ?? -Infinity;
  }

  /** Sets the parts of the score that are the same for every candidate of cell c (see score()). */
  private scoreCell(c: Cell, before: number, after: number): void {
    const ctx = this.ctx;
    const p = this.input;
    p.comfortRatio = ctx.comfortRatio;
    p.fairShare = this.fairShare[c.slot]!;
    p.taper = c.taper;
    p.eligibleMean = this.eligibleMean[c.slot]!;
    p.surplus = this.surplus[c.slot]!;
    p.emphasisBefore = before < 0 ? -1 : ctx.emphasis[before]!;
    p.emphasisAfter = after < 0 ? -1 : ctx.emphasis[after]!;
    p.barBefore = before < 0 ? -1 : ctx.bar[before]!;
    p.barAfter = after < 0 ? -1 : ctx.bar[after]!;
  }

  /**
   * Soft-goal score of a valid candidate (higher is better), after scoreCell() for its cell; leaves its
   * recency in familyGap/variantGap.
   */
  private score(c: Cell, i: number, spanMax: number[], minStress: number[], terms?: Float64Array): number {
    const ctx = this.ctx;
    const v = c.domain[i]!;
    const p = this.input;
    const lastVariant = lastBefore(this.board.variantUses[v], c.w);
    this.familyGap = c.w - this.familyLast[ctx.family[v]!]!;
    this.variantGap = lastVariant === undefined ? Infinity : c.w - lastVariant;
    let ratio = 0;
    for (let t = ctx.stressStart[v]!; t < ctx.stressStart[v + 1]!; t++) {
      const k = ctx.stressJoint[t]!;
      const b = ctx.budget[k]!;
      if (b > 0) ratio = Math.max(ratio, (spanMax[k]! + ctx.stressValue[t]! - minStress[k]!) / b);
    }
    p.familyGap = this.familyGap;
    p.variantGap = this.variantGap;
    p.loadRatio = ratio;
    p.familyPicks = this.familyPicks[c.slot * ctx.familyNames.length + ctx.family[v]!]!;
    p.specificity = ctx.specificity[v]!;
    p.emphasis = ctx.emphasis[v]!;
    p.bar = ctx.bar[v]!;
    p.noise = c.noise[i]!;
    return preference(p, terms);
  }

  private apply(c: Cell, v: number, sign: 1 | -1, minStress: number[]): void {
    const ctx = this.ctx;
    this.board.add(c.w, v, c.slot, sign);
    for (const b of this.blocked) this.block(b, b.itemOf[v]!, c.w, sign);
    const i = c.w - this.board.first;
    for (const k of ctx.budgeted) this.boundLoad[k]![i]! += sign * (ctx.stress[v * JOINT_COUNT + k]! - minStress[k]!);
    this.familyPicks[c.slot * ctx.familyNames.length + ctx.family[v]!]! += sign;
    if (!c.taper) this.surplus[c.slot]! += sign * (ctx.specificity[v]! - this.eligibleMean[c.slot]!);
  }

  /** Whether cell c still has a valid candidate. */
  private alive(c: Cell): boolean {
    const spanMax = this.aliveBuffer;
    this.spanMaxes(this.boundLoad, c.w, spanMax);
    const minStress = this.useMinStress ? c.minStress : NO_STRESS;
    const lifts = this.liftsAllowed(c);
    if (lifts === 0) return false;
    const domain = c.domain;
    for (let i = 0; i < domain.length; i++) {
      this.work++;
      const v = domain[i]!;
      if (this.ctx.liftBit[v]! & lifts && this.valid(v, c.w, spanMax, minStress)) return true;
    }
    return false;
  }

  /** Number of open cells near cell k left without a candidate (complete mode stops at the first). */
  private forward(k: number): number {
    const w = this.cells[this.order[k]!]!.w;
    let dead = 0;
    for (let q = k + 1; q < this.order.length; q++) {
      const c = this.cells[this.order[q]!]!;
      if (c.w - w >= this.horizon || w - c.w >= this.horizon) continue;
      if (!this.alive(c)) {
        this.wipe[this.order[q]!]!++;
        dead++;
        if (!this.partial) return dead;
      }
    }
    return dead;
  }

  private rec(k: number): boolean {
    if (k === this.order.length) {
      this.record();
      return !this.partial || this.empties === 0;
    }
    if (this.work > this.limit) {
      this.aborted = true;
      return false;
    }
    const cellIndex = this.order[k]!;
    const c = this.cells[cellIndex]!;
    const spanMax = this.spanBuffers[k]!;
    this.spanMaxes(this.boundLoad, c.w, spanMax);
    const minStress = this.useMinStress ? c.minStress : NO_STRESS;
    this.lastUses(c.w);
    const before = this.board.at(c.w - 1, c.slot) ?? -1;
    const after = this.board.at(c.w + 1, c.slot) ?? -1;
    const lifts = this.liftsAllowed(c);
    this.scoreCell(c, before, after);
    const domain = c.domain;
    const buffer = nodeBuffer(k, domain.length);
    let count = 0;
    let mostFamilyGap = -1;
    for (let i = 0; i < domain.length; i++) {
      const v = domain[i]!;
      if (!(this.ctx.liftBit[v]! & lifts) || !this.valid(v, c.w, spanMax, minStress)) continue;
      buffer.score[count] = this.score(c, i, spanMax, minStress);
      buffer.index[count] = i;
      buffer.familyGap[count] = this.familyGap;
      buffer.variantGap[count] = this.variantGap;
      if (this.familyGap > mostFamilyGap) mostFamilyGap = this.familyGap;
      count++;
    }
    this.work += domain.length;
    const scores = buffer.score;
    // Without a complete plan, picks that leave a nearby cell with nothing are tried last: first every
    // candidate that costs no other cell (best score first), then the deferred ones in score order.
    const deadBefore = this.partial ? this.forward(k) : 0;
    const deferred: number[] = [];
    let late = -1;
    for (;;) {
      let bestIndex = -1;
      let second = -1;
      if (late < 0) {
        let bestScore = -Infinity;
        let secondScore = -Infinity;
        for (let j = 0; j < count; j++) {
          const s = scores[j]!;
          if (s > bestScore) {
            secondScore = bestScore;
            second = bestIndex;
            bestScore = s;
            bestIndex = j;
          } else if (s > secondScore) {
            secondScore = s;
            second = j;
          }
        }
        if (bestIndex >= 0) scores[bestIndex] = -Infinity;
        else late = 0;
      }
      if (late >= 0) {
        if (late >= deferred.length) break;
        bestIndex = deferred[late++]!;
        second = -1;
      }
      const i = buffer.index[bestIndex]!;
      const v = domain[i]!;
      const pick = this.describePick(c, i, second >= 0 ? buffer.index[second]! : -1, spanMax, minStress);
      pick.familyGap = buffer.familyGap[bestIndex]!;
      pick.variantGap = buffer.variantGap[bestIndex]!;
      pick.leastRecentFamily = buffer.familyGap[bestIndex]! >= mostFamilyGap;
      pick.candidates = count;
      this.apply(c, v, 1, minStress);
      this.assign[cellIndex] = v;
      this.picks[cellIndex] = pick;
      const dead = this.forward(k);
      if (this.partial && late < 0 && dead > deadBefore) deferred.push(bestIndex);
      else if (this.partial ? this.empties + dead < this.bestEmpties : dead === 0) {
        if (this.rec(k + 1)) return true;
      }
      this.apply(c, v, -1, minStress);
      this.assign[cellIndex] = -1;
      this.picks[cellIndex] = undefined;
      if (this.aborted) return false;
    }
    if (this.partial && this.empties + 1 < this.bestEmpties) {
      this.empties++;
      const done = this.rec(k + 1);
      this.empties--;
      if (done) return true;
    }
    return false;
  }

  /** Which goal made domain entry i beat domain entry `other` (−1: there was no other candidate). */
  private describePick(c: Cell, i: number, other: number, spanMax: number[], minStress: number[]): Pick {
    const pick: Pick = {
      familyGap: 0,
      leastRecentFamily: false,
      variantGap: 0,
      decided: null,
      runnerUp: -1,
      candidates: 0,
    };
    if (other < 0) return pick;
    this.score(c, i, spanMax, minStress, this.terms);
    this.score(c, other, spanMax, minStress, this.otherTerms);
    pick.decided = decidingTerm(this.terms, this.otherTerms);
    pick.runnerUp = c.domain[other]!;
    return pick;
  }

  /** Puts a pick on the board for good (after the runs), keeping the search's counts in step. */
  commit(c: Cell, v: number): void {
    this.cap = this.fullCaps;
    this.apply(c, v, 1, NO_STRESS);
    const i = this.openAt.get(c.w * CELL_KEY + c.slot);
    if (i !== undefined) this.assign[i] = v;
  }

  /** The best valid candidate for a cell against the committed board, or null. */
  bestNow(c: Cell): { v: number; pick: Pick } | null {
    this.cap = this.fullCaps;
    this.balanceOn = false;
    const spanMax = zeros(JOINT_COUNT);
    this.spanMaxes(this.board.load, c.w, spanMax);
    this.lastUses(c.w);
    const before = this.board.at(c.w - 1, c.slot) ?? -1;
    const after = this.board.at(c.w + 1, c.slot) ?? -1;
    this.scoreCell(c, before, after);
    let best: { v: number; pick: Pick; s: number } | null = null;
    for (let i = 0; i < c.domain.length; i++) {
      const v = c.domain[i]!;
      if (!this.valid(v, c.w, spanMax, NO_STRESS)) continue;
      const s = this.score(c, i, spanMax, NO_STRESS);
      if (!best || s > best.s) {
        const pick: Pick = {
          familyGap: this.familyGap,
          leastRecentFamily: false,
          variantGap: this.variantGap,
          decided: null,
          runnerUp: -1,
          candidates: 0,
        };
        best = { v, pick, s };
      }
    }
    return best;
  }

  private record(): void {
    if (this.partial && this.empties >= this.bestEmpties) return;
    this.bestEmpties = this.empties;
    this.best = {
      assign: this.assign.slice(),
      picks: this.picks.slice(),
      peak: this.peakNow(),
      empties: this.empties + this.cellCount - this.order.length,
    };
  }

  /** Peak load ratio of the board as it stands, over the spans that overlap the planned weeks. */
  peakNow(): number {
    return peakOf(this.ctx, this.board, this.first, this.last);
  }

  /** The best peak any complete plan could reach: fixed load plus each open cell's least stress. */
  lowerBound(order: number[]): number {
    this.order = order;
    this.resetBound(true);
    let peak = 0;
    const span = this.ctx.jointWindow;
    for (const k of this.ctx.budgeted) {
      for (let start = this.first - span + 1; start <= this.last; start++) {
        let s = 0;
        for (let x = start; x < start + span; x++) s += this.boundAt(k, x);
        peak = Math.max(peak, ratioOf(s, this.ctx.budget[k]!));
      }
    }
    return peak;
  }

  private boundAt(k: number, x: number): number {
    const a = this.boundLoad[k]!;
    const i = x - this.board.first;
    return i >= 0 && i < a.length ? a[i]! : 0;
  }

  private resetBound(withMinStress: boolean): void {
    for (const k of this.ctx.budgeted) {
      const to = this.boundLoad[k]!;
      const from = this.board.load[k]!;
      for (let i = 0; i < from.length; i++) to[i] = from[i]!;
      if (!withMinStress) continue;
      for (const i of this.order) to[this.cells[i]!.w - this.board.first]! += this.cells[i]!.minStress[k]!;
    }
  }

  /**
   * One bounded search over the cells in `order` (the others stay empty), within the joint caps `cap`
   * and, with `balance`, the lift-balance goal. The board is left as it was (fixed entries only);
   * `aborted` tells whether the effort ran out.
   */
  run(cap: number[], balance: boolean, partial: boolean, limit: number, order = this.searchOrder): boolean {
    this.order = order;
    this.cap = cap;
    this.balanceOn = balance;
    this.partial = partial;
    this.useMinStress = !partial;
    this.aborted = false;
    this.empties = 0;
    this.bestEmpties = partial ? Infinity : 0;
    this.limit = this.work + limit;
    this.resetBound(this.useMinStress);
    const before = this.best;
    if (!partial) this.best = null;
    // Forward checking keeps every open cell alive from here on; start from a state where they all are.
    const dead = partial ? undefined : this.order.find((i) => !this.alive(this.cells[i]!));
    if (dead !== undefined) this.wipe[dead]! += this.cellCount;
    const started = this.work;
    const found = dead === undefined && this.rec(0);
    this.lastRunWork = this.work - started;
    for (let k = 0; k < this.cellCount; k++) {
      const v = this.assign[k]!;
      const c = this.cells[k]!;
      if (v >= 0) this.apply(c, v, -1, this.useMinStress ? c.minStress : NO_STRESS);
      this.assign[k] = -1;
      this.picks[k] = undefined;
    }
    this.balanceOn = false;
    const got = this.best !== null && (partial || found);
    if (!got) this.best = before;
    return got;
  }
}

interface NodeBuffer {
  index: Int32Array;
  score: Float64Array;
  familyGap: Float64Array;
  variantGap: Float64Array;
}
/** Candidate scratch per search depth, shared by all searches (they run one at a time, to the end). */
const NODE_BUFFERS: NodeBuffer[] = [];
function nodeBuffer(depth: number, n: number): NodeBuffer {
  let b = NODE_BUFFERS[depth];
  if (!b || b.index.length < n) {
    const size = Math.max(n, 64);
    b = {
      index: new Int32Array(size),
      score: new Float64Array(size),
      familyGap: new Float64Array(size),
      variantGap: new Float64Array(size),
    };
    NODE_BUFFERS[depth] = b;
  }
  return b;
}

/** Plain arrays: per athlete the engine allocates many small ones, and typed arrays cost more to make. */
function zeros(n: number): number[] {
  return new Array<number>(n).fill(0);
}

/** n values in [0, 1): one draw from the athlete's seeded stream, spread by an integer mix per item. */
function noise(rng: () => number, n: number): number[] {
  const out = zeros(n);
  let h = Math.floor(rng() * 4294967296) >>> 0;
  for (let i = 0; i < n; i++) {
    h = (h + 0x9e3779b9) >>> 0;
    let t = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
    t = Math.imul(t ^ (t >>> 13), 0xc2b2ae35);
    out[i] = ((t ^ (t >>> 16)) >>> 0) / 4294967296;
  }
  return out;
}

export function ratioOf(load: number, budget: number): number {
  if (budget > 0) return load / budget;
  return load > EPS ? Infinity : 0;
}

export function peakOf(ctx: Ctx, board: Board, first: number, last: number): number {
  let peak = 0;
  for (const k of ctx.budgeted) {
    for (let start = first - ctx.jointWindow + 1; start <= last; start++) {
      peak = Math.max(peak, ratioOf(board.spanLoad(k, start), ctx.budget[k]!));
    }
  }
  return peak;
}

/**
 * Plans the open cells. In order: a complete plan under the comfort line with lift balance; under the
 * comfort line without it; within the budgets with lift balance; within the budgets (else one for as
 * many cells as the search can manage). Above the comfort line, tighter peaks follow (first straight at
 * the comfort line or the lower bound, then by bisection) while effort lasts.
 */
export function solve(search: Search, ctx: Ctx): { solution: Solution | null; kept: GoalsKept } {
  const full = budgetCaps(ctx, 1);
  const size = search.cells.reduce((n, c) => n + c.domain.length, 0);
  const complete = Math.min(EFFORT.complete, Math.max(EFFORT.completeMin, 40 * size));
  const balance = search.hasBalance;
  const comfortCaps = budgetCaps(ctx, ctx.comfortRatio);
  const bound = search.lowerBound(search.searchOrder);
  const comfortPossible = bound <= ctx.comfortRatio + EPS;
  if (comfortPossible) {
    if (balance && search.run(comfortCaps, true, false, complete))
      return { solution: search.best, kept: { comfort: true, balance: true } };
    if (search.run(comfortCaps, false, false, complete))
      return { solution: search.best, kept: { comfort: true, balance: false } };
  }
  const floor = comfortPossible ? ctx.comfortRatio : bound;
  if (balance && search.run(full, true, false, complete)) {
    tighten(search, ctx, floor, true, search.searchOrder);
    return { solution: search.best, kept: { comfort: false, balance: true } };
  }
  // Without a complete plan, give up the cell the search most often found stuck and try again, so
  // the cells that can be filled together still get a complete, tightened plan.
  let order = search.searchOrder;
  const stopDropping = search.work + EFFORT.dropRounds * complete;
  while (!search.run(full, false, false, Math.min(complete, Math.max(1, stopDropping - search.work)), order)) {
    if (order.length <= 1 || search.work >= stopDropping) {
      search.run(full, false, true, Math.min(EFFORT.partial, Math.max(EFFORT.partialMin, 2 * size)));
      return { solution: search.best, kept: { comfort: false, balance: false } };
    }
    const worst = order.reduce((a, b) => (search.wipe[b]! > search.wipe[a]! ? b : a));
    order = order.filter((i) => i !== worst);
  }
  const dive = search.lastRunWork;
  // A cell given up early may fit after all once others went: try each back in, keeping what works.
  const inOrder = new Set(order);
  for (const i of search.searchOrder) {
    if (inOrder.has(i) || search.work >= stopDropping + complete) continue;
    const wider = search.searchOrder.filter((q) => inOrder.has(q) || q === i);
    if (search.run(full, false, false, Math.max(EFFORT.completeMin, complete >> 2), wider)) {
      inOrder.add(i);
      order = wider;
    }
  }
  tighten(search, ctx, Math.max(floor, search.lowerBound(order)), false, order, dive);
  return { solution: search.best, kept: { comfort: false, balance: false } };
}

/**
 * Above the comfort line, lower peaks: feasibility only gets easier as the caps rise, so bisect on the
 * cap between `floor` and the best peak found; a run that gives up counts as infeasible. Runs get a
 * small effort bound, as most of a failing run's effort would go into proving infeasibility.
 */
function tighten(
  search: Search,
  ctx: Ctx,
  floor: number,
  balance: boolean,
  order: number[],
  dive = search.lastRunWork,
): void {
  let infeasibleAt = floor;
  const each = Math.min(EFFORT.tighten, Math.max(EFFORT.tightenMin, EFFORT.tightenPerDive * dive));
  const stop = search.work + Math.max(EFFORT.tightenFloor, EFFORT.tightenTotalPerDive * dive);
  for (let t = 0; t < EFFORT.tightenTries && search.work < stop; t++) {
    const bestPeak = search.best!.peak;
    if (
      !Number.isFinite(bestPeak) ||
      bestPeak <= infeasibleAt + 1e-9 ||
      bestPeak - infeasibleAt <= EFFORT.resolution * bestPeak
    )
      break;
    const mid = t === 0 ? infeasibleAt : (infeasibleAt + bestPeak) / 2;
    if (!search.run(budgetCaps(ctx, mid), balance, false, Math.min(each, stop - search.work), order))
      infeasibleAt = mid;
  }
}
