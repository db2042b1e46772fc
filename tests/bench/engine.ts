// Rotation engine benchmark: plan speed at team scale (with and without the version-2 inputs), live
// drag checks and the planner's score per candidate, and plan quality against an exhaustive planner on
// small cases. Prints one JSON object; run with `npx tsx tests/bench/engine.ts`.

import { generatePlan, peakLoadRatio, prepareCandidateChecks, explainCandidate } from '../../shared/engine/index';
import type { AthleteInput, PlanEntry, PlanRequest, Rules, Variant } from '../../shared/engine/types';
import { addWeeks, weekRange } from '../../shared/engine/weeks';
import { exhaustive } from '../shared/engine/exhaustive';
import {
  EQUIPMENT,
  TWO_SLOTS,
  chance,
  int,
  mulberry32,
  pick,
  randomLibrary,
  smallCase,
  withVersion2,
} from '../shared/engine/fixtures';

const RULES: Rules = {
  repeatWindowWeeks: 6,
  familyWindowWeeks: 3,
  jointWindowWeeks: 4,
  jointBudget: { lowerBack: 9, knee: 9, hip: 9, shoulder: 9, elbow: 8, wrist: 8 },
  taper: [
    { weeksOut: 3, maxRisk: 2 },
    { weeksOut: 1, maxRisk: 1, minSpecificity: 0.7 },
  ],
  seed: 'bench',
};
const FIRST = '2027-W10';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** Median of `runs` timed calls after `warmup` untimed ones (the first calls also pay for compiling). */
function timeIt(runs: number, f: () => void, warmup = 3): number {
  for (let i = 0; i < warmup; i++) f();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    f();
    t.push(performance.now() - t0);
  }
  return Math.round(median(t) * 1000) / 1000;
}

/** A team whose history the engine itself planned (all weeks at once), so that it follows the rules. */
function team(
  n: number,
  variants: Variant[],
  historyWeeks: number,
  seed: number,
  meetFrom: number,
  meetTo: number,
  meetShare = 0.8,
): AthleteInput[] {
  const r = mulberry32(seed);
  const athletes: AthleteInput[] = [];
  for (let i = 0; i < n; i++) {
    const meet = chance(r, meetShare) ? addWeeks(FIRST, int(r, meetFrom, meetTo)) : undefined;
    athletes.push({
      id: `ath${i}`,
      equipment: EQUIPMENT.filter(() => chance(r, 0.75)),
      restrictions: chance(r, 0.15) ? [{ joint: pick(r, ['elbow', 'lowerBack', 'knee'] as const), maxStress: 1 }] : [],
      ...(meet ? { meetWeek: meet } : {}),
      history: [],
    });
  }
  if (historyWeeks > 0) {
    const weeks = weekRange(addWeeks(FIRST, -historyWeeks), addWeeks(FIRST, -1));
    const past = generatePlan({
      variants,
      slots: TWO_SLOTS,
      athletes: athletes.map((a) => ({ ...a, meetWeek: undefined })),
      rules: RULES,
      weeks,
    });
    for (const a of athletes)
      a.history = past.entries.filter((e) => e.athleteId === a.id).map(({ reasons: _r, ...e }) => e);
  }
  return athletes;
}

export async function runEngineBench(): Promise<Record<string, unknown>> {
  const variants = randomLibrary(mulberry32(42), 300);

  // (a) one week for 200 athletes × 2 slots, 12 weeks of history.
  const reqA: PlanRequest = {
    variants,
    slots: TWO_SLOTS,
    athletes: team(200, variants, 12, 1, 0, 12),
    rules: RULES,
    weeks: [FIRST],
  };
  const a = timeIt(15, () => generatePlan(reqA), 8);
  const resA = generatePlan(reqA);

  // (b) 16 weeks up to a meet for 50 athletes.
  const athletesB = team(50, variants, 12, 2, 15, 15, 1);
  const reqB: PlanRequest = {
    variants,
    slots: TWO_SLOTS,
    athletes: athletesB,
    rules: RULES,
    weeks: weekRange(FIRST, addWeeks(FIRST, 15)),
  };
  const b = timeIt(7, () => generatePlan(reqB), 3);
  const resB = generatePlan(reqB);

  // (e) the same 16 weeks when every athlete nurses an elbow and a shoulder: few bench variants fit,
  // so no complete plan exists and the planner must decide which cells to give up.
  const reqE: PlanRequest = {
    ...reqB,
    athletes: athletesB.map((x) => ({
      ...x,
      restrictions: [
        { joint: 'elbow', maxStress: 0 },
        { joint: 'shoulder', maxStress: 1 },
      ],
    })),
  };
  const e = timeIt(5, () => generatePlan(reqE), 2);
  const resE = generatePlan(reqE);

  // (f) the same 16 weeks with version-2 inputs: lift balance, comfort line, dated restrictions of every
  // kind, risk ceilings, rest weeks, archived and meet-phase variants.
  const reqF = withVersion2({ ...reqB, rules: { ...RULES, liftBalanceWeeks: 2 } }, 7);
  const f = timeIt(7, () => generatePlan(reqF), 3);
  const resF = generatePlan(reqF);

  // (c) drag checks on a board of 40 athletes × 9 weeks with the current plan on it.
  const athletesC = team(40, variants, 12, 3, 2, 20);
  const weeksC = weekRange(FIRST, addWeeks(FIRST, 8));
  const planC = generatePlan({ variants, slots: TWO_SLOTS, athletes: athletesC, rules: RULES, weeks: weeksC });
  const planned: PlanEntry[] = planC.entries.map(({ reasons: _r, ...e }) => e);
  const reqC: PlanRequest = { variants, slots: TWO_SLOTS, athletes: athletesC, rules: RULES, weeks: weeksC, planned };
  const cell = { athleteId: 'ath7', week: weeksC[4]!, slotId: 'lower' };
  const explainAll = (req: PlanRequest) => {
    for (const v of variants) explainCandidate(req, cell.athleteId, cell.week, cell.slotId, v.id);
  };
  const cWarm = timeIt(21, () => explainAll(reqC));
  const cCold = timeIt(21, () => explainAll({ ...reqC }));
  const prepare = timeIt(21, () =>
    prepareCandidateChecks({ ...reqC }).explain('ath0', FIRST, 'lower', variants[0]!.id),
  );
  const checks = prepareCandidateChecks(reqC);
  const dragged = variants[10]!.id;
  const rateAll = () => {
    for (const ath of athletesC)
      for (const week of weeksC) for (const slot of TWO_SLOTS) checks.rate(ath.id, week, slot.id, dragged);
  };
  const rate720 = timeIt(21, rateAll);
  // The planner's score of every library variant for one cell (the "What fits here" ranking).
  const scoreAll = () => {
    for (const v of variants) checks.score(cell.athleteId, cell.week, cell.slotId, v.id);
  };
  const score300 = timeIt(21, scoreAll);
  const rate720Cold = timeIt(11, () => {
    const fresh = prepareCandidateChecks({ ...reqC });
    for (const ath of athletesC)
      for (const week of weeksC) for (const slot of TWO_SLOTS) fresh.rate(ath.id, week, slot.id, dragged);
  });

  // (d) quality on small random cases against the exhaustive optimum. Under the comfort line a lighter
  // plan is not preferred, so the gap is measured against the optimum or the comfort line, whichever
  // is higher.
  const gaps: number[] = [];
  const COMFORT = 0.8;
  let feasible = 0;
  let complete = 0;
  const cases = 500;
  const t0 = performance.now();
  for (let s = 0; s < cases; s++) {
    const req = smallCase(100_000 + s);
    const ex = exhaustive(req);
    const res = generatePlan(req);
    if (!ex.feasible) continue;
    feasible++;
    if (res.unfilled.length > 0) continue;
    complete++;
    const p = peakLoadRatio(req, req.athletes[0]!.id, res.entries);
    const target = Math.max(ex.bestPeak, COMFORT);
    gaps.push(Math.max(0, p - target) / target);
  }
  const qualityMs = performance.now() - t0;
  gaps.sort((x, y) => x - y);
  const round = (x: number) => Math.round(x * 10_000) / 10_000;

  return {
    a_oneWeek_200athletes_2slots_ms: a,
    a_unfilled: resA.unfilled.length,
    b_sixteenWeeks_50athletes_ms: b,
    b_unfilled: resB.unfilled.length,
    e_overConstrained_16weeks_50athletes_ms: e,
    e_unfilled: resE.unfilled.length,
    f_version2_16weeks_50athletes_ms: f,
    f_unfilled: resF.unfilled.length,
    c_explain_300variants_oneCell_ms: cWarm,
    c_explain_300variants_oneCell_coldRequest_ms: cCold,
    c_prepare_ms: prepare,
    c_rate_720cells_ms: rate720,
    c_rate_720cells_withPrepare_ms: rate720Cold,
    c_score_300variants_oneCell_ms: score300,
    d_cases: cases,
    d_feasible: feasible,
    d_complete: complete,
    d_shareWithin10pct: round(gaps.filter((g) => g <= 0.1 + 1e-9).length / Math.max(1, feasible)),
    d_meanGap: round(gaps.reduce((x, y) => x + y, 0) / Math.max(1, gaps.length)),
    d_p95Gap: round(gaps[Math.floor(0.95 * (gaps.length - 1))] ?? 0),
    d_maxGap: round(gaps[gaps.length - 1] ?? 0),
    d_total_ms: Math.round(qualityMs),
    goals: { a_ms: 25, b_ms: 300, c_ms: 2, c_score_ms: 30, d_p95Gap: 0.05 },
  };
}

const direct =
  typeof process !== 'undefined' &&
  process.argv[1] !== undefined &&
  import.meta.url.endsWith(process.argv[1].replace(/\\/g, '/'));
if (direct) {
  void runEngineBench().then((r) => console.log(JSON.stringify(r, null, 2)));
}
