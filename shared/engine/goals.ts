// The soft goals, in their order: comfort, lift balance, variety, effect. Comfort and lift balance are
// met by the planner's search (it first looks for a plan that keeps them); variety and effect are a
// score per candidate, written here once and used by the planner, its reasons and candidateScore.

/** Recency counts up to half a year; older or never used rank alike. */
export const RECENCY_CAP = 26;

/**
 * Score weights (higher score = preferred). Each line says why it has its size.
 * Only the ratios between them matter.
 */
export const WEIGHTS = {
  /** Per unit of joint load ratio above the comfort line: when the line cannot be kept, the least excess first. */
  comfortExcess: 1000,
  /** A family that already has its fair share of a slot's picks: outweighs any recency difference (at most 81). */
  fairShare: 200,
  /** Per week since the family was last used: variety works on families first… */
  familyRecency: 2,
  /** …then on variants within them. */
  variantRecency: 1,
  /** Per unit of specificity in a taper week: closer to the meet lifts, but after variety (4 weeks of family recency). */
  taperSpecificity: 8,
  /** Per unit of specificity above the slot's eligible mean outside taper weeks: 0.1 counts like a week of family recency. */
  specificity: 20,
  /** Per unit the running mean specificity of the slot's picks would fall below the eligible mean. */
  specificityDeficit: 30,
  /** Emphasis and bar that differ from last week's pick (and, less, next week's). */
  emphasisAfter: 1.5,
  emphasisBefore: 0.75,
  barAfter: 0.75,
  barBefore: 0.4,
  /** Seeded noise, so near-equal choices differ by seed (a reshuffle): about 0.1 of specificity. */
  tieBreak: 2.5,
} as const;

/** The parts of a candidate's score, in priority order (for saying which goal decided). */
export const TERM = {
  comfort: 0,
  fairShare: 1,
  familyRecency: 2,
  variantRecency: 3,
  specificity: 4,
  vary: 5,
  tieBreak: 6,
} as const;
export const TERM_COUNT = 7;
export type Term = keyof typeof TERM;
export const TERM_NAMES = Object.keys(TERM) as Term[];

/** What the score of one candidate in one cell depends on. */
export interface PreferenceInput {
  /** Weeks since the family / the variant was last used before this week (Infinity: never). */
  familyGap: number;
  variantGap: number;
  /** Highest load ratio over the variant's budgeted joints in the spans around the week, with it added. */
  loadRatio: number;
  comfortRatio: number;
  /** This family's picks already in the slot over the planned weeks, and its fair share. */
  familyPicks: number;
  fairShare: number;
  taper: boolean;
  specificity: number;
  /** Mean specificity of the variants eligible for the slot, and the running surplus of the slot's picks over it. */
  eligibleMean: number;
  surplus: number;
  emphasis: number;
  emphasisBefore: number; // last week's pick in the slot (−1: none or not given)
  emphasisAfter: number; // next week's
  bar: number;
  barBefore: number;
  barAfter: number;
  noise: number; // 0…1
}

export function newPreferenceInput(): PreferenceInput {
  return {
    familyGap: Infinity,
    variantGap: Infinity,
    loadRatio: 0,
    comfortRatio: 0.8,
    familyPicks: 0,
    fairShare: Infinity,
    taper: false,
    specificity: 0,
    eligibleMean: 0,
    surplus: 0,
    emphasis: -1,
    emphasisBefore: -1,
    emphasisAfter: -1,
    bar: -1,
    barBefore: -1,
    barAfter: -1,
    noise: 0,
  };
}

/** Variety bonus: full when two tags differ, half when either is unknown (−1), none when equal. */
function differs(a: number, b: number, full: number): number {
  if (a < 0 || b < 0) return full / 2;
  return a === b ? 0 : full;
}

/** The candidate's score; with `terms` (length TERM_COUNT), also its parts, for saying which goal decided. */
export function preference(p: PreferenceInput, terms?: Float64Array): number {
  // Comfort: nothing under the line (a lighter variant is not preferred there), the excess above it.
  const comfort = -WEIGHTS.comfortExcess * Math.max(0, p.loadRatio - p.comfortRatio);
  const fairShare = p.familyPicks >= p.fairShare ? -WEIGHTS.fairShare : 0;
  const familyRecency = WEIGHTS.familyRecency * Math.min(p.familyGap, RECENCY_CAP + 1);
  const variantRecency = WEIGHTS.variantRecency * Math.min(p.variantGap, RECENCY_CAP + 1);
  let specificity: number;
  if (p.taper) specificity = WEIGHTS.taperSpecificity * p.specificity;
  else {
    const above = p.specificity - p.eligibleMean;
    specificity = WEIGHTS.specificity * above + WEIGHTS.specificityDeficit * Math.min(0, p.surplus + above);
  }
  const vary =
    differs(p.emphasis, p.emphasisBefore, WEIGHTS.emphasisAfter) +
    differs(p.emphasis, p.emphasisAfter, WEIGHTS.emphasisBefore) +
    differs(p.bar, p.barBefore, WEIGHTS.barAfter) +
    differs(p.bar, p.barAfter, WEIGHTS.barBefore);
  const tieBreak = WEIGHTS.tieBreak * p.noise;
  if (terms) {
    terms[TERM.comfort] = comfort;
    terms[TERM.fairShare] = fairShare;
    terms[TERM.familyRecency] = familyRecency;
    terms[TERM.variantRecency] = variantRecency;
    terms[TERM.specificity] = specificity;
    terms[TERM.vary] = vary;
    terms[TERM.tieBreak] = tieBreak;
  }
  return comfort + fairShare + familyRecency + variantRecency + specificity + vary + tieBreak;
}

/** The first term, in priority order, on which `chosen` beats `other` (null: none does). */
export function decidingTerm(chosen: ArrayLike<number>, other: ArrayLike<number>): Term | null {
  for (let i = 0; i < TERM_COUNT; i++) if (chosen[i]! > other[i]! + 1e-9) return TERM_NAMES[i]!;
  return null;
}

/** A family's fair share of a slot over a plan: ⌈weeks ÷ eligible families⌉ + 1 picks. */
export function fairShareOf(weeks: number, eligibleFamilies: number): number {
  return eligibleFamilies > 0 ? Math.ceil(weeks / eligibleFamilies) + 1 : Infinity;
}

export function bitCount(mask: number): number {
  let n = 0;
  for (let m = mask; m; m &= m - 1) n++;
  return n;
}

/** What the lift-balance goal needs to know about one slot of one athlete. */
export interface BalanceView {
  /** liftBalanceWeeks: every span of this many weeks should hold each required lift. */
  span: number;
  /** The slot's lifts the athlete has an eligible variant for, as lift bits. */
  required: number;
  /** Spans are judged when they end within these weeks (later weeks are not planned yet). */
  planFirst: number;
  planLast: number;
  /** The lift bit of the entry in the slot's cell of week w (0: none). */
  liftAt(w: number): number;
  /** Whether the slot's cell of week w is empty and still to be filled. */
  openAt(w: number): boolean;
}

/**
 * The lifts (among `lifts`) that a pick in the slot's cell of week w may have without leaving some span
 * around w unable to hold every required lift. A span counts when it has at least as many cells (entries,
 * cells still to fill, and this one) as there are required lifts; others cannot be balanced anyway.
 */
export function balancedLifts(view: BalanceView, w: number, lifts: number): number {
  const need = bitCount(view.required);
  if (need < 2) return lifts;
  let allowed = lifts;
  const n = view.span;
  for (let start = w - n + 1; start <= w; start++) {
    const end = start + n - 1;
    if (end < view.planFirst || end > view.planLast) continue;
    let present = 0;
    let open = 0;
    let cells = 1;
    for (let x = start; x <= end; x++) {
      if (x === w) continue;
      const lift = view.liftAt(x);
      if (lift) {
        present |= lift;
        cells++;
      } else if (view.openAt(x)) {
        open++;
        cells++;
      }
    }
    if (cells < need) continue;
    for (let bit = 1; bit <= 4; bit <<= 1) {
      if (!(allowed & bit)) continue;
      if (bitCount(view.required & ~(present | bit)) > open) allowed &= ~bit;
    }
  }
  return allowed;
}
