// Live drag checks (explainCandidate, prepared checks with warnings), the joint-load strip, and the
// plain-words reasons on generated picks, on hand-computed boards.
import { describe, expect, it } from 'vitest';
import {
  explainCandidate,
  generatePlan,
  jointLoadSeries,
  peakLoadRatio,
  prepareCandidateChecks,
} from '../../../shared/engine/index';
import { athlete, entry, handRequest, quietRules } from './fixtures';

describe('explainCandidate', () => {
  it('ignores the entry currently in the target cell and counts everything else', () => {
    // Board: pause squat in 2027-W03 lower (the target cell) and in nothing else. Dropping a pause
    // squat onto its own cell breaks nothing; onto 2027-W04 it clashes with 2027-W03.
    const req = handRequest({
      weeks: ['2027-W03', '2027-W04'],
      rules: quietRules({ repeatWindowWeeks: 3 }),
      planned: [entry('2027-W03', 'lower', 'pause-squat')],
    });
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'pause-squat')).toEqual([]);
    expect(explainCandidate(req, 'nora', '2027-W04', 'lower', 'pause-squat').map((v) => v.rule)).toEqual(['repeat']);
  });

  it('sees a new board when the request carries a new planned list', () => {
    const req = handRequest({ rules: quietRules({ repeatWindowWeeks: 3 }), planned: [] });
    expect(explainCandidate(req, 'nora', '2027-W04', 'lower', 'pause-squat')).toEqual([]);
    const moved = { ...req, planned: [entry('2027-W03', 'lower', 'pause-squat')] };
    expect(explainCandidate(moved, 'nora', '2027-W04', 'lower', 'pause-squat')).toHaveLength(1);
  });

  it('says nothing about athletes the request does not hold', () => {
    expect(explainCandidate(handRequest(), 'someone-else', '2027-W03', 'lower', 'pause-squat')).toEqual([]);
  });
});

describe('prepared checks while dragging', () => {
  const req = handRequest({
    weeks: ['2027-W03', '2027-W04', '2027-W05', '2027-W06'],
    rules: quietRules({ familyWindowWeeks: 2, jointWindowWeeks: 4, jointBudget: { lowerBack: 8 } }),
    planned: [entry('2027-W03', 'lower', 'deficit-pull'), entry('2027-W04', 'lower', 'rack-pull')],
  });
  const checks = prepareCandidateChecks(req);

  it('agrees with explainCandidate', () => {
    for (const v of req.variants) {
      for (const week of req.weeks) {
        expect(checks.explain('nora', week, 'lower', v.id)).toEqual(explainCandidate(req, 'nora', week, 'lower', v.id));
      }
    }
  });

  it('warns when a joint would reach 85% of its budget', () => {
    // Lower back so far: 3 (W03) + 2 (W04) = 5. A paused pull (2) in W05 makes 7 of 8 = 88% in the
    // spans W02…W05 and W03…W06; the earlier of two equally busy spans is named.
    expect(checks.rate('nora', '2027-W05', 'lower', 'paused-pull')).toEqual({
      status: 'warning',
      violations: [],
      warnings: ['lower-back load would reach 7 of 8 (88%) in 2027-W02…2027-W05'],
    });
    // A pause squat (1) makes 6 of 8 = 75%: clean. A good morning (3) makes 8 of 8: still a warning.
    expect(checks.rate('nora', '2027-W05', 'lower', 'pause-squat').status).toBe('clean');
    expect(checks.rate('nora', '2027-W05', 'lower', 'gm-cambered').warnings[0]).toBe(
      'lower-back load would reach 8 of 8 (100%) in 2027-W02…2027-W05',
    );
    // A second deficit pull in W06: 3 + 2 + 3 = 8 of 8 over W03…W06, a warning; in W04 (replacing the
    // rack pull there) it is one week after the first, inside the 2-week family window: a break.
    expect(checks.rate('nora', '2027-W06', 'lower', 'deficit-pull').status).toBe('warning');
    expect(checks.rate('nora', '2027-W04', 'lower', 'deficit-pull')).toMatchObject({ status: 'break' });
  });

  it('warns about a family used just outside its window, and the same emphasis as last week', () => {
    // Deficit-pull family in W03 with a 2-week window: W06 is 3 weeks away, just outside it. A rack pull
    // in W05 clashes with the rack pull in W04 (family window); with no windows it only repeats the
    // lockout emphasis of last week's lower pick.
    const w06 = checks.rate('nora', '2027-W06', 'lower', 'deficit-pull');
    expect(w06.warnings).toContain('the deficit-pull family is also in 2027-W03, just outside its 2-week window');
    const lockout = checks.rate('nora', '2027-W05', 'lower', 'rack-pull');
    expect(lockout.violations.map((v) => v.rule)).toEqual(['family']);
    const sameEmphasis = prepareCandidateChecks({ ...req, rules: quietRules() }).rate(
      'nora',
      '2027-W05',
      'lower',
      'rack-pull',
    );
    expect(sameEmphasis.warnings).toEqual(["same emphasis (lockout) as last week's lower pick"]);
  });
});

describe('joint-load strip', () => {
  it('gives the rolling load of the span ending each week, against the budget', () => {
    // Budget lower back 8 over 2 weeks. History W01 deficit pull (3); entries W02 rack pull (2),
    // W03 paused pull (2). Span ending W02: 3 + 2 = 5; ending W03: 2 + 2 = 4; ending W04: 2.
    const req = handRequest({
      rules: quietRules({ jointWindowWeeks: 2, jointBudget: { lowerBack: 8, elbow: 4 } }),
      athletes: [athlete({ history: [entry('2027-W01', 'lower', 'deficit-pull')] })],
      weeks: ['2027-W02', '2027-W03'],
    });
    const entries = [
      entry('2027-W02', 'lower', 'rack-pull'),
      entry('2027-W03', 'lower', 'paused-pull'),
      entry('2027-W03', 'upper', 'floor-press'),
    ];
    const series = jointLoadSeries(req, 'nora', ['2027-W02', '2027-W03', '2027-W04'], entries);
    expect(series).toEqual([
      { week: '2027-W02', joint: 'elbow', load: 0, budget: 4, ratio: 0 },
      { week: '2027-W02', joint: 'lowerBack', load: 5, budget: 8, ratio: 0.625 },
      { week: '2027-W03', joint: 'elbow', load: 2, budget: 4, ratio: 0.5 },
      { week: '2027-W03', joint: 'lowerBack', load: 4, budget: 8, ratio: 0.5 },
      { week: '2027-W04', joint: 'elbow', load: 2, budget: 4, ratio: 0.5 },
      { week: '2027-W04', joint: 'lowerBack', load: 2, budget: 8, ratio: 0.25 },
    ]);
    // Peak over the spans overlapping the planned weeks W02–W03: W01–W02 holds 5 of 8.
    expect(peakLoadRatio(req, 'nora', entries)).toBe(0.625);
  });
});

describe('reasons', () => {
  it('names the least recently used family, the joint load and the change of emphasis', () => {
    // History: box squat 7 weeks before, pause squat and paused pull more recently. The box-squat
    // family is the least recently used; over 2027-W07…W10 the lower back gets 1 + 2 + 1 from history
    // and 1 from the low-box squat: 5 of a budget of 8.
    const req = handRequest({
      variants: handRequest().variants.filter((v) =>
        ['box-low', 'pause-squat', 'rack-pull', 'floor-press'].includes(v.id),
      ),
      weeks: ['2027-W10'],
      rules: quietRules({ jointWindowWeeks: 4, jointBudget: { lowerBack: 8 } }),
      athletes: [
        athlete({
          history: [
            entry('2027-W03', 'lower', 'box-low'),
            entry('2027-W07', 'lower', 'pause-squat'),
            entry('2027-W08', 'lower', 'rack-pull'),
            entry('2027-W09', 'lower', 'pause-squat'),
          ],
        }),
      ],
    });
    const lower = generatePlan(req).entries.find((e) => e.slotId === 'lower')!;
    expect(lower.variantId).toBe('box-low');
    // The first line names the goal that decided against the runner-up (the pause squat).
    expect(lower.reasons).toEqual([
      'chosen for variety: the box-squat family was used less recently than pause-squat',
      'least recently used box-squat family (7 weeks ago)',
      'Box squat, low box last done 7 weeks ago',
      'lower-back load 5 of 8 in 2027-W07…2027-W10 (63%)',
      'comfort: every joint stays at or under 80% of its budget',
    ]);
  });

  it('says when emphasis or bar change from last week', () => {
    const req = handRequest({
      variants: handRequest().variants.filter((v) => ['box-ssb', 'rack-pull', 'floor-press'].includes(v.id)),
      weeks: ['2027-W10'],
      athletes: [athlete({ history: [entry('2027-W09', 'lower', 'rack-pull')] })],
    });
    const lower = generatePlan(req).entries.find((e) => e.slotId === 'lower')!;
    expect(lower.variantId).toBe('box-ssb');
    expect(lower.reasons).toContain('changes emphasis from lockout to bottom');
    expect(lower.reasons).toContain('changes bar from straight bar to safety bar');
  });
});
