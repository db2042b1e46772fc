// Indexes built once per request (library, slots, rules) and per athlete (the board of their entries),
// and the rule checks that checkPlan, explainCandidate and the planner share, so all judge a cell alike.

import {
  JOINTS,
  type AthleteInput,
  type Emphasis,
  type Lift,
  type PlanEntry,
  type PlanRequest,
  type RuleId,
  type SlotDef,
  type TaperRule,
  type Variant,
  type Violation,
} from './types';
import { weekFromNumber, weekNumber } from './weeks';
import * as W from './words';

/** Tolerance for summed stresses that are not whole numbers (0.1 + 0.2 must not break a budget of 0.3). */
export const EPS = 1e-9;
export const NJ = JOINTS.length;
const LIFT_BIT: Record<Lift, number> = { squat: 1, bench: 2, deadlift: 4 };
const EMPHASES: readonly Emphasis[] = ['bottom', 'midRange', 'lockout'];

const numOf = new Map<string, number>();
const strOf = new Map<number, string>();
/** weekNumber with a memo: the engine converts the same few week strings thousands of times. */
export function wn(week: string): number {
  let n = numOf.get(week);
  if (n === undefined) {
    n = weekNumber(week);
    if (numOf.size > 50_000) numOf.clear();
    numOf.set(week, n);
  }
  return n;
}
export function ws(n: number): string {
  let s = strOf.get(n);
  if (s === undefined) {
    s = weekFromNumber(n);
    if (strOf.size > 50_000) strOf.clear();
    strOf.set(n, s);
  }
  return s;
}

export interface SlotInfo {
  idx: number;
  mask: number;
  def: SlotDef;
}

/** Everything about a request that does not depend on one athlete. */
export interface Ctx {
  variants: Variant[]; // unique by id (the first of a duplicated id wins)
  byId: Map<string, number>;
  fam: Int32Array;
  famNames: string[];
  liftBit: Uint8Array;
  risk: Uint8Array;
  spec: Float64Array;
  /** Emphasis and bar as small numbers for the variety goal (−1 when not given). */
  emph: Int8Array;
  bar: Int32Array;
  /** Equipment as bits (the first 30 kinds); a variant needing a kind past those has mask −1. */
  equipBit: Map<string, number>;
  equipMask: Int32Array;
  /** Per slot, the variants whose lift fits it. */
  bySlot: Int32Array[];
  stress: Float64Array; // variant × joint, negatives read as 0
  /** Per variant, its stresses above 0 on joints that have a budget: sJ/sV[sOff[v] .. sOff[v+1]). */
  sOff: Int32Array;
  sJ: Uint8Array;
  sV: Float64Array;
  budget: Float64Array; // per joint; NaN when the joint has no budget
  budgeted: number[];
  slots: Map<string, SlotInfo>;
  slotList: SlotDef[];
  /** Effective windows: a variant never twice in one week, so the repeat window is at least 1. */
  R: number;
  F: number;
  J: number;
  taper: TaperRule[];
  taperMax: number; // largest weeksOut, −1 without taper rules
  athletes: Map<string, AthleteInput>;
  req: PlanRequest;
}

export function buildCtx(req: PlanRequest): Ctx {
  const variants: Variant[] = [];
  const byId = new Map<string, number>();
  for (const v of req.variants) {
    if (byId.has(v.id)) continue;
    byId.set(v.id, variants.length);
    variants.push(v);
  }
  const V = variants.length;
  const famIdx = new Map<string, number>();
  const famNames: string[] = [];
  const fam = new Int32Array(V);
  const liftBit = new Uint8Array(V);
  const risk = new Uint8Array(V);
  const spec = new Float64Array(V);
  const emph = new Int8Array(V);
  const bar = new Int32Array(V);
  const bars = new Map<string, number>();
  const equipBit = new Map<string, number>();
  const equipMask = new Int32Array(V);
  const stress = new Float64Array(V * NJ);
  const budget = new Float64Array(NJ).fill(NaN);
  const budgeted: number[] = [];
  JOINTS.forEach((j, k) => {
    const b = req.rules.jointBudget?.[j];
    if (typeof b === 'number' && Number.isFinite(b)) {
      budget[k] = Math.max(0, b);
      budgeted.push(k);
    }
  });
  const sJ: number[] = [];
  const sV: number[] = [];
  const sOff = new Int32Array(V + 1);
  variants.forEach((v, i) => {
    let f = famIdx.get(v.family);
    if (f === undefined) {
      f = famNames.length;
      famIdx.set(v.family, f);
      famNames.push(v.family);
    }
    fam[i] = f;
    liftBit[i] = LIFT_BIT[v.lift] ?? 0;
    risk[i] = v.risk;
    spec[i] = v.specificity;
    emph[i] = v.emphasis ? EMPHASES.indexOf(v.emphasis) : -1;
    if (v.bar !== undefined && !bars.has(v.bar)) bars.set(v.bar, bars.size);
    bar[i] = v.bar === undefined ? -1 : bars.get(v.bar)!;
    for (const e of v.equipment) {
      if (!equipBit.has(e) && equipBit.size < 30) equipBit.set(e, 1 << equipBit.size);
      const bit = equipBit.get(e);
      equipMask[i] = bit === undefined || equipMask[i]! < 0 ? -1 : equipMask[i]! | bit;
    }
    JOINTS.forEach((j, k) => {
      const s = Math.max(0, Number(v.stress[j]) || 0);
      stress[i * NJ + k] = s;
      if (s > 0 && !Number.isNaN(budget[k]!)) {
        sJ.push(k);
        sV.push(s);
      }
    });
    sOff[i + 1] = sJ.length;
  });
  const slots = new Map<string, SlotInfo>();
  const slotList: SlotDef[] = [];
  for (const s of req.slots) {
    if (slots.has(s.id)) continue;
    let mask = 0;
    for (const l of s.lifts) mask |= LIFT_BIT[l] ?? 0;
    slots.set(s.id, { idx: slotList.length, mask, def: s });
    slotList.push(s);
  }
  const bySlot = slotList.map((_, q) => {
    const mask = [...slots.values()][q]!.mask;
    const list: number[] = [];
    for (let v = 0; v < V; v++) if (liftBit[v]! & mask) list.push(v);
    return Int32Array.from(list);
  });
  const athletes = new Map<string, AthleteInput>();
  for (const a of req.athletes) if (!athletes.has(a.id)) athletes.set(a.id, a);
  const win = (n: number) => (Number.isFinite(n) ? Math.max(0, Math.floor(n)) : 0);
  const r = req.rules;
  return {
    variants,
    byId,
    fam,
    famNames,
    liftBit,
    risk,
    spec,
    emph,
    bar,
    equipBit,
    equipMask,
    bySlot,
    stress,
    sOff,
    sJ: Uint8Array.from(sJ),
    sV: Float64Array.from(sV),
    budget,
    budgeted,
    slots,
    slotList,
    R: Math.max(1, win(r.repeatWindowWeeks)),
    F: win(r.familyWindowWeeks),
    J: Math.max(1, win(r.jointWindowWeeks)),
    taper: r.taper ?? [],
    taperMax: (r.taper ?? []).reduce((m, t) => Math.max(m, t.weeksOut), -1),
    athletes,
    req,
  };
}

/** One athlete's fixed facts: which variants their equipment and restrictions allow, and the meet. */
export interface Ath {
  input: AthleteInput;
  equipment: Set<string>;
  /** Per joint, the tightest restriction (Infinity when none). */
  limit: Float64Array;
  /** Per variant: 0 allowed, 1 missing equipment, 2 over a restriction, 3 both. */
  block: Uint8Array;
  meet: number | undefined;
}

export function buildAth(ctx: Ctx, input: AthleteInput): Ath {
  const equipment = new Set(input.equipment);
  const limit = new Float64Array(NJ).fill(Infinity);
  for (const r of input.restrictions) {
    // Version-1 handling: joint caps only, whatever their dates (the version-2 rules replace this).
    if (r.joint === undefined || r.maxStress === undefined) continue;
    const k = JOINTS.indexOf(r.joint);
    if (k >= 0) limit[k] = Math.min(limit[k]!, r.maxStress);
  }
  const V = ctx.variants.length;
  const block = new Uint8Array(V);
  let has = 0;
  for (const e of input.equipment) has |= ctx.equipBit.get(e) ?? 0;
  const restricted: number[] = [];
  for (let k = 0; k < NJ; k++) if (limit[k]! < Infinity) restricted.push(k);
  for (let v = 0; v < V; v++) {
    const need = ctx.equipMask[v]!;
    let b = 0;
    if (need < 0) b = ctx.variants[v]!.equipment.every((e) => equipment.has(e)) ? 0 : 1;
    else if (need & ~has) b = 1;
    for (const k of restricted) {
      if (ctx.stress[v * NJ + k]! > limit[k]! + EPS) {
        b |= 2;
        break;
      }
    }
    block[v] = b;
  }
  return { input, equipment, limit, block, meet: input.meetWeek ? wn(input.meetWeek) : undefined };
}

export interface Taper {
  d: number;
  maxRisk: number;
  minSpec: number;
}

/** The taper limits in force in week w (weeks to the meet between 0 and weeksOut), or null. */
export function taperAt(ctx: Ctx, ath: Ath, w: number): Taper | null {
  if (ath.meet === undefined) return null;
  const d = ath.meet - w;
  if (d < 0 || d > ctx.taperMax) return null;
  let maxRisk = Infinity;
  let minSpec = -Infinity;
  let any = false;
  for (const t of ctx.taper) {
    if (d > t.weeksOut) continue;
    any = true;
    maxRisk = Math.min(maxRisk, t.maxRisk);
    if (typeof t.minSpecificity === 'number') minSpec = Math.max(minSpec, t.minSpecificity);
  }
  return any ? { d, maxRisk, minSpec } : null;
}

const CELL_KEY = 1024;

/**
 * One athlete's entries as counted by the rules: where each variant and family was used, and the
 * summed stress per joint and week over a range that holds every entry (outside it the load is 0).
 */
export class Board {
  lo: number;
  load: number[][];
  vUses: number[][] = [];
  fUses: number[][] = [];
  cells = new Map<number, number>();

  constructor(
    readonly ctx: Ctx,
    lo: number,
    hi: number,
  ) {
    this.lo = lo - ctx.J - 1;
    const size = Math.max(0, hi - lo) + 2 * ctx.J + 3;
    this.load = JOINTS.map(() => new Array<number>(size).fill(0));
  }

  add(w: number, v: number, slot: number, sign: 1 | -1): void {
    const ctx = this.ctx;
    const f = ctx.fam[v]!;
    if (sign > 0) {
      (this.vUses[v] ??= []).push(w);
      (this.fUses[f] ??= []).push(w);
      if (slot >= 0) this.cells.set(w * CELL_KEY + slot, v);
    } else {
      dropOne(this.vUses[v], w);
      dropOne(this.fUses[f], w);
      if (slot >= 0 && this.cells.get(w * CELL_KEY + slot) === v) this.cells.delete(w * CELL_KEY + slot);
    }
    const i = w - this.lo;
    if (i < 0 || i >= this.load[0]!.length) return;
    for (let k = 0; k < NJ; k++) {
      const s = ctx.stress[v * NJ + k]!;
      if (s > 0) this.load[k]![i]! += sign * s;
    }
  }

  at(w: number, slot: number): number | undefined {
    return this.cells.get(w * CELL_KEY + slot);
  }

  loadAt(k: number, w: number): number {
    const a = this.load[k]!;
    const i = w - this.lo;
    return i >= 0 && i < a.length ? a[i]! : 0;
  }

  /** Summed stress on joint k in the span of J weeks starting at week st. */
  spanLoad(k: number, st: number): number {
    let s = 0;
    for (let x = st; x < st + this.ctx.J; x++) s += this.loadAt(k, x);
    return s;
  }

  /** The busiest span holding week w on joint k: its first week and its load. */
  busiest(k: number, w: number): { start: number; load: number } {
    const J = this.ctx.J;
    let s = this.spanLoad(k, w - J + 1);
    let best = s;
    let start = w - J + 1;
    for (let st = w - J + 2; st <= w; st++) {
      s += this.loadAt(k, st + J - 1) - this.loadAt(k, st - 1);
      if (s > best + EPS) {
        best = s;
        start = st;
      }
    }
    return { start, load: best };
  }
}

function dropOne(list: number[] | undefined, w: number): void {
  if (!list) return;
  const i = list.lastIndexOf(w);
  if (i >= 0) list.splice(i, 1);
}

/** The week range an athlete's board must cover for these entries and weeks. */
export function rangeOf(weeksNums: number[], ...lists: PlanEntry[][]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const n of weeksNums) {
    lo = Math.min(lo, n);
    hi = Math.max(hi, n);
  }
  for (const list of lists) {
    for (const e of list) {
      const n = wn(e.week);
      lo = Math.min(lo, n);
      hi = Math.max(hi, n);
    }
  }
  return lo === Infinity ? [0, 0] : [lo, hi];
}

/** Adds entries to a board; entries naming unknown variants count for nothing. */
export function addAll(ctx: Ctx, board: Board, entries: PlanEntry[]): void {
  for (const e of entries) {
    const v = ctx.byId.get(e.variantId);
    if (v !== undefined) board.add(wn(e.week), v, ctx.slots.get(e.slotId)?.idx ?? -1, 1);
  }
}

/** The nearest other use within `window` weeks of w (the earlier one on a tie), or undefined. */
export function nearest(uses: number[] | undefined, w: number, window: number): number | undefined {
  if (!uses) return undefined;
  let best: number | undefined;
  for (const u of uses) {
    const d = Math.abs(u - w);
    if (d >= window) continue;
    if (best === undefined || d < Math.abs(best - w) || (d === Math.abs(best - w) && u < best)) best = u;
  }
  return best;
}

/** The latest use before week w, or undefined. */
export function lastBefore(uses: number[] | undefined, w: number): number | undefined {
  if (!uses) return undefined;
  let best: number | undefined;
  for (const u of uses) if (u < w && (best === undefined || u > best)) best = u;
  return best;
}

export function specText(x: number): string {
  return String(Math.round(x * 100) / 100);
}

/** The cell being judged, and where its violations go. */
interface Target {
  athleteId: string;
  week: string;
  slotId: string;
  variantId: string;
  out: Violation[];
}

function note(c: Target, rule: RuleId, message: string): void {
  c.out.push({ rule, athleteId: c.athleteId, week: c.week, slotId: c.slotId, variantId: c.variantId, message });
}

/**
 * Every rule that putting variantId in (week, slotId) would break, against what is on the board.
 * The caller takes the cell's own entry off the board first.
 */
export function cellViolations(
  ctx: Ctx,
  ath: Ath,
  board: Board,
  week: string,
  slotId: string,
  variantId: string,
): Violation[] {
  const out: Violation[] = [];
  const cell: Target = { athleteId: ath.input.id, week, slotId, variantId, out };
  const v = ctx.byId.get(variantId);
  if (v === undefined) {
    note(cell, 'unknownVariant', `no variant "${variantId}" in the library`);
    return out;
  }
  const x = ctx.variants[v]!;
  const w = wn(week);
  const slot = ctx.slots.get(slotId);
  if (!slot) note(cell, 'liftMismatch', `there is no "${slotId}" slot`);
  else if ((ctx.liftBit[v]! & slot.mask) === 0) {
    const lifts = slot.def.lifts.length ? slot.def.lifts.join(' or ') : 'no lift';
    note(cell, 'liftMismatch', `${x.name} is a ${x.lift} variant; the ${slotId} slot takes ${lifts}`);
  }
  if (ath.block[v]! & 1) {
    const missing = x.equipment.filter((e) => !ath.equipment.has(e));
    note(cell, 'equipment', `${x.name} needs ${missing.join(', ')}, which this athlete does not have`);
  }
  if (ath.block[v]! & 2) {
    for (let k = 0; k < NJ; k++) {
      const s = ctx.stress[v * NJ + k]!;
      if (s > ath.limit[k]! + EPS) {
        note(
          cell,
          'restriction',
          `${x.name} puts ${jointName(k)} stress ${W.num(s)} over this athlete's limit of ${W.num(ath.limit[k]!)}`,
        );
      }
    }
  }
  const taper = taperAt(ctx, ath, w);
  if (taper) {
    const when = W.meetWhen(taper.d);
    if (x.risk > taper.maxRisk)
      note(cell, 'taperRisk', `${x.name} has risk ${x.risk}, above the limit of ${taper.maxRisk} ${when}`);
    if (x.specificity < taper.minSpec - EPS) {
      note(
        cell,
        'taperSpecificity',
        `${x.name} has specificity ${specText(x.specificity)}, below the minimum of ${specText(taper.minSpec)} ${when}`,
      );
    }
  }
  const rep = nearest(board.vUses[v], w, ctx.R);
  if (rep !== undefined) {
    note(
      cell,
      'repeat',
      rep === w
        ? `${x.name} is already in ${week}; a variant may appear only once a week`
        : `${x.name} is already in ${ws(rep)}, ${W.weeks(Math.abs(rep - w))} away; the repeat window is ${W.weeks(ctx.R)}`,
    );
  }
  const famUse = nearest(board.fUses[ctx.fam[v]!], w, ctx.F);
  if (famUse !== undefined) {
    const away = famUse === w ? '' : `, ${W.weeks(Math.abs(famUse - w))} away`;
    note(
      cell,
      'family',
      `the ${x.family} family is already in ${ws(famUse)}${away}; the family window is ${W.weeks(ctx.F)}`,
    );
  }
  for (let t = ctx.sOff[v]!; t < ctx.sOff[v + 1]!; t++) {
    const k = ctx.sJ[t]!;
    const b = board.busiest(k, w);
    const total = b.load + ctx.sV[t]!;
    if (total > ctx.budget[k]! + EPS) {
      note(
        cell,
        'jointBudget',
        `${W.jointLoad(JOINTS[k]!)} ${W.num(total)} over budget ${W.num(ctx.budget[k]!)} in ${W.span(ws(b.start), ws(b.start + ctx.J - 1))}`,
      );
    }
  }
  return out;
}

function jointName(k: number): string {
  return W.jointName(JOINTS[k]!);
}

/** A memo per request object, rebuilt when the request or one of the parts named in `key` is replaced. */
export function memo<T>(
  cache: WeakMap<PlanRequest, { key: unknown[]; value: T }>,
  req: PlanRequest,
  key: unknown[],
  build: () => T,
): T {
  const hit = cache.get(req);
  if (hit && hit.key.length === key.length && hit.key.every((k, i) => k === key[i])) return hit.value;
  const value = build();
  cache.set(req, { key, value });
  return value;
}

const ctxCache = new WeakMap<PlanRequest, { key: unknown[]; value: Ctx }>();
/** Request-level indexes; mutate nothing in place: replace the list or rules object that changed. */
export function ctxFor(req: PlanRequest): Ctx {
  const key = [
    req.variants,
    req.variants.length,
    req.slots,
    req.slots.length,
    req.athletes,
    req.athletes.length,
    req.rules,
  ];
  return memo(ctxCache, req, key, () => buildCtx(req));
}

/** Entries of one athlete, in their given order. */
export function entriesOf<T extends PlanEntry>(list: readonly T[] | undefined, athleteId: string): T[] {
  return list ? list.filter((e) => e.athleteId === athleteId) : [];
}
