// The per-athlete planner: depth-first search over the open cells (tightest first, then week order)
// with forward checking and a joint-load lower bound, first for a complete rule-clean plan, then for
// lower peak load ratios.

import { EPS, NJ, type Ath, type Board, type Ctx, lastBefore, taperAt } from './core';

/** Recency counts up to half a year; older or never used rank alike (then noise and variety decide). */
const GAP_CAP = 26;
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
  dom: number[]; // variants the static rules and the fixed entries allow
  jit: number[]; // seeded noise per domain variant, for ties and reshuffles
  minS: number[]; // per joint, the least stress any domain variant adds
  taper: boolean;
}

export interface Pick {
  famGap: number; // weeks since the family was last used before this week (Infinity: never)
  leastFam: boolean; // no valid candidate's family was less recently used
  varGap: number;
  leastVar: boolean;
}

export interface Solution {
  assign: number[]; // variant per cell, −1 when empty
  picks: (Pick | undefined)[];
  peak: number;
  empties: number;
}

const ZERO = zeros(NJ);

/** Variety bonus: full when two tags differ, half when either is unknown (−1), none when equal. */
function differs(a: number, b: number, full: number): number {
  if (a < 0 || b < 0) return full / 2;
  return a === b ? 0 : full;
}

export class Search {
  private readonly n: number;
  private readonly lb: number[][];
  private cap: number[];
  private readonly full: number[];
  private useMin = true;
  private partial = false;
  private limit = 0;
  aborted = false;
  private order: number[] = [];
  /** Per cell, how often the search found it left with nothing: the first to give up when stuck. */
  readonly wipe: number[];
  private readonly famLast: number[];
  work = 0;
  private empties = 0;
  private bestEmpties = Infinity;
  private readonly assign: number[];
  private readonly picks: (Pick | undefined)[];
  private readonly mBuf: number[][];
  private readonly fBuf = zeros(NJ);
  best: Solution | null = null;
  private readonly vBlock: number[];
  private readonly fBlock: number[];
  private famGap = 0;
  private varGap = 0;

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
    this.lb = board.load.map((a) => zeros(a.length));
    this.full = this.budgetCaps(1, false);
    this.cap = this.full;
    const weeks = open.length ? last - first + 1 : 0;
    this.vBlock = zeros(weeks * ctx.variants.length);
    this.fBlock = zeros(weeks * ctx.famNames.length);
    board.vUses.forEach((uses, v) => {
      for (const u of uses) this.block(this.vBlock, ctx.variants.length, v, u, ctx.R, 1);
    });
    board.fUses.forEach((uses, f) => {
      for (const u of uses) this.block(this.fBlock, ctx.famNames.length, f, u, ctx.F, 1);
    });
    this.cells = this.domains(open, rng);
    this.n = this.cells.length;
    this.assign = zeros(this.n).fill(-1);
    this.picks = new Array<Pick | undefined>(this.n);
    this.mBuf = this.cells.map(() => zeros(NJ));
    this.wipe = zeros(this.n);
    this.famLast = zeros(ctx.famNames.length);
    // Cells with few candidates first (tightest first), so that a corner is found before effort goes
    // into the weeks around it; the rest in week order, which suits the recency and variety goals.
    const tight = 2 * Math.max(ctx.R, ctx.F, 1);
    const rank = (c: Cell) => (c.dom.length <= tight ? c.dom.length : Infinity);
    this.searchOrder = this.cells.map((_, i) => i).sort((a, b) => rank(this.cells[a]!) - rank(this.cells[b]!) || a - b);
  }

  private domains(open: OpenCell[], rng: () => number): Cell[] {
    const ctx = this.ctx;
    const cells: Cell[] = [];
    const m = zeros(NJ);
    for (const o of open) {
      const taper = taperAt(ctx, this.ath, o.w);
      const maxRisk = taper ? taper.maxRisk : Infinity;
      const minSpec = taper ? taper.minSpec - EPS : -Infinity;
      this.spanMaxes(this.board.load, o.w, m);
      const list = ctx.bySlot[o.slot]!;
      const block = this.ath.block;
      const dom = zeros(list.length);
      let n = 0;
      // The slot's list already matches its lifts; the rest of the static rules, then the fixed entries.
      for (let i = 0; i < list.length; i++) {
        const v = list[i]!;
        if (block[v] !== 0 || ctx.risk[v]! > maxRisk || ctx.spec[v]! < minSpec) continue;
        if (this.valid(v, o.w, m, ZERO)) dom[n++] = v;
      }
      if (n === 0) continue;
      const minS = zeros(NJ);
      for (const k of ctx.budgeted) {
        let mk = Infinity;
        for (let i = 0; i < n && mk > 0; i++) mk = Math.min(mk, ctx.stress[dom[i]! * NJ + k]!);
        minS[k] = mk;
      }
      cells.push({
        at: o.at,
        w: o.w,
        week: o.week,
        slot: o.slot,
        slotId: o.slotId,
        dom: dom.slice(0, n),
        jit: noise(rng, n),
        minS,
        taper: taper !== null,
      });
    }
    return cells;
  }

  /** Counts, per planned week, the entries that keep item i (a variant or a family) out of it. */
  private block(arr: number[], stride: number, i: number, u: number, window: number, sign: 1 | -1): void {
    const from = Math.max(this.first, u - window + 1);
    const to = Math.min(this.last, u + window - 1);
    for (let x = from; x <= to; x++) arr[(x - this.first) * stride + i]! += sign;
  }

  /** Per-joint caps at ratio t of the budget; `strict` asks for loads below t × budget. */
  budgetCaps(t: number, strict: boolean): number[] {
    const cap = zeros(NJ).fill(Infinity);
    for (const k of this.ctx.budgeted) {
      const b = this.ctx.budget[k]!;
      cap[k] = b === 0 ? 0 : Math.min(b, Math.max(0, t * b - (strict ? 1e-7 : 0)));
    }
    return cap;
  }

  /** Largest summed stress of the spans holding week w, per budgeted joint, from array set `arr`. */
  private spanMaxes(arr: number[][], w: number, out: number[]): void {
    const J = this.ctx.J;
    const lo = this.board.lo;
    for (const k of this.ctx.budgeted) {
      const a = arr[k]!;
      // Week w − J + 1 … w + J − 1 as indexes into a; outside the array the load is 0.
      const from = w - J + 1 - lo;
      let s = 0;
      for (let i = from; i < from + J; i++) if (i >= 0 && i < a.length) s += a[i]!;
      let best = s;
      for (let i = from + 1; i <= w - lo; i++) {
        const add = i + J - 1;
        if (add >= 0 && add < a.length) s += a[add]!;
        if (i - 1 >= 0 && i - 1 < a.length) s -= a[i - 1]!;
        if (s > best) best = s;
      }
      out[k] = best;
    }
  }

  /** The hard rules that depend on other entries, for variant v in a cell at week w. */
  private valid(v: number, w: number, m: number[], mn: number[]): boolean {
    const ctx = this.ctx;
    if (this.vBlock[(w - this.first) * ctx.variants.length + v] !== 0) return false;
    if (this.fBlock[(w - this.first) * ctx.famNames.length + ctx.fam[v]!] !== 0) return false;
    const cap = this.cap;
    for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
      const k = ctx.sJ[t]!;
      if (m[k]! + ctx.sV[t]! - mn[k]! > cap[k]! + EPS) return false;
    }
    return true;
  }

  /** For every family, the last week before w that used it (−Infinity: never), for score(). */
  private lastUses(w: number): void {
    const fu = this.board.fUses;
    for (let f = 0; f < this.famLast.length; f++) this.famLast[f] = lastBefore(fu[f], w) ?? -Infinity;
  }

  /** Soft-goal score of a valid candidate (higher is better); leaves its recency in famGap/varGap. */
  private score(c: Cell, i: number, m: number[], mn: number[], prev: number, next: number): number {
    const ctx = this.ctx;
    const v = c.dom[i]!;
    const lf = this.famLast[ctx.fam[v]!]!;
    const lv = lastBefore(this.board.vUses[v], c.w);
    this.famGap = c.w - lf;
    this.varGap = lv === undefined ? Infinity : c.w - lv;
    let s = 2 * Math.min(this.famGap, GAP_CAP + 1) + Math.min(this.varGap, GAP_CAP + 1);
    if (c.taper) s += 8 * ctx.spec[v]!;
    const e = ctx.emph[v]!;
    const b = ctx.bar[v]!;
    s += differs(e, prev < 0 ? -1 : ctx.emph[prev]!, 3) + differs(e, next < 0 ? -1 : ctx.emph[next]!, 1.5);
    s += differs(b, prev < 0 ? -1 : ctx.bar[prev]!, 1.5) + differs(b, next < 0 ? -1 : ctx.bar[next]!, 0.75);
    let ratio = 0;
    for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
      const k = ctx.sJ[t]!;
      const b = ctx.budget[k]!;
      if (b > 0) ratio = Math.max(ratio, (m[k]! + ctx.sV[t]! - mn[k]!) / b);
    }
    return s - 3 * ratio + 3 * c.jit[i]!;
  }

  private apply(c: Cell, v: number, sign: 1 | -1, mn: number[]): void {
    this.board.add(c.w, v, c.slot, sign);
    this.block(this.vBlock, this.ctx.variants.length, v, c.w, this.ctx.R, sign);
    this.block(this.fBlock, this.ctx.famNames.length, this.ctx.fam[v]!, c.w, this.ctx.F, sign);
    const i = c.w - this.board.lo;
    for (const k of this.ctx.budgeted) {
      this.lb[k]![i]! += sign * (this.ctx.stress[v * NJ + k]! - mn[k]!);
    }
  }

  /** Whether cell c still has a valid candidate. */
  private alive(c: Cell): boolean {
    const m = this.fBuf;
    this.spanMaxes(this.lb, c.w, m);
    const mn = this.useMin ? c.minS : ZERO;
    const dom = c.dom;
    for (let i = 0; i < dom.length; i++) {
      this.work++;
      if (this.valid(dom[i]!, c.w, m, mn)) return true;
    }
    return false;
  }

  /** Number of open cells near cell k left without a candidate (complete mode stops at the first). */
  private forward(k: number): number {
    const w = this.cells[this.order[k]!]!.w;
    const H = Math.max(this.ctx.R, this.ctx.F, this.ctx.J);
    let dead = 0;
    for (let q = k + 1; q < this.order.length; q++) {
      const c = this.cells[this.order[q]!]!;
      if (c.w - w >= H || w - c.w >= H) continue;
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
    const ci = this.order[k]!;
    const c = this.cells[ci]!;
    const m = this.mBuf[k]!;
    this.spanMaxes(this.lb, c.w, m);
    const mn = this.useMin ? c.minS : ZERO;
    this.lastUses(c.w);
    const prev = this.board.at(c.w - 1, c.slot) ?? -1;
    const next = this.board.at(c.w + 1, c.slot) ?? -1;
    const dom = c.dom;
    const nb = nodeBuf(k, dom.length);
    let cnt = 0;
    let maxFam = -1;
    let maxVar = -1;
    for (let i = 0; i < dom.length; i++) {
      if (!this.valid(dom[i]!, c.w, m, mn)) continue;
      nb.score[cnt] = this.score(c, i, m, mn, prev, next);
      nb.cand[cnt] = dom[i]!;
      nb.fam[cnt] = this.famGap;
      nb.vari[cnt] = this.varGap;
      if (this.famGap > maxFam) maxFam = this.famGap;
      if (this.varGap > maxVar) maxVar = this.varGap;
      cnt++;
    }
    this.work += dom.length;
    const sc = nb.score;
    // Without a complete plan, picks that leave a nearby cell with nothing are tried last: first every
    // candidate that costs no other cell (best score first), then the deferred ones in score order.
    const deadBefore = this.partial ? this.forward(k) : 0;
    const deferred: number[] = [];
    let late = -1;
    for (;;) {
      let bi = -1;
      if (late < 0) {
        let bs = -Infinity;
        for (let j = 0; j < cnt; j++) {
          if (sc[j]! > bs) {
            bs = sc[j]!;
            bi = j;
          }
        }
        if (bi >= 0) sc[bi] = -Infinity;
        else late = 0;
      }
      if (late >= 0) {
        if (late >= deferred.length) break;
        bi = deferred[late++]!;
      }
      const v = nb.cand[bi]!;
      const p: Pick = {
        famGap: nb.fam[bi]!,
        leastFam: nb.fam[bi]! >= maxFam,
        varGap: nb.vari[bi]!,
        leastVar: nb.vari[bi]! >= maxVar,
      };
      this.apply(c, v, 1, mn);
      this.assign[ci] = v;
      this.picks[ci] = p;
      const dead = this.forward(k);
      if (this.partial && late < 0 && dead > deadBefore) deferred.push(bi);
      else if (this.partial ? this.empties + dead < this.bestEmpties : dead === 0) {
        if (this.rec(k + 1)) return true;
      }
      this.apply(c, v, -1, mn);
      this.assign[ci] = -1;
      this.picks[ci] = undefined;
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

  /** Puts a pick on the board for good (after the runs), keeping the search's counts in step. */
  commit(c: Cell, v: number): void {
    this.cap = this.full;
    this.apply(c, v, 1, ZERO);
  }

  /** The best valid candidate for a cell against the committed board, or null. */
  bestNow(c: Cell): { v: number; pick: Pick } | null {
    this.cap = this.full;
    const m = zeros(NJ);
    this.spanMaxes(this.board.load, c.w, m);
    this.lastUses(c.w);
    const prev = this.board.at(c.w - 1, c.slot) ?? -1;
    const next = this.board.at(c.w + 1, c.slot) ?? -1;
    let best: { v: number; pick: Pick; s: number } | null = null;
    for (let i = 0; i < c.dom.length; i++) {
      const v = c.dom[i]!;
      if (!this.valid(v, c.w, m, ZERO)) continue;
      const s = this.score(c, i, m, ZERO, prev, next);
      if (!best || s > best.s)
        best = { v, pick: { famGap: this.famGap, leastFam: false, varGap: this.varGap, leastVar: false }, s };
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
      empties: this.empties + this.n - this.order.length,
    };
  }

  /** Peak load ratio of the board as it stands, over the spans that overlap the planned weeks. */
  peakNow(): number {
    return peakOf(this.ctx, this.board, this.first, this.last);
  }

  /** The best peak any complete plan could reach: fixed load plus each open cell's least stress. */
  lowerBound(order: number[]): number {
    this.order = order;
    this.resetLb(true);
    let peak = 0;
    for (const k of this.ctx.budgeted) {
      for (let st = this.first - this.ctx.J + 1; st <= this.last; st++) {
        let s = 0;
        for (let x = st; x < st + this.ctx.J; x++) s += this.lbAt(k, x);
        peak = Math.max(peak, ratioOf(s, this.ctx.budget[k]!));
      }
    }
    return peak;
  }

  private lbAt(k: number, x: number): number {
    const a = this.lb[k]!;
    const i = x - this.board.lo;
    return i >= 0 && i < a.length ? a[i]! : 0;
  }

  private resetLb(withMin: boolean): void {
    for (const k of this.ctx.budgeted) {
      const to = this.lb[k]!;
      const from = this.board.load[k]!;
      for (let i = 0; i < from.length; i++) to[i] = from[i]!;
      if (!withMin) continue;
      for (const i of this.order) this.lb[k]![this.cells[i]!.w - this.board.lo]! += this.cells[i]!.minS[k]!;
    }
  }

  /**
   * One bounded search over the cells in `order` (the others stay empty). The board is left as it
   * was (fixed entries only); `aborted` tells whether the effort ran out.
   */
  run(cap: number[], partial: boolean, limit: number, order = this.searchOrder): boolean {
    this.order = order;
    this.cap = cap;
    this.partial = partial;
    this.useMin = !partial;
    this.aborted = false;
    this.empties = 0;
    this.bestEmpties = partial ? Infinity : 0;
    this.limit = this.work + limit;
    this.resetLb(this.useMin);
    const before = this.best;
    if (!partial) this.best = null;
    // Forward checking keeps every open cell alive from here on; start from a state where they all are.
    const dead = partial ? undefined : this.order.find((i) => !this.alive(this.cells[i]!));
    if (dead !== undefined) this.wipe[dead]! += this.n;
    const found = dead === undefined && this.rec(0);
    const mn = (c: Cell) => (this.useMin ? c.minS : ZERO);
    for (let k = 0; k < this.n; k++) {
      const v = this.assign[k]!;
      if (v >= 0) this.apply(this.cells[k]!, v, -1, mn(this.cells[k]!));
      this.assign[k] = -1;
      this.picks[k] = undefined;
    }
    const got = this.best !== null && (partial || found);
    if (!got) this.best = before;
    return got;
  }
}

interface NodeBuf {
  cand: Int32Array;
  score: Float64Array;
  fam: Float64Array;
  vari: Float64Array;
}
/** Candidate scratch per search depth, shared by all searches (they run one at a time, to the end). */
const NODE_BUFS: NodeBuf[] = [];
function nodeBuf(depth: number, n: number): NodeBuf {
  let b = NODE_BUFS[depth];
  if (!b || b.cand.length < n) {
    const size = Math.max(n, 64);
    b = {
      cand: new Int32Array(size),
      score: new Float64Array(size),
      fam: new Float64Array(size),
      vari: new Float64Array(size),
    };
    NODE_BUFS[depth] = b;
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
    for (let st = first - ctx.J + 1; st <= last; st++) {
      peak = Math.max(peak, ratioOf(board.spanLoad(k, st), ctx.budget[k]!));
    }
  }
  return peak;
}

/**
 * Plans the open cells: a complete plan within the budgets if the search finds one (else one for as
 * many cells as it can manage), then tighter peaks (first straight at the lower bound, then by
 * bisection) while effort lasts.
 */
export function solve(search: Search): Solution | null {
  const full = search.budgetCaps(1, false);
  const size = search.cells.reduce((n, c) => n + c.dom.length, 0);
  const complete = Math.min(EFFORT.complete, Math.max(EFFORT.completeMin, 40 * size));
  // Without a complete plan, give up the cell the search most often found stuck and try again, so
  // the cells that can be filled together still get a complete, tightened plan.
  let order = search.searchOrder;
  const stopDropping = search.work + EFFORT.dropRounds * complete;
  let before = search.work;
  while (!search.run(full, false, Math.min(complete, Math.max(1, stopDropping - search.work)), order)) {
    before = search.work;
    if (order.length <= 1 || search.work >= stopDropping) {
      search.run(full, true, Math.min(EFFORT.partial, Math.max(EFFORT.partialMin, 2 * size)));
      return search.best;
    }
    const worst = order.reduce((a, b) => (search.wipe[b]! > search.wipe[a]! ? b : a));
    order = order.filter((i) => i !== worst);
  }
  const dive = search.work - before;
  // A cell given up early may fit after all once others went: try each back in, keeping what works.
  const inOrder = new Set(order);
  for (const i of search.searchOrder) {
    if (inOrder.has(i) || search.work >= stopDropping + complete) continue;
    const wider = search.searchOrder.filter((q) => inOrder.has(q) || q === i);
    if (search.run(full, false, Math.max(EFFORT.completeMin, complete >> 2), wider)) {
      inOrder.add(i);
      order = wider;
    }
  }
  // Feasibility only gets easier as the caps rise, so bisect on the cap between the lower bound and
  // the best peak found; a run that gives up counts as infeasible. Failed runs get a small effort
  // bound scaled to the size of one dive, as most of the effort would be spent proving infeasibility.
  let lo = search.lowerBound(order);
  const each = Math.min(EFFORT.tighten, Math.max(EFFORT.tightenMin, EFFORT.tightenPerDive * dive));
  const stop = search.work + Math.max(EFFORT.tightenFloor, EFFORT.tightenTotalPerDive * dive);
  for (let t = 0; t < EFFORT.tightenTries && search.work < stop; t++) {
    const hi = search.best!.peak;
    if (!Number.isFinite(hi) || hi <= lo + 1e-9 || hi - lo <= EFFORT.resolution * hi) break;
    const mid = t === 0 ? lo : (lo + hi) / 2;
    if (!search.run(search.budgetCaps(mid, false), false, Math.min(each, stop - search.work), order)) lo = mid;
  }
  return search.best;
}
