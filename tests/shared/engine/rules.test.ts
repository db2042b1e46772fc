// Worked examples, computed by hand, for every rule the engine enforces and the words it reports.
import { describe, expect, it } from 'vitest';
import { checkPlan, explainCandidate, generatePlan, type PlanRequest } from '../../../shared/engine/index';
import { athlete, entry, handRequest, quietRules } from './fixtures';

const rulesOf = (req: PlanRequest, entries = req.planned ?? []) => checkPlan(req, entries).map((v) => v.rule);

describe('repeat window', () => {
  it('counts ISO weeks across a 53-week year: 2026-W52 → 2026-W53 → 2027-W01', () => {
    // A window of 3 weeks holds 2026-W52, 2026-W53 and 2027-W01, so a pause squat trained in 2026-W52
    // may not come back before 2027-W02.
    const req = handRequest({
      rules: quietRules({ repeatWindowWeeks: 3 }),
      athletes: [athlete({ history: [entry('2026-W52', 'lower', 'pause-squat')] })],
      weeks: ['2026-W53', '2027-W01', '2027-W02'],
    });
    const found = checkPlan(req, [entry('2027-W01', 'lower', 'pause-squat')]);
    expect(found).toEqual([
      {
        rule: 'repeat',
        athleteId: 'nora',
        week: '2027-W01',
        slotId: 'lower',
        variantId: 'pause-squat',
        message: 'Pause squat is already in 2026-W52, 2 weeks away; the repeat window is 3 weeks',
      },
    ]);
    expect(checkPlan(req, [entry('2026-W53', 'lower', 'pause-squat')])[0]?.message).toContain('1 week away');
    expect(checkPlan(req, [entry('2027-W02', 'lower', 'pause-squat')])).toEqual([]);
  });

  it('keeps the planner to the same window over the year end', () => {
    // Only two lower variants exist; the pause squat from 2026-W52 blocks 2026-W53 and 2027-W01, so the
    // paused deadlift must take one of them and the pause squat can only come back in 2027-W02.
    const req = handRequest({
      variants: handRequest().variants.filter((v) => ['pause-squat', 'paused-pull', 'floor-press'].includes(v.id)),
      slots: [{ id: 'lower', lifts: ['squat', 'deadlift'] }],
      rules: quietRules({ repeatWindowWeeks: 3 }),
      athletes: [athlete({ history: [entry('2026-W52', 'lower', 'pause-squat')] })],
      weeks: ['2026-W53', '2027-W01', '2027-W02'],
    });
    const res = generatePlan(req);
    // 2026-W53: paused deadlift (pause squat blocked); 2027-W01: nothing fits (both within 3 weeks).
    expect(res.entries.map((e) => [e.week, e.variantId])).toEqual([
      ['2026-W53', 'paused-pull'],
      ['2027-W02', 'pause-squat'],
    ]);
    expect(res.unfilled).toEqual([{ athleteId: 'nora', week: '2027-W01', slotId: 'lower', blockedBy: ['repeat'] }]);
  });

  it('never allows a variant twice in one week, even with no window', () => {
    const req = handRequest({
      slots: [
        { id: 'heavy', lifts: ['squat'] },
        { id: 'second', lifts: ['squat'] },
      ],
    });
    const board = [entry('2027-W03', 'heavy', 'pause-squat'), entry('2027-W03', 'second', 'pause-squat')];
    const found = checkPlan(req, board);
    expect(found.map((v) => [v.slotId, v.rule])).toEqual([
      ['heavy', 'repeat'],
      ['second', 'repeat'],
    ]);
    expect(found[0]!.message).toBe('Pause squat is already in 2027-W03; a variant may appear only once a week');
    const res = generatePlan({ ...req, variants: req.variants.filter((v) => v.lift === 'squat') });
    const ids = res.entries.map((e) => e.variantId);
    expect(new Set(ids).size).toBe(ids.length);
  });
});

describe('family window', () => {
  it('keeps a whole family out of the window', () => {
    // Box squat (low box) in 2027-W01; with a 3-week family window the safety-bar box squat is out
    // until 2027-W04.
    const req = handRequest({
      rules: quietRules({ familyWindowWeeks: 3 }),
      athletes: [athlete({ history: [entry('2027-W01', 'lower', 'box-low')] })],
    });
    expect(checkPlan(req, [entry('2027-W03', 'lower', 'box-ssb')])).toMatchObject([
      {
        rule: 'family',
        message: 'the box-squat family is already in 2027-W01, 2 weeks away; the family window is 3 weeks',
      },
    ]);
    expect(checkPlan(req, [entry('2027-W04', 'lower', 'box-ssb')])).toEqual([]);
    // Same family in both slots of one week is a clash too (a span of one week).
    const two = handRequest({
      rules: quietRules({ familyWindowWeeks: 1 }),
      slots: [
        { id: 'a', lifts: ['squat'] },
        { id: 'b', lifts: ['squat'] },
      ],
    });
    expect(rulesOf(two, [entry('2027-W03', 'a', 'box-low'), entry('2027-W03', 'b', 'box-ssb')])).toEqual([
      'family',
      'family',
    ]);
  });
});

describe('joint budgets over rolling spans', () => {
  it('reports every contributing entry of an overloaded span, with friendly names and the span', () => {
    // Lower-back stress: deficit pull 3 (W03) + good morning 3 (W04) + paused pull 2 (W05) + box squat
    // low box 1 (W06) = 9 over the 4 weeks 2027-W03…2027-W06, budget 8.
    const req = handRequest({ rules: quietRules({ jointWindowWeeks: 4, jointBudget: { lowerBack: 8 } }) });
    const board = [
      entry('2027-W03', 'lower', 'deficit-pull'),
      entry('2027-W04', 'lower', 'gm-cambered'),
      entry('2027-W05', 'lower', 'paused-pull'),
      entry('2027-W06', 'lower', 'box-low'),
    ];
    const found = checkPlan(req, board);
    expect(found.map((v) => v.week)).toEqual(['2027-W03', '2027-W04', '2027-W05', '2027-W06']);
    for (const v of found) {
      expect(v.rule).toBe('jointBudget');
      expect(v.message).toBe('lower-back load 9 over budget 8 in 2027-W03…2027-W06');
    }
    // An upper-body pick in the same span adds no lower-back stress and breaks nothing.
    expect(
      checkPlan(req, [...board, entry('2027-W05', 'upper', 'floor-press')]).filter((v) => v.slotId === 'upper'),
    ).toEqual([]);
  });

  it('counts spans that reach back into history, across the year end', () => {
    // History: good morning (lower back 3) in 2027-W01, deficit pull (3) in 2027-W02. Planning 2027-W03
    // with a 4-week span and budget 7: the span 2026-W53…2027-W03 already holds 6, so a paused pull (2)
    // makes 8, while a pause squat (1) makes 7, exactly the budget.
    const req = handRequest({
      rules: quietRules({ jointWindowWeeks: 4, jointBudget: { lowerBack: 7 } }),
      athletes: [
        athlete({ history: [entry('2027-W01', 'lower', 'gm-cambered'), entry('2027-W02', 'lower', 'deficit-pull')] }),
      ],
    });
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'paused-pull')).toMatchObject([
      { rule: 'jointBudget', message: 'lower-back load 8 over budget 7 in 2026-W53…2027-W03' },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'pause-squat')).toEqual([]);
    const res = generatePlan(req);
    const lower = res.entries.find((e) => e.slotId === 'lower')!;
    expect(['pause-squat', 'box-low']).toContain(lower.variantId);
    expect(checkPlan(req, res.entries)).toEqual([]);
  });
});

describe('taper by weeks to the meet', () => {
  const taper = quietRules({
    taper: [
      { weeksOut: 3, maxRisk: 2 },
      { weeksOut: 1, maxRisk: 3, minSpecificity: 0.8 },
    ],
  });
  const req = handRequest({ rules: taper, athletes: [athlete({ meetWeek: '2027-W14' })] });

  it('caps risk from weeksOut weeks before the meet through the meet week', () => {
    // Good morning, cambered bar: risk 3. Weeks out: W10 → 4, W11 → 3, W14 → 0, W15 → after the meet.
    const at = (week: string) => explainCandidate(req, 'nora', week, 'lower', 'gm-cambered');
    expect(at('2027-W10')).toEqual([]);
    expect(at('2027-W11')).toMatchObject([
      {
        rule: 'taperRisk',
        message: 'Good morning, cambered bar has risk 3, above the limit of 2 at 3 weeks out from the meet',
      },
    ]);
    expect(at('2027-W14').map((v) => v.message)).toEqual([
      'Good morning, cambered bar has risk 3, above the limit of 2 in the meet week',
      'Good morning, cambered bar has specificity 0.3, below the minimum of 0.8 in the meet week',
    ]);
    expect(at('2027-W15')).toEqual([]);
  });

  it('asks for specificity in the last week', () => {
    // Floor press: specificity 0.6, risk 1. 2027-W13 is 1 week out: the minimum 0.8 applies.
    expect(explainCandidate(req, 'nora', '2027-W13', 'upper', 'floor-press')).toMatchObject([
      {
        rule: 'taperSpecificity',
        message: 'Floor press has specificity 0.6, below the minimum of 0.8 at 1 week out from the meet',
      },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W12', 'upper', 'floor-press')).toEqual([]);
  });

  it('prefers more specific variants within taper weeks', () => {
    // At 2 weeks out risk ≤ 2 applies; of the bench variants left the long-pause bench is the most
    // specific (0.95) and the planner picks it.
    const res = generatePlan({ ...req, weeks: ['2027-W12'], slots: [{ id: 'upper', lifts: ['bench'] }] });
    expect(res.entries[0]!.variantId).toBe('long-pause-bench');
    expect(res.entries[0]!.reasons).toContain('2 weeks out from the meet: specificity 0.95, risk 1 (at most 2)');
  });

  it('swaps a high-risk pick out when the meet moves one week earlier', () => {
    // Board: good morning (risk 3) in 2027-W10. Meet in 2027-W14: W10 is 4 weeks out, no taper, kept.
    // Meet moved to 2027-W13: W10 is 3 weeks out, risk ≤ 2 applies, so the pick is swapped out.
    const planned = [entry('2027-W10', 'lower', 'gm-cambered')];
    const before = generatePlan({ ...req, weeks: ['2027-W10'], planned });
    expect(before.swaps).toEqual([]);
    expect(before.entries.find((e) => e.slotId === 'lower')).toMatchObject({ variantId: 'gm-cambered' });
    const after = generatePlan({ ...req, athletes: [athlete({ meetWeek: '2027-W13' })], weeks: ['2027-W10'], planned });
    expect(after.swaps).toHaveLength(1);
    const swap = after.swaps[0]!;
    expect(swap).toMatchObject({
      athleteId: 'nora',
      week: '2027-W10',
      slotId: 'lower',
      from: 'gm-cambered',
      rule: 'taperRisk',
    });
    const to = after.entries.find((e) => e.slotId === 'lower')!;
    expect(to.variantId).toBe(swap.to);
    expect(handRequest().variants.find((v) => v.id === swap.to)!.risk).toBeLessThanOrEqual(2);
    expect(to.reasons[0]).toBe(
      'replaces Good morning, cambered bar: Good morning, cambered bar has risk 3, above the limit of 2 at 3 weeks out from the meet',
    );
  });
});

describe('athlete rules and library checks', () => {
  it('keeps to restrictions', () => {
    // An irritated elbow: max elbow stress 1. Of the bench variants only the pin press stays within it.
    const req = handRequest({ athletes: [athlete({ restrictions: [{ joint: 'elbow', maxStress: 1 }] })] });
    expect(explainCandidate(req, 'nora', '2027-W03', 'upper', 'board-2')).toMatchObject([
      {
        rule: 'restriction',
        message: "Two-board press, close grip puts elbow stress 3 over this athlete's limit of 1",
      },
    ]);
    const upper = generatePlan(req).entries.find((e) => e.slotId === 'upper')!;
    expect(['pin-press', 'long-pause-bench']).toContain(upper.variantId);
  });

  it('needs all of a variant’s equipment', () => {
    const req = handRequest({ athletes: [athlete({ equipment: ['box'] })] });
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'box-ssb')).toMatchObject([
      {
        rule: 'equipment',
        message: 'Box squat, parallel box, safety bar needs safety bar, which this athlete does not have',
      },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'box-low')).toEqual([]);
  });

  it('matches lifts to slots and knows the library', () => {
    const req = handRequest();
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'floor-press')).toMatchObject([
      { rule: 'liftMismatch', message: 'Floor press is a bench variant; the lower slot takes squat or deadlift' },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W03', 'accessory', 'floor-press')).toMatchObject([
      { rule: 'liftMismatch', message: 'there is no "accessory" slot' },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'zercher-9')).toEqual([
      {
        rule: 'unknownVariant',
        athleteId: 'nora',
        week: '2027-W03',
        slotId: 'lower',
        variantId: 'zercher-9',
        message: 'no variant "zercher-9" in the library',
      },
    ]);
  });

  it('finds every rule on a board built to break them all', () => {
    const req = handRequest({
      rules: quietRules({
        repeatWindowWeeks: 2,
        familyWindowWeeks: 2,
        jointWindowWeeks: 2,
        jointBudget: { wrist: 3 },
        taper: [{ weeksOut: 0, maxRisk: 2, minSpecificity: 0.9 }],
      }),
      athletes: [
        athlete({
          equipment: ['box', 'pins', 'boards', 'bands'],
          restrictions: [{ joint: 'knee', maxStress: 1 }],
          meetWeek: '2027-W09',
          history: [entry('2027-W01', 'upper', 'pin-press')],
        }),
      ],
    });
    const board = [
      entry('2027-W02', 'upper', 'pin-press'), // repeat (and family): 1 week after 2027-W01, 2-week windows
      entry('2027-W03', 'lower', 'box-low'), // restriction: knee 2 over 1 (and family with W04)
      entry('2027-W04', 'lower', 'box-ssb'), // equipment: no safety bar; family: box-squat 1 week apart
      entry('2027-W05', 'upper', 'board-2'), // wrist 2 + 2 (W06) = 4 over 3 in 2027-W05…W06
      entry('2027-W06', 'upper', 'reverse-band-bench'),
      entry('2027-W09', 'upper', 'long-pause-bench'), // clean: risk 1, specificity 0.95 in the meet week
      entry('2027-W09', 'lower', 'rack-pull'), // taperSpecificity: 0.5 below 0.9 in the meet week
      entry('2027-W08', 'upper', 'reverse-band-bench'), // clean a week before the meet (weeksOut 0)
      entry('2027-W10', 'upper', 'paused-pull'), // liftMismatch
      entry('2027-W10', 'lower', 'jefferson-1'), // unknownVariant
      entry('2027-W11', 'lower', 'rack-pull'), // clean after the meet (2 weeks after the last rack pull)
    ];
    const rules = (week: string, slot: string) =>
      checkPlan(req, board)
        .filter((v) => v.week === week && v.slotId === slot)
        .map((v) => v.rule);
    expect(rules('2027-W02', 'upper')).toEqual(['repeat', 'family']);
    expect(rules('2027-W03', 'lower')).toEqual(['restriction', 'family']);
    expect(rules('2027-W04', 'lower')).toEqual(['equipment', 'family']);
    expect(rules('2027-W05', 'upper')).toEqual(['jointBudget']);
    expect(rules('2027-W06', 'upper')).toEqual(['jointBudget']);
    expect(rules('2027-W09', 'upper')).toEqual([]);
    expect(rules('2027-W09', 'lower')).toEqual(['taperSpecificity']);
    expect(rules('2027-W08', 'upper')).toEqual([]);
    expect(rules('2027-W10', 'upper')).toEqual(['liftMismatch']);
    expect(rules('2027-W10', 'lower')).toEqual(['unknownVariant']);
    expect(rules('2027-W11', 'lower')).toEqual([]);
    // taperRisk: the reverse-band bench (risk 3) in the meet week.
    expect(rulesOf(req, [entry('2027-W09', 'upper', 'reverse-band-bench')])).toEqual(['taperRisk', 'taperSpecificity']);
  });
});

describe('board entries', () => {
  it('keeps pinned entries exactly, even when they break a rule, and reports them', () => {
    const req = handRequest({
      rules: quietRules({ repeatWindowWeeks: 4 }),
      athletes: [athlete({ history: [entry('2027-W02', 'lower', 'pause-squat')] })],
      planned: [entry('2027-W03', 'lower', 'pause-squat', { pinned: true })],
    });
    const res = generatePlan(req);
    const lower = res.entries.find((e) => e.slotId === 'lower')!;
    expect(lower).toMatchObject({ variantId: 'pause-squat', pinned: true });
    expect(lower.reasons).toEqual([
      'coach pick (pinned)',
      'kept although Pause squat is already in 2027-W02, 1 week away; the repeat window is 4 weeks',
    ]);
    expect(res.swaps).toEqual([]);
    expect(rulesOf(req, res.entries)).toEqual(['repeat']);
  });

  it('keeps valid unpinned entries and replaces broken ones, naming the rule', () => {
    const req = handRequest({
      weeks: ['2027-W03', '2027-W04'],
      rules: quietRules({ repeatWindowWeeks: 4 }),
      athletes: [athlete({ history: [entry('2027-W01', 'upper', 'floor-press')] })],
      planned: [entry('2027-W03', 'lower', 'rack-pull'), entry('2027-W04', 'upper', 'floor-press')],
    });
    const res = generatePlan(req);
    const kept = res.entries.find((e) => e.week === '2027-W03' && e.slotId === 'lower')!;
    expect(kept.variantId).toBe('rack-pull');
    expect(kept.reasons[0]).toBe('kept from the board: still within every rule');
    expect(res.swaps).toMatchObject([{ week: '2027-W04', slotId: 'upper', from: 'floor-press', rule: 'repeat' }]);
    expect(checkPlan(req, res.entries)).toEqual([]);
  });

  it('moves a cell to unfilled when its entry must go and nothing valid replaces it', () => {
    // Only one bench variant, done last week, with a 4-week repeat window.
    const req = handRequest({
      variants: handRequest().variants.filter((v) => v.lift !== 'bench' || v.id === 'floor-press'),
      rules: quietRules({ repeatWindowWeeks: 4 }),
      athletes: [athlete({ history: [entry('2027-W02', 'upper', 'floor-press')] })],
      planned: [entry('2027-W03', 'upper', 'floor-press')],
    });
    const res = generatePlan(req);
    expect(res.entries.some((e) => e.slotId === 'upper')).toBe(false);
    expect(res.swaps).toEqual([]);
    expect(res.unfilled).toEqual([
      {
        athleteId: 'nora',
        week: '2027-W03',
        slotId: 'upper',
        blockedBy: ['repeat'],
        dropped: {
          variantId: 'floor-press',
          rule: 'repeat',
          message: 'Floor press is already in 2027-W02, 1 week away; the repeat window is 4 weeks',
        },
      },
    ]);
  });
});

describe('planning ahead', () => {
  it('backtracks out of a corner that a greedy week-by-week pick paints itself into', () => {
    // Three weeks, all picks different (repeat window 3), meet in the third week, and risk ≤ 1 from one
    // week out: weeks 2 and 3 can only take the pause squat and the paused deadlift. The good morning,
    // done 3 weeks before, loses week 1 on recency to the two never-used variants, but either of those
    // in week 1 leaves week 3 empty. So week 1 must be the good morning.
    const req = handRequest({
      variants: handRequest().variants.filter((v) => ['pause-squat', 'paused-pull', 'gm-cambered'].includes(v.id)),
      slots: [{ id: 'lower', lifts: ['squat', 'deadlift'] }],
      rules: quietRules({ repeatWindowWeeks: 3, taper: [{ weeksOut: 1, maxRisk: 1 }] }),
      athletes: [athlete({ meetWeek: '2027-W05', history: [entry('2026-W53', 'lower', 'gm-cambered')] })],
      weeks: ['2027-W03', '2027-W04', '2027-W05'],
    });
    const res = generatePlan(req);
    expect(res.unfilled).toEqual([]);
    expect(res.entries[0]!.variantId).toBe('gm-cambered');
    expect(new Set(res.entries.slice(1).map((e) => e.variantId))).toEqual(new Set(['pause-squat', 'paused-pull']));
    expect(checkPlan(req, res.entries)).toEqual([]);
  });
});
