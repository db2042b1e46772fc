// Test and benchmark fixtures: a small hand-made library and seeded generators of random libraries,
// rules, histories, boards and meets (invented names and numbers).

import {
  JOINTS,
  type AthleteInput,
  type Joint,
  type Lift,
  type PlanEntry,
  type PlanRequest,
  type Rules,
  type SlotDef,
  type Variant,
} from '../../../shared/engine/types';
import { addWeeks, weekRange } from '../../../shared/engine/weeks';

/** Small fast seeded generator for fixtures (the engine itself uses seedrandom). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export type Rand = () => number;
export const int = (r: Rand, lo: number, hi: number): number => lo + Math.floor(r() * (hi - lo + 1));
export const pick = <T>(r: Rand, list: readonly T[]): T => list[Math.floor(r() * list.length)]!;
export const chance = (r: Rand, p: number): boolean => r() < p;

export const TWO_SLOTS: SlotDef[] = [
  { id: 'lower', lifts: ['squat', 'deadlift'] },
  { id: 'upper', lifts: ['bench'] },
];

/** Slot layouts for random requests: the usual two days, one day, an open slot, one slot per lift. */
const SLOT_SETS: SlotDef[][] = [
  TWO_SLOTS,
  TWO_SLOTS,
  [TWO_SLOTS[0]!],
  [{ id: 'any', lifts: ['squat', 'bench', 'deadlift'] }],
  [
    { id: 'squat-day', lifts: ['squat'] },
    { id: 'bench-day', lifts: ['bench'] },
    { id: 'pull-day', lifts: ['deadlift'] },
  ],
];

const FAMILIES: Record<Lift, string[]> = {
  squat: [
    'box-squat',
    'pause-squat',
    'front-squat',
    'safety-bar-squat',
    'belt-squat',
    'anderson-squat',
    'good-morning',
  ],
  bench: ['board-press', 'floor-press', 'pin-press', 'close-grip', 'incline', 'pause-bench', 'reverse-band-bench'],
  deadlift: ['rack-pull', 'deficit-pull', 'block-pull', 'snatch-grip-pull', 'paused-pull', 'stiff-leg-pull'],
};
const JOINT_BIAS: Record<Lift, Joint[]> = {
  squat: ['knee', 'hip', 'lowerBack'],
  bench: ['shoulder', 'elbow', 'wrist'],
  deadlift: ['lowerBack', 'hip'],
};
export const EQUIPMENT = ['safety bar', 'cambered bar', 'boards', 'bands', 'chains', 'box', 'pins', 'blocks'];
const BARS = ['straight bar', 'safety bar', 'cambered bar', 'football bar'];
const EMPHASES = ['bottom', 'midRange', 'lockout'] as const;

export interface LibraryOptions {
  lifts?: Lift[];
  familiesPerLift?: number;
  equipmentChance?: number;
  maxStress?: number;
}

export function randomLibrary(r: Rand, size: number, opts: LibraryOptions = {}): Variant[] {
  const lifts = opts.lifts ?? ['squat', 'bench', 'deadlift'];
  const out: Variant[] = [];
  for (let i = 0; i < size; i++) {
    const lift = lifts[i % lifts.length]!;
    const fams = FAMILIES[lift].slice(0, opts.familiesPerLift ?? FAMILIES[lift].length);
    const family = pick(r, fams);
    const stress: Partial<Record<Joint, number>> = {};
    for (const j of JOINTS) {
      const main = JOINT_BIAS[lift].includes(j);
      const s = main ? int(r, 0, opts.maxStress ?? 3) : chance(r, 0.15) ? 1 : 0;
      if (s > 0) stress[j] = s;
    }
    const equipment = chance(r, opts.equipmentChance ?? 0.3) ? [pick(r, EQUIPMENT)] : [];
    out.push({
      id: `v${i}`,
      name: `${family.replace(/-/g, ' ')} ${i}`,
      lift,
      family,
      risk: int(r, 1, 3) as 1 | 2 | 3,
      specificity: Math.round((0.3 + 0.7 * r()) * 100) / 100,
      stress,
      equipment,
      ...(chance(r, 0.8) ? { emphasis: pick(r, EMPHASES) } : {}),
      ...(chance(r, 0.8) ? { bar: pick(r, BARS) } : {}),
    });
  }
  return out;
}

export function randomRules(r: Rand, seed = 'seed'): Rules {
  const jointBudget: Partial<Record<Joint, number>> = {};
  for (const j of JOINTS) if (chance(r, 0.6)) jointBudget[j] = int(r, 2, 12);
  const taper = [];
  if (chance(r, 0.7)) taper.push({ weeksOut: int(r, 1, 5), maxRisk: int(r, 1, 2) as 1 | 2 });
  if (chance(r, 0.5))
    taper.push({ weeksOut: int(r, 0, 2), maxRisk: 1 as const, minSpecificity: Math.round(r() * 80) / 100 });
  return {
    repeatWindowWeeks: int(r, 0, 6),
    familyWindowWeeks: int(r, 0, 4),
    jointWindowWeeks: int(r, 1, 4),
    jointBudget,
    taper,
    seed,
  };
}

const STARTS = ['2026-W50', '2026-W51', '2026-W52', '2027-W01', '2027-W20', '2027-W50', '2025-W30'];

/** Random entries, lift-matched to their slot most of the time, one variant per cell. */
export function randomEntries(
  r: Rand,
  athleteId: string,
  weeks: string[],
  slots: SlotDef[],
  variants: Variant[],
  fill: number,
): PlanEntry[] {
  const out: PlanEntry[] = [];
  for (const week of weeks) {
    for (const s of slots) {
      if (!chance(r, fill)) continue;
      const fitting = variants.filter((v) => s.lifts.includes(v.lift));
      const v = fitting.length && chance(r, 0.9) ? pick(r, fitting) : pick(r, variants);
      if (v) out.push({ athleteId, week, slotId: s.id, variantId: v.id });
    }
  }
  return out;
}

export interface RequestOptions {
  athletes?: number;
  weeks?: number;
  historyWeeks?: number;
  variants?: number;
  slots?: SlotDef[];
  planned?: number; // share of cells already on the board
  pinned?: number; // share of board entries that are pinned
  restrictions?: boolean;
  lifts?: Lift[];
  /** Add version-2 inputs: archived and meet-phase variants, dated restrictions of every kind, risk ceilings, rest weeks, comfort ratio, lift balance. */
  version2?: boolean;
}

/**
 * Adds random version-2 inputs to a request, from a stream of its own (so the version-1 parts of the
 * request stay what they were for the same seed).
 */
export function withVersion2(req: PlanRequest, seed: number): PlanRequest {
  const r = mulberry32(seed ^ 0x5eed_2222);
  const families = [...new Set(req.variants.map((v) => v.family))];
  const variants = req.variants.map((v) => ({
    ...v,
    ...(chance(r, 0.1) ? { archived: true } : {}),
    ...(chance(r, 0.12) ? { meetPhaseWeeks: int(r, 0, 4) } : {}),
  }));
  const weeks = req.weeks;
  const someWeek = (): string => addWeeks(weeks[0]!, int(r, -2, weeks.length + 1));
  const athletes = req.athletes.map((a) => {
    const restrictions = [...a.restrictions];
    if (chance(r, 0.5)) {
      const from = chance(r, 0.7) ? someWeek() : undefined;
      const to = chance(r, 0.6) ? addWeeks(from ?? weeks[0]!, int(r, 0, 4)) : undefined;
      const kind = int(r, 0, 2);
      restrictions.push({
        ...(kind === 0 ? { joint: pick(r, JOINTS), maxStress: int(r, 0, 2) } : {}),
        ...(kind === 1 ? { emphasis: [pick(r, EMPHASES)] } : {}),
        ...(kind === 2 ? { families: [pick(r, families)] } : {}),
        ...(from ? { fromWeek: from } : {}),
        ...(to ? { toWeek: to } : {}),
      });
    }
    const restWeeks = weeks.filter(() => chance(r, 0.15));
    return {
      ...a,
      restrictions,
      ...(chance(r, 0.3) ? { maxRisk: int(r, 1, 3) as 1 | 2 | 3 } : {}),
      ...(restWeeks.length ? { restWeeks } : {}),
    };
  });
  const rules = {
    ...req.rules,
    ...(chance(r, 0.5) ? { comfortRatio: Math.round((0.5 + 0.45 * r()) * 100) / 100 } : {}),
    ...(chance(r, 0.6) ? { liftBalanceWeeks: int(r, 1, 3) } : {}),
  };
  return { ...req, variants, athletes, rules };
}

export function randomAthlete(
  r: Rand,
  id: string,
  weeks: string[],
  slots: SlotDef[],
  variants: Variant[],
  historyWeeks: number,
  restrictions = true,
): AthleteInput {
  const hist = historyWeeks > 0 ? weekRange(addWeeks(weeks[0]!, -historyWeeks), addWeeks(weeks[0]!, -1)) : [];
  const meet = chance(r, 0.7) ? addWeeks(weeks[0]!, int(r, -1, weeks.length + 3)) : undefined;
  return {
    id,
    equipment: EQUIPMENT.filter(() => chance(r, 0.7)),
    restrictions: restrictions && chance(r, 0.3) ? [{ joint: pick(r, JOINTS), maxStress: int(r, 0, 2) }] : [],
    ...(meet ? { meetWeek: meet } : {}),
    history: randomEntries(r, id, hist, slots, variants, 0.9),
  };
}

export function randomRequest(seed: number, opts: RequestOptions = {}): PlanRequest {
  const r = mulberry32(seed);
  const slots = opts.slots ?? pick(r, SLOT_SETS);
  const variants = randomLibrary(r, opts.variants ?? int(r, 4, 30), opts.lifts ? { lifts: opts.lifts } : {});
  const start = pick(r, STARTS);
  const weeks = weekRange(start, addWeeks(start, (opts.weeks ?? int(r, 1, 8)) - 1));
  const athletes: AthleteInput[] = [];
  const planned: PlanEntry[] = [];
  const n = opts.athletes ?? int(r, 1, 3);
  for (let i = 0; i < n; i++) {
    const a = randomAthlete(
      r,
      `a${i}`,
      weeks,
      slots,
      variants,
      opts.historyWeeks ?? int(r, 0, 8),
      opts.restrictions ?? true,
    );
    athletes.push(a);
    for (const e of randomEntries(r, a.id, weeks, slots, variants, opts.planned ?? 0.3)) {
      planned.push(chance(r, opts.pinned ?? 0.3) ? { ...e, pinned: true } : e);
    }
  }
  if (planned.length && chance(r, 0.2))
    planned.push({ ...planned[0]!, variantId: 'no-such-variant', pinned: false, week: weeks[weeks.length - 1]! });
  const req = { variants, slots, athletes, rules: randomRules(r, `s${seed}`), weeks, planned };
  return opts.version2 ? withVersion2(req, seed) : req;
}

/**
 * A small single-athlete case the exhaustive planner can settle: 3–8 variants, 1–5 weeks, 1–2 slots,
 * budgets on the joints the variants load, sized so that they often bind.
 */
export function smallCase(seed: number, opts: { version2?: boolean } = {}): PlanRequest {
  const r = mulberry32(seed);
  const slots = chance(r, 0.5) ? TWO_SLOTS : [TWO_SLOTS[0]!];
  const n = int(r, slots.length === 2 ? 5 : 3, 8);
  const lifts: Lift[] = slots.length === 2 ? ['squat', 'bench', 'deadlift', 'bench'] : ['squat', 'deadlift'];
  const variants = randomLibrary(r, n, { lifts, equipmentChance: 0.15, familiesPerLift: int(r, 2, 5) });
  const start = pick(r, STARTS);
  const weeks = weekRange(start, addWeeks(start, int(r, 1, 5) - 1));
  const J = int(r, 1, 4);
  const jointBudget: Partial<Record<Joint, number>> = {};
  for (const j of JOINTS) if (chance(r, 0.45)) jointBudget[j] = int(r, 1, 3 * J * slots.length);
  const rules: Rules = {
    repeatWindowWeeks: int(r, 0, 4),
    familyWindowWeeks: int(r, 0, 3),
    jointWindowWeeks: J,
    jointBudget,
    taper: chance(r, 0.4) ? [{ weeksOut: int(r, 0, 3), maxRisk: int(r, 1, 3) as 1 | 2 | 3 }] : [],
    seed: `small${seed}`,
  };
  const athlete = randomAthlete(r, 'a0', weeks, slots, variants, int(r, 0, 4), chance(r, 0.3));
  athlete.equipment = [...EQUIPMENT];
  const req = { variants, slots, athletes: [athlete], rules, weeks, planned: [] };
  return opts.version2 ? withVersion2(req, seed) : req;
}

/** A small invented library with the trade's ordinary exercise names, for worked examples. */
export const HAND_LIBRARY: Variant[] = [
  {
    id: 'box-ssb',
    name: 'Box squat, parallel box, safety bar',
    lift: 'squat',
    family: 'box-squat',
    risk: 2,
    specificity: 0.7,
    stress: { knee: 1, hip: 2, lowerBack: 2 },
    equipment: ['safety bar', 'box'],
    emphasis: 'bottom',
    bar: 'safety bar',
  },
  {
    id: 'box-low',
    name: 'Box squat, low box',
    lift: 'squat',
    family: 'box-squat',
    risk: 2,
    specificity: 0.75,
    stress: { knee: 2, hip: 2, lowerBack: 1 },
    equipment: ['box'],
    emphasis: 'bottom',
    bar: 'straight bar',
  },
  {
    id: 'pause-squat',
    name: 'Pause squat',
    lift: 'squat',
    family: 'pause-squat',
    risk: 1,
    specificity: 0.9,
    stress: { knee: 2, hip: 1, lowerBack: 1 },
    equipment: [],
    emphasis: 'bottom',
    bar: 'straight bar',
  },
  {
    id: 'gm-cambered',
    name: 'Good morning, cambered bar',
    lift: 'squat',
    family: 'good-morning',
    risk: 3,
    specificity: 0.3,
    stress: { lowerBack: 3, hip: 3 },
    equipment: ['cambered bar'],
    emphasis: 'midRange',
    bar: 'cambered bar',
  },
  {
    id: 'rack-pull',
    name: 'Rack pull, below the knee',
    lift: 'deadlift',
    family: 'rack-pull',
    risk: 2,
    specificity: 0.5,
    stress: { lowerBack: 2, hip: 1 },
    equipment: ['pins'],
    emphasis: 'lockout',
    bar: 'straight bar',
  },
  {
    id: 'deficit-pull',
    name: 'Deficit deadlift, 5 cm',
    lift: 'deadlift',
    family: 'deficit-pull',
    risk: 3,
    specificity: 0.8,
    stress: { lowerBack: 3, hip: 2, knee: 1 },
    equipment: ['blocks'],
    emphasis: 'bottom',
    bar: 'straight bar',
  },
  {
    id: 'paused-pull',
    name: 'Paused deadlift',
    lift: 'deadlift',
    family: 'paused-pull',
    risk: 1,
    specificity: 0.95,
    stress: { lowerBack: 2, hip: 2 },
    equipment: [],
    emphasis: 'midRange',
    bar: 'straight bar',
  },
  {
    id: 'floor-press',
    name: 'Floor press',
    lift: 'bench',
    family: 'floor-press',
    risk: 1,
    specificity: 0.6,
    stress: { elbow: 2, wrist: 1 },
    equipment: [],
    emphasis: 'lockout',
    bar: 'straight bar',
  },
  {
    id: 'board-2',
    name: 'Two-board press, close grip',
    lift: 'bench',
    family: 'board-press',
    risk: 2,
    specificity: 0.65,
    stress: { elbow: 3, wrist: 2, shoulder: 1 },
    equipment: ['boards'],
    emphasis: 'lockout',
    bar: 'straight bar',
  },
  {
    id: 'pin-press',
    name: 'Pin press, chest height',
    lift: 'bench',
    family: 'pin-press',
    risk: 2,
    specificity: 0.7,
    stress: { shoulder: 2, elbow: 1 },
    equipment: ['pins'],
    emphasis: 'bottom',
    bar: 'straight bar',
  },
  {
    id: 'long-pause-bench',
    name: 'Long-pause bench',
    lift: 'bench',
    family: 'pause-bench',
    risk: 1,
    specificity: 0.95,
    stress: { shoulder: 2, elbow: 1, wrist: 1 },
    equipment: [],
    emphasis: 'bottom',
    bar: 'straight bar',
  },
  {
    id: 'reverse-band-bench',
    name: 'Reverse-band bench',
    lift: 'bench',
    family: 'band-bench',
    risk: 3,
    specificity: 0.6,
    stress: { shoulder: 1, elbow: 2, wrist: 2 },
    equipment: ['bands'],
    emphasis: 'lockout',
    bar: 'straight bar',
  },
];

export const ALL_GEAR = ['safety bar', 'box', 'cambered bar', 'pins', 'blocks', 'boards', 'bands'];

/** Rules that switch every rule off, for examples that turn on one rule at a time. */
export function quietRules(extra: Partial<Rules> = {}): Rules {
  return {
    repeatWindowWeeks: 0,
    familyWindowWeeks: 0,
    jointWindowWeeks: 4,
    jointBudget: {},
    taper: [],
    seed: 'example',
    ...extra,
  };
}

export function athlete(extra: Partial<AthleteInput> = {}): AthleteInput {
  return { id: 'nora', equipment: [...ALL_GEAR], restrictions: [], history: [], ...extra };
}

export function entry(week: string, slotId: string, variantId: string, extra: Partial<PlanEntry> = {}): PlanEntry {
  return { athleteId: 'nora', week, slotId, variantId, ...extra };
}

export function handRequest(extra: Partial<PlanRequest> = {}): PlanRequest {
  return {
    variants: HAND_LIBRARY,
    slots: TWO_SLOTS,
    athletes: [athlete()],
    rules: quietRules(),
    weeks: ['2027-W03'],
    planned: [],
    ...extra,
  };
}
