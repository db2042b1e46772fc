// Bar loading: which discs go on each side for a target weight, with limited plates, closest without going over.

import { requireFinite, requireInteger, requireNonNegative, requireOneOf, requirePositive } from './guard';
import { WEIGHT_UNITS, type WeightUnit } from './units';

/** A kind of plate and how many of it there are in total (pairs × 2; an odd one out is never used). */
export interface PlateSet {
  weight: number;
  count: number;
}

/** Bar, one collar's weight (two are always used), and the plates to hand. */
export interface BarSetup {
  bar: number;
  collars: number;
  plates: readonly PlateSet[];
}

export type BarOptions = Partial<BarSetup>;

export interface BarLoad {
  /** Plates for one side, heaviest (innermost) first; the other side is the same. */
  perSide: number[];
  achieved: number;
  /** target − achieved, never negative. */
  remainder: number;
}

/**
 * Kilo defaults follow the international federation's technical rules: 20 kg bar, 2.5 kg collars, discs
 * 25 to 0.5 kg. Counts are those of a competition platform: ten pairs of 25s and one pair of each smaller
 * disc, which loads every 2.5 kg step from 25 kg to over 600 kg.
 * Pound defaults are a common commercial gym: 45 lb bar, spring clips counted as 0, 45/35/25/10/5/2.5 lb
 * plates with enough pairs of 25s, 10s and 5s to load every 5 lb step (common practice, no single source).
 */
export const DEFAULT_BAR_SETUP: Readonly<Record<WeightUnit, Readonly<BarSetup>>> = {
  kg: {
    bar: 20,
    collars: 2.5,
    plates: [
      { weight: 25, count: 20 },
      { weight: 20, count: 2 },
      { weight: 15, count: 2 },
      { weight: 10, count: 2 },
      { weight: 5, count: 2 },
      { weight: 2.5, count: 2 },
      { weight: 1.25, count: 2 },
      { weight: 0.5, count: 2 },
    ],
  },
  lb: {
    bar: 45,
    collars: 0,
    plates: [
      { weight: 45, count: 20 },
      { weight: 35, count: 2 },
      { weight: 25, count: 4 },
      { weight: 10, count: 4 },
      { weight: 5, count: 4 },
      { weight: 2.5, count: 2 },
    ],
  },
};

export interface PlateColour {
  name: string;
  hex: string;
}

/**
 * Disc colours for plate diagrams. Kilo discs use the federation's colours (25 red, 20 blue, 15 yellow
 * from the rules; 10 green, 5 white, 2.5 black, 1.25 and 0.5 chrome by the usual convention). Pound plates
 * have no standard, so they get our own neutral greys, darker for heavier.
 */
export const PLATE_COLOURS: Readonly<Record<WeightUnit, Readonly<Record<string, PlateColour>>>> = {
  kg: {
    '25': { name: 'red', hex: '#c8102e' },
    '20': { name: 'blue', hex: '#1f4fa8' },
    '15': { name: 'yellow', hex: '#f2c200' },
    '10': { name: 'green', hex: '#2e8b3d' },
    '5': { name: 'white', hex: '#f4f4f0' },
    '2.5': { name: 'black', hex: '#1b1b1b' },
    '1.25': { name: 'chrome', hex: '#b8bcc2' },
    '0.5': { name: 'chrome', hex: '#b8bcc2' },
  },
  lb: {
    '45': { name: 'graphite', hex: '#2f3237' },
    '35': { name: 'slate', hex: '#474b52' },
    '25': { name: 'iron', hex: '#5e636b' },
    '10': { name: 'steel', hex: '#777c84' },
    '5': { name: 'pewter', hex: '#90959c' },
    '2.5': { name: 'silver', hex: '#aab0b6' },
  },
};

const OTHER_PLATE: PlateColour = { name: 'grey', hex: '#9a9a9a' };

/** Colour for drawing a plate; plates outside the tables are plain grey. */
export function plateColour(weight: number, unit: WeightUnit): PlateColour {
  return PLATE_COLOURS[unit][String(weight)] ?? OTHER_PLATE;
}

// Weights are handled in whole thousandths of the unit (grams, milli-pounds), so 1.25 + 0.5 adds exactly.
const SCALE = 1000;
// Plate search work beyond this is refused: only an absurdly fine-grained plate set gets near it.
const MAX_WORK = 20_000_000;
const NONE = 0x7fffffff;

function toUnits(x: number): number {
  return Math.round(x * SCALE);
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

interface Resolved {
  unit: WeightUnit;
  baseUnits: number; // bar + both collars
  kinds: { units: number; perSide: number }[]; // heaviest first, one entry per distinct weight
}

function resolve(unit: WeightUnit, opts: BarOptions): Resolved {
  requireOneOf('unit', unit, WEIGHT_UNITS);
  const defaults = DEFAULT_BAR_SETUP[unit];
  const bar = requireNonNegative('bar', opts.bar ?? defaults.bar);
  const collars = requireNonNegative('collars', opts.collars ?? defaults.collars);
  const perSide = new Map<number, number>();
  const totals = new Map<number, number>();
  for (const p of opts.plates ?? defaults.plates) {
    const w = toUnits(requirePositive('plate weight', p.weight));
    if (w === 0) throw new RangeError(`plate weight must be at least 1/${SCALE} ${unit}, got ${p.weight}`);
    requireInteger(`count of ${p.weight} ${unit} plates`, p.count, 0, 100_000);
    totals.set(w, (totals.get(w) ?? 0) + p.count);
  }
  for (const [w, total] of totals) if (total >= 2) perSide.set(w, Math.floor(total / 2));
  const kinds = [...perSide].map(([units, n]) => ({ units, perSide: n })).sort((a, b) => b.units - a.units);
  return { unit, baseUnits: toUnits(bar) + 2 * toUnits(collars), kinds };
}

/**
 * For one side: fewest plates reaching each exact sum, by suffix of plate kinds. Sums are in steps of the
 * plates' greatest common divisor, up to `limitSteps`. Dynamic programming rather than greedy, because
 * greedy fails with limited counts (e.g. 40 per side from 25, 20, 20: greedy takes 25 and gets stuck).
 */
class SideSolver {
  readonly step: number;
  readonly size: number;
  private readonly table: Int32Array[];

  constructor(
    private readonly kinds: Resolved['kinds'],
    limitUnits: number,
  ) {
    this.step = kinds.reduce((g, k) => gcd(g, k.units), 0) || 1;
    const allSteps = kinds.reduce((s, k) => s + (k.units / this.step) * k.perSide, 0);
    this.size = Math.max(0, Math.min(allSteps, Math.floor(limitUnits / this.step))) + 1;
    const work = this.size * (kinds.reduce((s, k) => s + k.perSide, 0) + 1);
    if (work > MAX_WORK) {
      throw new RangeError('plate set is too fine-grained for this target: use plate weights in coarser steps');
    }
    let next = new Int32Array(this.size).fill(NONE);
    next[0] = 0;
    this.table = [next];
    for (let i = kinds.length - 1; i >= 0; i--) {
      const kind = kinds[i]!;
      const w = kind.units / this.step;
      const cur = new Int32Array(this.size).fill(NONE);
      for (let s = 0; s < this.size; s++) {
        let best = NONE;
        for (let k = 0; k <= kind.perSide && k * w <= s; k++) {
          const rest = next[s - k * w]!;
          if (rest !== NONE && rest + k < best) best = rest + k;
        }
        cur[s] = best;
      }
      this.table.unshift(cur);
      next = cur;
    }
  }

  reachable(s: number): boolean {
    return s >= 0 && s < this.size && this.table[0]![s] !== NONE;
  }

  /** Fewest plates for sum index `s`; among those, the most heavy plates first. */
  plates(s: number): number[] {
    const out: number[] = [];
    let rest = s;
    for (let i = 0; i < this.kinds.length; i++) {
      const kind = this.kinds[i]!;
      const w = kind.units / this.step;
      const need = this.table[i]![rest]!;
      const after = this.table[i + 1]!;
      for (let k = Math.min(kind.perSide, Math.floor(rest / w)); k >= 0; k--) {
        const r = after[rest - k * w]!;
        if (r !== NONE && r + k === need) {
          for (let j = 0; j < k; j++) out.push(kind.units / SCALE);
          rest -= k * w;
          break;
        }
      }
    }
    return out;
  }
}

function totalOf(r: Resolved, solver: SideSolver, s: number): number {
  return (r.baseUnits + 2 * s * solver.step) / SCALE;
}

function belowBarMessage(target: number, r: Resolved): string {
  return `target ${target} ${r.unit} is below the empty bar with collars (${r.baseUnits / SCALE} ${r.unit})`;
}

/** Largest sum index whose total is at most `weight` (float-checked), or -1. */
function floorIndex(r: Resolved, solver: SideSolver, weight: number, below = false): number {
  let s = Math.min(solver.size - 1, Math.floor(((weight * SCALE - r.baseUnits) / 2 + 1e-6) / solver.step));
  const fits = (x: number): boolean => (below ? totalOf(r, solver, x) < weight : totalOf(r, solver, x) <= weight);
  while (s >= 0 && !(solver.reachable(s) && fits(s))) s--;
  return s;
}

/**
 * Plates per side for `target`: the heaviest total at or under the target that the plates allow; among
 * equal totals, the fewest plates, and then the heaviest plates first. A target below the empty bar with
 * collars cannot be loaded and throws a RangeError (a lifter asking for 15 kg on a 25 kg setup needs to be
 * told, not handed a heavier bar). Remainder is rounded to 1e-6 to hide floating-point dust.
 */
export function loadBar(target: number, opts: { unit: WeightUnit } & BarOptions): BarLoad {
  requireNonNegative('target', target);
  const r = resolve(opts.unit, opts);
  if (target * SCALE < r.baseUnits) throw new RangeError(belowBarMessage(target, r));
  const solver = new SideSolver(r.kinds, (target * SCALE - r.baseUnits) / 2 + 1);
  const s = floorIndex(r, solver, target);
  const achieved = totalOf(r, solver, s);
  return { perSide: solver.plates(s), achieved, remainder: Math.max(0, Math.round((target - achieved) * 1e6) / 1e6) };
}

export type RoundMode = 'nearest' | 'down' | 'up';

/**
 * The loadable total closest to `weight` (ties go down: never heavier than needed), or the next one down
 * or up. Below the empty bar, 'nearest' and 'up' give the empty bar; 'down' throws. Above what the plates
 * can make, 'nearest' and 'down' give the heaviest load; 'up' throws.
 */
export function roundToLoadable(
  weight: number,
  unit: WeightUnit,
  opts: BarOptions & { mode?: RoundMode } = {},
): number {
  requireNonNegative('weight', weight);
  const mode = requireOneOf('mode', opts.mode ?? 'nearest', ['nearest', 'down', 'up'] as const);
  const r = resolve(unit, opts);
  const largest = r.kinds.reduce((m, k) => Math.max(m, k.units), 0);
  const solver = new SideSolver(r.kinds, (weight * SCALE - r.baseUnits) / 2 + largest + 1);
  const down = weight * SCALE < r.baseUnits ? -1 : floorIndex(r, solver, weight);
  if (down >= 0 && (mode === 'down' || totalOf(r, solver, down) === weight)) return totalOf(r, solver, down);
  if (down < 0 && mode === 'down') throw new RangeError(belowBarMessage(weight, r));
  let up = down + 1;
  while (up < solver.size && !solver.reachable(up)) up++;
  if (up >= solver.size) {
    if (mode === 'up') throw new RangeError(`${weight} ${unit} is more than these plates can load`);
    return totalOf(r, solver, down);
  }
  const upTotal = totalOf(r, solver, up);
  if (mode === 'up' || down < 0) return upTotal;
  const downTotal = totalOf(r, solver, down);
  return upTotal - weight < weight - downTotal ? upTotal : downTotal;
}

/** The heaviest loadable total strictly below `weight`, or undefined when even the empty bar is not below it. */
export function loadableBelow(weight: number, unit: WeightUnit, opts: BarOptions = {}): number | undefined {
  requireFinite('weight', weight);
  const r = resolve(unit, opts);
  if (weight * SCALE <= r.baseUnits) return undefined;
  const solver = new SideSolver(r.kinds, (weight * SCALE - r.baseUnits) / 2 + 1);
  const s = floorIndex(r, solver, weight, true);
  return s < 0 ? undefined : totalOf(r, solver, s);
}

export function isLoadable(weight: number, unit: WeightUnit, opts: BarOptions = {}): boolean {
  requireNonNegative('weight', weight);
  const r = resolve(unit, opts);
  if (weight * SCALE < r.baseUnits) return false;
  return loadBar(weight, { ...opts, unit }).achieved === weight;
}
