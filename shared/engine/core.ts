// Indexes built once per request (library, slots, rules) and per athlete (their fixed facts and the board
// of their entries), shared by the checker, the planner, the live drag checks and the reasons.

import {
  JOINTS,
  type AthleteInput,
  type Emphasis,
  type Lift,
  type PlanEntry,
  type PlanRequest,
  type Restriction,
  type SlotDef,
  type TaperRule,
  type Variant,
} from './types';
import { validateRequest } from './validate';
import { weekFromNumber, weekNumber } from './weeks';

/** Tolerance for summed stresses that are not whole numbers (0.1 + 0.2 must not break a budget of 0.3). */
export const EPS = 1e-9;
export const JOINT_COUNT = JOINTS.length;
export const LIFT_BIT: Record<Lift, number> = { squat: 1, bench: 2, deadlift: 4 };
export const EMPHASES: readonly Emphasis[] = ['bottom', 'midRange', 'lockout'];
/** The comfort line when the rules do not set one: joint load at or under 80% of budget. */
export const DEFAULT_COMFORT_RATIO = 0.8;

const numberOfWeek = new Map<string, number>();
const weekOfNumber = new Map<number, string>();
/** weekNumber with a memo: the engine converts the same few week strings thousands of times. */
export function weekNum(week: string): number {
  let n = numberOfWeek.get(week);
  if (n === undefined) {
    n = weekNumber(week);
    if (numberOfWeek.size > 50_000) numberOfWeek.clear();
    numberOfWeek.set(week, n);
  }
  return n;
}
export function weekStr(n: number): string {
  let s = weekOfNumber.get(n);
  if (s === undefined) {
    s = weekFromNumber(n);
    if (weekOfNumber.size > 50_000) weekOfNumber.clear();
    weekOfNumber.set(n, s);
  }
  return s;
}

export interface SlotInfo {
  index: number;
  liftMask: number;
  def: SlotDef;
}

/** Everything about a request that does not depend on one athlete. Variants are numbered 0…n−1. */
export interface Ctx {
  variants: Variant[]; // unique by id (the first of a duplicated id wins)
  byId: Map<string, number>;
  family: Int32Array;
  familyNames: string[];
  liftBit: Uint8Array;
  risk: Uint8Array;
  specificity: Float64Array;
  /** Emphasis and bar as small numbers for the variety goal (−1 when not given). */
  emphasis: Int8Array;
  bar: Int32Array;
  archived: Uint8Array;
  /** Per variant, its meet-phase window in weeks (−1: not a meet-phase variant). */
  meetPhaseWeeks: Float64Array;
  anyArchived: boolean;
  anyMeetPhase: boolean;
  /** Equipment as bits (the first 30 kinds); a variant needing a kind past those has mask −1. */
  equipmentBit: Map<string, number>;
  equipmentMask: Int32Array;
  /** Per slot, the variants whose lift fits it. */
  slotVariants: Int32Array[];
  stress: Float64Array; // variant × joint, negatives read as 0
  /** Per variant v, its stresses above 0 on budgeted joints: stressJoint/stressValue[stressStart[v] … stressStart[v+1]). */
  stressStart: Int32Array;
  stressJoint: Uint8Array;
  stressValue: Float64Array;
  budget: Float64Array; // per joint; NaN when the joint has no budget
  budgeted: number[];
  slots: Map<string, SlotInfo>;
  slotList: SlotDef[];
  /** Per slot index, its lifts as bits. */
  slotMasks: number[];
  /** 0, 1, 2, …: each variant is its own item for the repeat rule. */
  variantItems: Int32Array;
  /** Effective windows: a variant never twice in one week, so the repeat window is at least 1. */
  repeatWindow: number;
  familyWindow: number;
  jointWindow: number;
  taper: TaperRule[];
  taperMax: number; // largest weeksOut, −1 without taper rules
  comfortRatio: number;
  /** 0 when the lift-balance goal is off. */
  liftBalanceWeeks: number;
  athletes: Map<string, AthleteInput>;
  req: PlanRequest;
}

export function buildCtx(req: PlanRequest): Ctx {
  validateRequest(req);
  const variants: Variant[] = [];
  const byId = new Map<string, number>();
  for (const v of req.variants) {
    if (byId.has(v.id)) continue;
    byId.set(v.id, variants.length);
    variants.push(v);
  }
  const count = variants.length;
  const familyIndex = new Map<string, number>();
  const familyNames: string[] = [];
  const family = new Int32Array(count);
  const liftBit = new Uint8Array(count);
  const risk = new Uint8Array(count);
  const specificity = new Float64Array(count);
  const emphasis = new Int8Array(count);
  const bar = new Int32Array(count);
  const archived = new Uint8Array(count);
  const meetPhaseWeeks = new Float64Array(count).fill(-1);
  const bars = new Map<string, number>();
  const equipmentBit = new Map<string, number>();
  const equipmentMask = new Int32Array(count);
  const stress = new Float64Array(count * JOINT_COUNT);
  const budget = new Float64Array(JOINT_COUNT).fill(NaN);
  const budgeted: number[] = [];
  JOINTS.forEach((j, k) => {
    const b = req.rules.jointBudget?.[j];
    if (typeof b === 'number' && Number.isFinite(b)) {
      budget[k] = Math.max(0, b);
      budgeted.push(k);
    }
  });
  const stressJoint: number[] = [];
  const stressValue: number[] = [];
  const stressStart = new Int32Array(count + 1);
  variants.forEach((v, i) => {
    let f = familyIndex.get(v.family);
    if (f === undefined) {
      f = familyNames.length;
      familyIndex.set(v.family, f);
      familyNames.push(v.family);
    }
    family[i] = f;
    liftBit[i] = LIFT_BIT[v.lift] ?? 0;
    risk[i] = v.risk;
    specificity[i] = v.specificity;
    emphasis[i] = v.emphasis ? EMPHASES.indexOf(v.emphasis) : -1;
    if (v.bar !== undefined && !bars.has(v.bar)) bars.set(v.bar, bars.size);
    bar[i] = v.bar === undefined ? -1 : bars.get(v.bar)!;
    archived[i] = v.archived ? 1 : 0;
    if (typeof v.meetPhaseWeeks === 'number' && Number.isFinite(v.meetPhaseWeeks))
      meetPhaseWeeks[i] = Math.max(0, v.meetPhaseWeeks);
    for (const e of v.equipment) {
      if (!equipmentBit.has(e) && equipmentBit.size < 30) equipmentBit.set(e, 1 << equipmentBit.size);
      const b = equipmentBit.get(e);
      equipmentMask[i] = b === undefined || equipmentMask[i]! < 0 ? -1 : equipmentMask[i]! | b;
    }
    JOINTS.forEach((j, k) => {
      const s = Math.max(0, Number(v.stress[j]) || 0);
      stress[i * JOINT_COUNT + k] = s;
      if (s > 0 && !Number.isNaN(budget[k]!)) {
        stressJoint.push(k);
        stressValue.push(s);
      }
    });
    stressStart[i + 1] = stressJoint.length;
  });
  const slots = new Map<string, SlotInfo>();
  const slotList: SlotDef[] = [];
  for (const s of req.slots) {
    if (slots.has(s.id)) continue;
    let liftMask = 0;
    for (const l of s.lifts) liftMask |= LIFT_BIT[l] ?? 0;
    slots.set(s.id, { index: slotList.length, liftMask, def: s });
    slotList.push(s);
  }
  const slotVariants = [...slots.values()].map((slot) => {
    const list: number[] = [];
    for (let v = 0; v < count; v++) if (liftBit[v]! & slot.liftMask) list.push(v);
    return Int32Array.from(list);
  });
  const athletes = new Map<string, AthleteInput>();
  for (const a of req.athletes) if (!athletes.has(a.id)) athletes.set(a.id, a);
  const whole = (n: number | undefined) =>
    typeof n === 'number' && Number.isFinite(n) ? Math.max(0, Math.floor(n)) : 0;
  const r = req.rules;
  return {
    variants,
    byId,
    family,
    familyNames,
    liftBit,
    risk,
    specificity,
    emphasis,
    bar,
    archived,
    meetPhaseWeeks,
    anyArchived: archived.some((a) => a === 1),
    anyMeetPhase: meetPhaseWeeks.some((m) => m >= 0),
    equipmentBit,
    equipmentMask,
    slotVariants,
    stress,
    stressStart,
    stressJoint: Uint8Array.from(stressJoint),
    stressValue: Float64Array.from(stressValue),
    budget,
    budgeted,
    slots,
    slotList,
    slotMasks: [...slots.values()].map((s) => s.liftMask),
    variantItems: Int32Array.from(variants, (_, i) => i),
    repeatWindow: Math.max(1, whole(r.repeatWindowWeeks)),
    familyWindow: whole(r.familyWindowWeeks),
    jointWindow: Math.max(1, whole(r.jointWindowWeeks)),
    taper: r.taper ?? [],
    taperMax: (r.taper ?? []).reduce((m, t) => Math.max(m, t.weeksOut), -1),
    comfortRatio: r.comfortRatio ?? DEFAULT_COMFORT_RATIO,
    liftBalanceWeeks: whole(r.liftBalanceWeeks),
    athletes,
    req,
  };
}

/** One restriction of an athlete, with its weeks as numbers and the variants it rules out. */
export interface DatedRestriction {
  source: Restriction;
  from: number; // −Infinity when open-ended
  to: number; // Infinity when open-ended
  /** Per variant: 1 when this restriction rules it out. */
  blocks: number[];
}

/** One athlete's fixed facts: what their equipment, restrictions, ceiling, meet and rest weeks allow. */
export interface Ath {
  input: AthleteInput;
  equipment: Set<string>;
  /** Per variant: 1 when it needs equipment the athlete does not have. */
  missingEquipment: number[];
  restrictions: DatedRestriction[];
  /** Per week number, the variants ruled out by the restrictions in force that week (null: none). */
  restrictedIn: Map<number, number[] | null>;
  meet: number | undefined;
  maxRisk: number; // Infinity without a ceiling
  restWeeks: Set<number>;
  /** Per week number, the cell rules in force and their tests (filled by the rule registry). */
  cellTests: Map<number, unknown>;
}

/**
 * Per variant of the library, 1 where `out` holds. Masks are plain arrays: the engine makes several per
 * athlete, and small typed arrays cost more to make and to collect.
 */
export function maskOf(ctx: Ctx, out: (v: number) => boolean): number[] {
  const mask = new Array<number>(ctx.variants.length);
  for (let v = 0; v < mask.length; v++) mask[v] = out(v) ? 1 : 0;
  return mask;
}

/** Whether restriction r rules out variant v (any of its parts does). */
export function restrictionBlocks(ctx: Ctx, r: Restriction, v: number): boolean {
  const x = ctx.variants[v]!;
  if (r.joint !== undefined && typeof r.maxStress === 'number') {
    const k = JOINTS.indexOf(r.joint);
    if (k >= 0 && ctx.stress[v * JOINT_COUNT + k]! > r.maxStress + EPS) return true;
  }
  if (r.emphasis && x.emphasis && r.emphasis.includes(x.emphasis)) return true;
  if (r.families && r.families.includes(x.family)) return true;
  return false;
}

export function buildAth(ctx: Ctx, input: AthleteInput): Ath {
  const equipment = new Set(input.equipment);
  const count = ctx.variants.length;
  const missingEquipment = new Array<number>(count).fill(0);
  let has = 0;
  for (const e of input.equipment) has |= ctx.equipmentBit.get(e) ?? 0;
  for (let v = 0; v < count; v++) {
    const need = ctx.equipmentMask[v]!;
    if (need < 0) missingEquipment[v] = ctx.variants[v]!.equipment.every((e) => equipment.has(e)) ? 0 : 1;
    else if (need & ~has) missingEquipment[v] = 1;
  }
  const restrictions = input.restrictions.map((source): DatedRestriction => {
    const blocks = maskOf(ctx, (v) => restrictionBlocks(ctx, source, v));
    return {
      source,
      from: source.fromWeek ? weekNum(source.fromWeek) : -Infinity,
      to: source.toWeek ? weekNum(source.toWeek) : Infinity,
      blocks,
    };
  });
  return {
    input,
    equipment,
    missingEquipment,
    restrictions,
    restrictedIn: new Map(),
    meet: input.meetWeek ? weekNum(input.meetWeek) : undefined,
    maxRisk: input.maxRisk ?? Infinity,
    restWeeks: new Set((input.restWeeks ?? []).map(weekNum)),
    cellTests: new Map(),
  };
}

/** The restrictions of the athlete in force in week w. */
export function restrictionsIn(ath: Ath, w: number): DatedRestriction[] {
  return ath.restrictions.filter((r) => r.from <= w && w <= r.to);
}

/** The variants the restrictions in force in week w rule out, combined (null when none is in force). */
export function restrictedIn(ath: Ath, w: number): number[] | null {
  let hit = ath.restrictedIn.get(w);
  if (hit !== undefined) return hit;
  const active = restrictionsIn(ath, w);
  hit = null;
  if (active.length === 1) hit = active[0]!.blocks;
  else if (active.length > 1) {
    hit = active[0]!.blocks.slice();
    for (const r of active) for (let v = 0; v < hit.length; v++) hit[v]! |= r.blocks[v]!;
  }
  ath.restrictedIn.set(w, hit);
  return hit;
}

export interface Taper {
  weeksToMeet: number;
  maxRisk: number;
  minSpecificity: number;
}

/** The taper limits in force in week w (weeks to the meet between 0 and weeksOut), or null. */
export function taperAt(ctx: Ctx, ath: Ath, w: number): Taper | null {
  if (ath.meet === undefined) return null;
  const d = ath.meet - w;
  if (d < 0 || d > ctx.taperMax) return null;
  let maxRisk = Infinity;
  let minSpecificity = -Infinity;
  let any = false;
  for (const t of ctx.taper) {
    if (d > t.weeksOut) continue;
    any = true;
    maxRisk = Math.min(maxRisk, t.maxRisk);
    if (typeof t.minSpecificity === 'number') minSpecificity = Math.max(minSpecificity, t.minSpecificity);
  }
  return any ? { weeksToMeet: d, maxRisk, minSpecificity } : null;
}

const CELL_KEY = 1024;

/**
 * One athlete's entries as counted by the rules: where each variant and family was used, and the
 * summed stress per joint and week over a range that holds every entry (outside it the load is 0).
 */
export class Board {
  /** Week number of load[k][0]. */
  first: number;
  load: number[][];
  variantUses: number[][] = [];
  familyUses: number[][] = [];
  cells = new Map<number, number>();

  constructor(
    readonly ctx: Ctx,
    from: number,
    to: number,
  ) {
    this.first = from - ctx.jointWindow - 1;
    const size = Math.max(0, to - from) + 2 * ctx.jointWindow + 3;
    this.load = JOINTS.map(() => new Array<number>(size).fill(0));
  }

  add(w: number, v: number, slot: number, sign: 1 | -1): void {
    const ctx = this.ctx;
    const f = ctx.family[v]!;
    if (sign > 0) {
      (this.variantUses[v] ??= []).push(w);
      (this.familyUses[f] ??= []).push(w);
      if (slot >= 0) this.cells.set(w * CELL_KEY + slot, v);
    } else {
      dropOne(this.variantUses[v], w);
      dropOne(this.familyUses[f], w);
      if (slot >= 0 && this.cells.get(w * CELL_KEY + slot) === v) this.cells.delete(w * CELL_KEY + slot);
    }
    const i = w - this.first;
    if (i < 0 || i >= this.load[0]!.length) return;
    for (let k = 0; k < JOINT_COUNT; k++) {
      const s = ctx.stress[v * JOINT_COUNT + k]!;
      if (s > 0) this.load[k]![i]! += sign * s;
    }
  }

  at(w: number, slot: number): number | undefined {
    return this.cells.get(w * CELL_KEY + slot);
  }

  loadAt(k: number, w: number): number {
    const a = this.load[k]!;
    const i = w - this.first;
    return i >= 0 && i < a.length ? a[i]! : 0;
  }

  /** Summed stress on joint k in the span of jointWindow weeks starting at week start. */
  spanLoad(k: number, start: number): number {
    let s = 0;
    for (let x = start; x < start + this.ctx.jointWindow; x++) s += this.loadAt(k, x);
    return s;
  }

  /** The busiest span holding week w on joint k: its first week and its load. */
  busiest(k: number, w: number): { start: number; load: number } {
    const span = this.ctx.jointWindow;
    let s = this.spanLoad(k, w - span + 1);
    let best = s;
    let start = w - span + 1;
    for (let st = w - span + 2; st <= w; st++) {
      s += this.loadAt(k, st + span - 1) - this.loadAt(k, st - 1);
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
export function rangeOf(weekNums: number[], ...lists: PlanEntry[][]): [number, number] {
  let from = Infinity;
  let to = -Infinity;
  for (const n of weekNums) {
    from = Math.min(from, n);
    to = Math.max(to, n);
  }
  for (const list of lists) {
    for (const e of list) {
      const n = weekNum(e.week);
      from = Math.min(from, n);
      to = Math.max(to, n);
    }
  }
  return from === Infinity ? [0, 0] : [from, to];
}

/** Adds entries to a board; entries naming unknown variants count for nothing. */
export function addAll(ctx: Ctx, board: Board, entries: PlanEntry[]): void {
  for (const e of entries) {
    const v = ctx.byId.get(e.variantId);
    if (v !== undefined) board.add(weekNum(e.week), v, ctx.slots.get(e.slotId)?.index ?? -1, 1);
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
