// The per-athlete planner: depth-first search over the open cells in week order, with forward checking
// and a joint-load lower bound, first for a complete rule-clean plan, then for lower peak load ratios.

import { EPS, NJ, type Ath, type Board, type Ctx, lastBefore, staticOk, taperAt } from './core';
import type { Emphasis } from './types';

/** Recency counts up to half a year; older or never used rank alike (then noise and variety decide). */
const GAP_CAP = 26;
/** Effort bounds, in candidate evaluations, per athlete (not per request, so athletes stay independent). */
export const EFFORT = { complete: 300_000, tighten: 40_000, partial: 150_000, total: 600_000, tightenTries: 8 };

export interface Cell {
  at: number; // the caller's index for the cell
  w: number;
  week: string;
  slot: number;
  slotId: string;
  dom: Int32Array; // variants the static rules and the fixed entries allow
  jit: Float64Array; // seeded noise per domain variant, for ties and reshuffles
  minS: Float64Array; // per joint, the least stress any domain variant adds
  taper: boolean;
}

export interface Pick {
  famGap: number; // weeks since the family was last used before this week (Infinity: never)
  leastFam: boolean; // no valid candidate's family was less recently used
  varGap: number;
  leastVar: boolean;
}

export interface Solution {
  assign: Int32Array; // variant per cell, −1 when empty
  picks: (Pick | undefined)[];
  peak: number;
  empties: number;
}

const ZERO = new Float64Array(NJ);

function differs<T>(a: T | undefined, b: T | undefined, full: number): number {
  if (a === undefined || b === undefined) return full / 2;
  return a === b ? 0 : full;
}

export class Search {
  private readonly n: number;
  private readonly lb: Float64Array[];
  private cap: Float64Array;
  private readonly full: Float64Array;
  private useMin = true;
  private partial = false;
  private limit = 0;
  private aborted = false;
  work = 0;
  private empties = 0;
  private bestEmpties = Infinity;
  private readonly assign: Int32Array;
  private readonly picks: (Pick | undefined)[];
  private readonly mBuf: Float64Array[];
  private readonly fBuf = new Float64Array(NJ);
  best: Solution | null = null;

  constructor(
    private readonly ctx: Ctx,
    private readonly ath: Ath,
    private readonly board: Board,
    private readonly cells: Cell[],
    private readonly first: number,
    private readonly last: number,
  ) {
    this.n = cells.length;
    this.lb = board.load.map((a) => new Float64Array(a.length));
    this.full = this.budgetCaps(1, false);
    this.cap = this.full;
    this.assign = new Int32Array(this.n).fill(-1);
    this.picks = new Array<Pick | undefined>(this.n);
    this.mBuf = cells.map(() => new Float64Array(NJ));
  }

  /** Per-joint caps at ratio t of the budget; `strict` asks for loads below t × budget. */
  budgetCaps(t: number, strict: boolean): Float64Array {
    const cap = new Float64Array(NJ).fill(Infinity);
    for (const k of this.ctx.budgeted) {
      const b = this.ctx.budget[k]!;
      cap[k] = b === 0 ? 0 : Math.min(b, Math.max(0, t * b - (strict ? 1e-7 : 0)));
    }
    return cap;
  }

  /** Largest summed stress of the spans holding week w, per budgeted joint, from array set `arr`. */
  private spanMaxes(arr: Float64Array[], w: number, out: Float64Array): void {
    const J = this.ctx.J;
    const lo = this.board.lo;
    for (const k of this.ctx.budgeted) {
      const a = arr[k]!;
      const at = (x: number) => {
        const i = x - lo;
        return i >= 0 && i < a.length ? a[i]! : 0;
      };
      let s = 0;
      for (let x = w - J + 1; x <= w; x++) s += at(x);
      let best = s;
      for (let st = w - J + 2; st <= w; st++) {
        s += at(st + J - 1) - at(st - 1);
        if (s > best) best = s;
      }
      out[k] = best;
    }
  }

  /** The hard rules that depend on other entries, for variant v in a cell at week w. */
  private valid(v: number, w: number, m: Float64Array, mn: Float64Array, cap = this.cap): boolean {
    const ctx = this.ctx;
    const uses = this.board.vUses[v];
    if (uses) for (const u of uses) if (u - w < ctx.R && w - u < ctx.R) return false;
    if (ctx.F > 0) {
      const fu = this.board.fUses[ctx.fam[v]!];
      if (fu) for (const u of fu) if (u - w < ctx.F && w - u < ctx.F) return false;
    }
    for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
      const k = ctx.sJ[t]!;
      if (m[k]! + ctx.sV[t]! - mn[k]! > cap[k]! + EPS) return false;
    }
    return true;
  }

  /** Soft-goal score of a valid candidate (higher is better). */
  private score(c: Cell, i: number, m: Float64Array, mn: Float64Array, pick: Pick, prev: number, next: number): number {
    const ctx = this.ctx;
    const v = c.dom[i]!;
    const x = ctx.variants[v]!;
    const lf = lastBefore(this.board.fUses[ctx.fam[v]!], c.w);
    const lv = lastBefore(this.board.vUses[v], c.w);
    pick.famGap = lf === undefined ? Infinity : c.w - lf;
    pick.varGap = lv === undefined ? Infinity : c.w - lv;
    let s = 2 * Math.min(pick.famGap, GAP_CAP + 1) + Math.min(pick.varGap, GAP_CAP + 1);
    if (c.taper) s += 8 * x.specificity;
    const emph = (u: number): Emphasis | undefined => (u >= 0 ? ctx.variants[u]!.emphasis : undefined);
    const bar = (u: number): string | undefined => (u >= 0 ? ctx.variants[u]!.bar : undefined);
    s += differs(x.emphasis, emph(prev), 3) + differs(x.emphasis, emph(next), 1.5);
    s += differs(x.bar, bar(prev), 1.5) + differs(x.bar, bar(next), 0.75);
    let ratio = 0;
    for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
      const k = ctx.sJ[t]!;
      const b = ctx.budget[k]!;
      if (b > 0) ratio = Math.max(ratio, (m[k]! + ctx.sV[t]! - mn[k]!) / b);
    }
    return s - 3 * ratio + 3 * c.jit[i]!;
  }

  private apply(c: Cell, v: number, sign: 1 | -1, mn: Float64Array): void {
    this.board.add(c.w, v, c.slot, sign);
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
    const w = this.cells[k]!.w;
    const H = Math.max(this.ctx.R, this.ctx.F, this.ctx.J);
    let dead = 0;
    for (let q = k + 1; q < this.n; q++) {
      const c = this.cells[q]!;
      if (c.w - w >= H) break;
      if (!this.alive(c)) {
        dead++;
        if (!this.partial) return dead;
      }
    }
    return dead;
  }

  private rec(k: number): boolean {
    if (k === this.n) {
      this.record();
      return !this.partial || this.empties === 0;
    }
    if (this.work > this.limit) {
      this.aborted = true;
      return false;
    }
    const c = this.cells[k]!;
    const m = this.mBuf[k]!;
    this.spanMaxes(this.lb, c.w, m);
    const mn = this.useMin ? c.minS : ZERO;
    const prev = this.board.at(c.w - 1, c.slot) ?? -1;
    const next = this.board.at(c.w + 1, c.slot) ?? -1;
    const dom = c.dom;
    const cand: number[] = [];
    const scores: number[] = [];
    const info: Pick[] = [];
    let maxFam = -1;
    let maxVar = -1;
    for (let i = 0; i < dom.length; i++) {
      if (!this.valid(dom[i]!, c.w, m, mn)) continue;
      const p: Pick = { famGap: 0, leastFam: false, varGap: 0, leastVar: false };
      scores.push(this.score(c, i, m, mn, p, prev, next));
      cand.push(dom[i]!);
      info.push(p);
      maxFam = Math.max(maxFam, p.famGap);
      maxVar = Math.max(maxVar, p.varGap);
    }
    this.work += dom.length;
    for (;;) {
      let bi = -1;
      for (let j = 0; j < cand.length; j++) if (scores[j]! > -Infinity && (bi < 0 || scores[j]! > scores[bi]!)) bi = j;
      if (bi < 0) break;
      scores[bi] = -Infinity;
      const v = cand[bi]!;
      const p = info[bi]!;
      p.leastFam = p.famGap >= maxFam;
      p.leastVar = p.varGap >= maxVar;
      this.apply(c, v, 1, mn);
      this.assign[k] = v;
      this.picks[k] = p;
      const dead = this.forward(k);
      if (this.partial ? this.empties + dead < this.bestEmpties : dead === 0) {
        if (this.rec(k + 1)) return true;
      }
      this.apply(c, v, -1, mn);
      this.assign[k] = -1;
      this.picks[k] = undefined;
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

  /** Largest span loads around week w on the board itself (no lower bound), for checks outside a run. */
  maxes(w: number, out: Float64Array): void {
    this.spanMaxes(this.board.load, w, out);
  }

  /** Whether v fits at week w against the board within the full budgets (m from maxes). */
  fits(v: number, w: number, m: Float64Array): boolean {
    return this.valid(v, w, m, ZERO, this.full);
  }

  /** The best valid candidate for a cell against the board as it stands, or null. */
  bestNow(c: Cell): { v: number; pick: Pick } | null {
    const m = new Float64Array(NJ);
    this.maxes(c.w, m);
    const prev = this.board.at(c.w - 1, c.slot) ?? -1;
    const next = this.board.at(c.w + 1, c.slot) ?? -1;
    let best: { v: number; pick: Pick; s: number } | null = null;
    for (let i = 0; i < c.dom.length; i++) {
      const v = c.dom[i]!;
      if (!this.fits(v, c.w, m)) continue;
      const pick: Pick = { famGap: 0, leastFam: false, varGap: 0, leastVar: false };
      const s = this.score(c, i, m, ZERO, pick, prev, next);
      if (!best || s > best.s) best = { v, pick, s };
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
      empties: this.empties,
    };
  }

  /** Peak load ratio of the board as it stands, over the spans that overlap the planned weeks. */
  peakNow(): number {
    return peakOf(this.ctx, this.board, this.first, this.last);
  }

  /** The best peak any complete plan could reach: fixed load plus each open cell's least stress. */
  lowerBound(): number {
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
      this.lb[k]!.set(this.board.load[k]!);
      if (!withMin) continue;
      for (const c of this.cells) this.lb[k]![c.w - this.board.lo]! += c.minS[k]!;
    }
  }

  /** One bounded search; the board is left as it was (fixed entries only). */
  run(cap: Float64Array, partial: boolean, limit: number): boolean {
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
    const found = this.rec(0);
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
 * Plans the open cells: a complete plan within the budgets if the search finds one, then tighter
 * peaks (first straight at the lower bound, then one step below each peak found) while effort lasts;
 * without a complete plan, the plan with the fewest empty cells found.
 */
export function solve(search: Search): Solution | null {
  const full = search.budgetCaps(1, false);
  if (!search.run(full, false, EFFORT.complete)) {
    search.run(full, true, EFFORT.partial);
    return search.best;
  }
  const lb = search.lowerBound();
  for (let t = 0; t < EFFORT.tightenTries && search.work < EFFORT.total; t++) {
    const best = search.best!;
    if (best.peak <= lb + 1e-9 || !Number.isFinite(best.peak)) break;
    const caps = t === 0 ? search.budgetCaps(lb, false) : search.budgetCaps(best.peak, true);
    if (!search.run(caps, false, EFFORT.tighten) && t > 0) break;
  }
  return search.best;
}

/** The open cells that something fits, with domains checked against the fixed entries on the board. */
export function buildCells(
  ctx: Ctx,
  ath: Ath,
  board: Board,
  open: { at: number; w: number; week: string; slot: number; slotId: string }[],
  rng: () => number,
): Cell[] {
  const cells: Cell[] = [];
  const probe = new Search(ctx, ath, board, [], 0, 0);
  const m = new Float64Array(NJ);
  const V = ctx.variants.length;
  open.forEach((o) => {
    const taper = taperAt(ctx, ath, o.w);
    const mask = ctx.slots.get(o.slotId)!.mask;
    probe.maxes(o.w, m);
    const dom: number[] = [];
    for (let v = 0; v < V; v++) {
      if (staticOk(ctx, ath, mask, v, taper) && probe.fits(v, o.w, m)) dom.push(v);
    }
    if (dom.length === 0) return; // nothing fits even before any pick: the cell stays unfilled
    const minS = new Float64Array(NJ);
    for (const k of ctx.budgeted) {
      let mk = Infinity;
      for (const v of dom) mk = Math.min(mk, ctx.stress[v * NJ + k]!);
      minS[k] = mk;
    }
    const jit = new Float64Array(dom.length);
    for (let i = 0; i < jit.length; i++) jit[i] = rng();
    cells.push({ ...o, dom: Int32Array.from(dom), jit, minS, taper: taper !== null });
  });
  return cells;
}
