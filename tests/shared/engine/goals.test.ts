// Worked examples, computed by hand, for the version-2 soft goals in their order (comfort, lift balance,
// variety, effect), the reason line that names the deciding goal, and the planner's score per candidate.
import { describe, expect, it } from 'vitest';
import {
  candidateScore,
  generatePlan,
  prepareCandidateChecks,
  type PlanRequest,
  type Variant,
} from '../../../shared/engine/index';
import { weekRange } from '../../../shared/engine/weeks';
import { HAND_LIBRARY, athlete, entry, handRequest, quietRules } from './fixtures';

const only = (...ids: string[]) => HAND_LIBRARY.filter((v) => ids.includes(v.id));
const PULL_DAY = [{ id: 'pull-day', lifts: ['deadlift' as const] }];

describe('comfort', () => {
  it('does not prefer a lighter variant while every joint stays under the line', () => {
    // Lower-back budget 10 over 2 weeks, nothing in history: a deficit pull (3, 30%) and a rack pull
    // (2, 20%) are both under the 80% line, so the lighter rack pull earns nothing for being lighter.
    const req = handRequest({
      variants: only('deficit-pull', 'rack-pull'),
      slots: PULL_DAY,
      weeks: ['2027-W03'],
      rules: quietRules({ jointWindowWeeks: 2, jointBudget: { lowerBack: 10 } }),
    });
    // Both are comfortable (3 or 2 of 10); the heavier deficit pull wins on specificity (0.8 over 0.5).
    const pick = generatePlan(req).entries[0]!;
    expect(pick.variantId).toBe('deficit-pull');
    expect(pick.reasons[0]).toBe(
      "chosen for effect: specificity 0.8 keeps the pull-day picks' mean at or above the library's",
    );
    expect(pick.reasons).toContain('comfort: every joint stays at or under 80% of its budget');
  });

  it('keeps every joint at or under the line when some plan can, even against specificity', () => {
    // Budget 5 over 2 weeks, a paused pull (2) last week: the deficit pull would make 5 of 5 (100%), the
    // rack pull 4 of 5 (80%, on the line): the rack pull keeps the plan comfortable.
    const req = handRequest({
      variants: only('deficit-pull', 'rack-pull', 'paused-pull'),
      slots: PULL_DAY,
      weeks: ['2027-W03'],
      rules: quietRules({ repeatWindowWeeks: 2, jointWindowWeeks: 2, jointBudget: { lowerBack: 5 } }),
      athletes: [athlete({ history: [entry('2027-W02', 'pull-day', 'paused-pull')] })],
    });
    const pick = generatePlan(req).entries[0]!;
    expect(pick.variantId).toBe('rack-pull');
    expect(pick.reasons).toContain('comfort: every joint stays at or under 80% of its budget');
    // With the line at 100% the more specific deficit pull is fine again.
    const loose = generatePlan({ ...req, rules: { ...req.rules, comfortRatio: 1 } }).entries[0]!;
    expect(loose.variantId).toBe('deficit-pull');
  });
});

describe('lift balance', () => {
  const lowerOnly = (extra: Partial<PlanRequest>) =>
    handRequest({
      variants: only('pause-squat', 'box-low', 'rack-pull'),
      slots: [{ id: 'lower', lifts: ['squat', 'deadlift'] }],
      rules: quietRules({ liftBalanceWeeks: 2 }),
      ...extra,
    });

  it('puts each lift of a multi-lift slot in every span of liftBalanceWeeks weeks', () => {
    // Squats are more specific and more numerous, yet with a squat last week the pull must come now.
    const req = lowerOnly({
      weeks: ['2027-W03'],
      athletes: [athlete({ history: [entry('2027-W02', 'lower', 'box-low')] })],
    });
    const pick = generatePlan(req).entries[0]!;
    expect(pick.variantId).toBe('rack-pull');
    expect(pick.reasons).toContain('lift balance: squat and deadlift each at least once in any 2 weeks');
    // Over six weeks from scratch: squat and deadlift alternate.
    const long = generatePlan(lowerOnly({ weeks: weekRange('2027-W03', '2027-W08') }));
    const lifts = long.entries.map((e) => HAND_LIBRARY.find((v) => v.id === e.variantId)!.lift);
    for (let i = 1; i < lifts.length; i++) expect(lifts[i]).not.toBe(lifts[i - 1]);
  });

  it('warns, without a break, about a drop that upsets it', () => {
    const req = lowerOnly({
      weeks: ['2027-W03', '2027-W04'],
      planned: [entry('2027-W03', 'lower', 'box-low')],
      athletes: [athlete({ history: [entry('2027-W02', 'lower', 'rack-pull')] })],
    });
    const rating = prepareCandidateChecks(req).rate('nora', '2027-W04', 'lower', 'pause-squat');
    expect(rating.status).toBe('warning');
    expect(rating.violations).toEqual([]);
    expect(rating.warnings).toContain(
      'lift balance: the lower slot should hold squat and deadlift in any 2 weeks; this leaves no week for deadlift',
    );
    expect(prepareCandidateChecks(req).rate('nora', '2027-W04', 'lower', 'rack-pull').status).toBe('clean');
  });
});

describe('variety', () => {
  it('gives no family more than its fair share of a slot', () => {
    // Three eligible families over 12 weeks: at most ⌈12 ÷ 3⌉ + 1 = 5 picks each, even though one family
    // holds four very specific variants.
    const mk = (id: string, family: string, specificity: number): Variant => ({
      id,
      name: id,
      lift: 'bench',
      family,
      risk: 1,
      specificity,
      stress: {},
      equipment: [],
    });
    const variants = [
      mk('a1', 'alpha', 0.95),
      mk('a2', 'alpha', 0.95),
      mk('a3', 'alpha', 0.95),
      mk('a4', 'alpha', 0.95),
      mk('b1', 'beta', 0.4),
      mk('c1', 'gamma', 0.4),
    ];
    const req = handRequest({
      variants,
      slots: [{ id: 'upper', lifts: ['bench'] }],
      weeks: weekRange('2027-W03', '2027-W14'),
      rules: quietRules({ repeatWindowWeeks: 2 }),
    });
    const res = generatePlan(req);
    expect(res.unfilled).toEqual([]);
    const count = (f: string) => res.entries.filter((e) => variants.find((v) => v.id === e.variantId)!.family === f);
    expect(count('alpha').length).toBeLessThanOrEqual(5);
    expect(count('beta').length).toBeGreaterThanOrEqual(1);
    expect(count('gamma').length).toBeGreaterThanOrEqual(1);
  });

  it('names the least recently used family as the deciding goal', () => {
    const req = handRequest({
      variants: only('pause-squat', 'box-low'),
      slots: [{ id: 'squat-day', lifts: ['squat'] }],
      weeks: ['2027-W06'],
      athletes: [
        athlete({
          history: [entry('2027-W02', 'squat-day', 'box-low'), entry('2027-W05', 'squat-day', 'pause-squat')],
        }),
      ],
    });
    const pick = generatePlan(req).entries[0]!;
    expect(pick.variantId).toBe('box-low');
    expect(pick.reasons[0]).toBe('chosen for variety: the box-squat family was used less recently than pause-squat');
  });
});

describe("the planner's score per candidate", () => {
  const req = handRequest({
    weeks: ['2027-W06'],
    rules: quietRules({ jointBudget: { lowerBack: 12 }, liftBalanceWeeks: 2 }),
    athletes: [
      athlete({ history: [entry('2027-W04', 'lower', 'box-low'), entry('2027-W05', 'lower', 'pause-squat')] }),
    ],
  });

  it('ranks the pick the planner makes first among the lower variants', () => {
    const pick = generatePlan(req).entries.find((e) => e.slotId === 'lower')!;
    const lower = HAND_LIBRARY.filter((v) => v.lift !== 'bench');
    const checks = prepareCandidateChecks(req);
    const clean = lower.filter((v) => checks.rate('nora', '2027-W06', 'lower', v.id).status === 'clean');
    const scores = clean.map((v) => [v.id, checks.score('nora', '2027-W06', 'lower', v.id)] as const);
    const best = scores.reduce((a, b) => (b[1] < a[1] ? b : a));
    expect(best[0]).toBe(pick.variantId);
    expect(candidateScore(req, 'nora', '2027-W06', 'lower', pick.variantId)).toBe(best[1]);
  });

  it('prefers a family not used for weeks to the one used last week, and knows nothing of unknown ids', () => {
    const checks = prepareCandidateChecks(req);
    const score = (id: string) => checks.score('nora', '2027-W06', 'lower', id);
    expect(score('paused-pull')).toBeLessThan(score('pause-squat'));
    expect(score('no-such-variant')).toBe(Infinity);
    expect(checks.score('nobody', '2027-W06', 'lower', 'paused-pull')).toBe(Infinity);
  });
});
