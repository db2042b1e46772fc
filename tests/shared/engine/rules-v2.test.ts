// Worked examples, computed by hand, for the version-2 hard rules and inputs: dated restrictions by
// joint, emphasis or family; meet-phase variants; rest weeks; archived variants; the risk ceiling; and
// the input checks.
import { describe, expect, it } from 'vitest';
import {
  checkPlan,
  explainCandidate,
  generatePlan,
  prepareCandidateChecks,
  type PlanRequest,
  type Variant,
} from '../../../shared/engine/index';
import { weekRange } from '../../../shared/engine/weeks';
import { HAND_LIBRARY, athlete, entry, handRequest, quietRules } from './fixtures';

const only = (...ids: string[]) => HAND_LIBRARY.filter((v) => ids.includes(v.id));
const SQUAT_DAY = [{ id: 'squat-day', lifts: ['squat' as const] }];

describe('dated restrictions', () => {
  // This week is 2027-W02; the restriction covers W+3…W+6 = 2027-W05…2027-W08.
  const restricted = (extra: Partial<PlanRequest> = {}) =>
    handRequest({
      variants: only('pause-squat'),
      slots: SQUAT_DAY,
      weeks: weekRange('2027-W03', '2027-W08'),
      athletes: [athlete({ restrictions: [{ families: ['pause-squat'], fromWeek: '2027-W05', toWeek: '2027-W08' }] })],
      ...extra,
    });

  it('leaves W+1 free in explain, check and generate, and rules the covered weeks out', () => {
    const req = restricted();
    expect(explainCandidate(req, 'nora', '2027-W03', 'squat-day', 'pause-squat')).toEqual([]);
    expect(prepareCandidateChecks(req).rate('nora', '2027-W03', 'squat-day', 'pause-squat').status).toBe('clean');
    expect(checkPlan(req, [entry('2027-W03', 'squat-day', 'pause-squat')])).toEqual([]);
    const inside = explainCandidate(req, 'nora', '2027-W05', 'squat-day', 'pause-squat');
    expect(inside).toMatchObject([
      { rule: 'restriction', message: 'the pause-squat family is off for this athlete (2027-W05…2027-W08)' },
    ]);
    expect(checkPlan(req, [entry('2027-W08', 'squat-day', 'pause-squat')]).map((v) => v.rule)).toEqual(['restriction']);
    const res = generatePlan(req);
    expect(res.entries.map((e) => e.week)).toEqual(['2027-W03', '2027-W04']);
    expect(res.unfilled.map((u) => [u.week, u.blockedBy])).toEqual([
      ['2027-W05', ['restriction']],
      ['2027-W06', ['restriction']],
      ['2027-W07', ['restriction']],
      ['2027-W08', ['restriction']],
    ]);
  });

  it('rules out an emphasis, and a joint cap from a given week on, naming the weeks', () => {
    const req = handRequest({
      weeks: ['2027-W04', '2027-W05'],
      athletes: [
        athlete({
          restrictions: [{ emphasis: ['lockout'] }, { joint: 'lowerBack', maxStress: 1, fromWeek: '2027-W05' }],
        }),
      ],
    });
    expect(explainCandidate(req, 'nora', '2027-W04', 'lower', 'rack-pull')).toMatchObject([
      {
        rule: 'restriction',
        message: 'Rack pull, below the knee overloads the lockout, which this athlete is to avoid',
      },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W04', 'lower', 'paused-pull')).toEqual([]);
    expect(explainCandidate(req, 'nora', '2027-W05', 'lower', 'paused-pull')).toMatchObject([
      {
        rule: 'restriction',
        message: "Paused deadlift puts lower back stress 2 over this athlete's limit of 1 (from 2027-W05)",
      },
    ]);
  });
});

describe('meet-phase variants', () => {
  const opener: Variant = {
    id: 'opener-squat',
    name: 'Opener squat single',
    lift: 'squat',
    family: 'squat-opener',
    risk: 2,
    specificity: 1,
    stress: { knee: 2, hip: 2, lowerBack: 2 },
    equipment: [],
    meetPhaseWeeks: 3,
  };
  const library = [opener, ...only('pause-squat', 'box-low', 'box-ssb')];

  it('names the window and the distance to the meet', () => {
    const req = handRequest({ variants: library, slots: SQUAT_DAY, athletes: [athlete({ meetWeek: '2027-W14' })] });
    expect(explainCandidate(req, 'nora', '2027-W05', 'squat-day', 'opener-squat')).toMatchObject([
      {
        rule: 'meetPhase',
        message: 'Opener squat single is for the last 3 weeks before a meet; the meet is 9 weeks away',
      },
    ]);
    expect(explainCandidate(req, 'nora', '2027-W11', 'squat-day', 'opener-squat')).toEqual([]);
    expect(explainCandidate(req, 'nora', '2027-W15', 'squat-day', 'opener-squat')[0]!.message).toBe(
      'Opener squat single is for the last 3 weeks before a meet; the meet was 1 week ago',
    );
    const noMeet = handRequest({ variants: library, slots: SQUAT_DAY });
    expect(explainCandidate(noMeet, 'nora', '2027-W05', 'squat-day', 'opener-squat')[0]!.message).toBe(
      'Opener squat single is for the last 3 weeks before a meet; this athlete has no meet planned',
    );
  });

  it('is never picked outside its window, and is picked inside it when it is the most specific', () => {
    const rules = quietRules({ repeatWindowWeeks: 1, taper: [{ weeksOut: 3, maxRisk: 3 }] });
    const weeks = weekRange('2027-W03', '2027-W14');
    const withMeet = generatePlan(
      handRequest({ variants: library, slots: SQUAT_DAY, rules, weeks, athletes: [athlete({ meetWeek: '2027-W14' })] }),
    );
    for (const e of withMeet.entries.filter((x) => x.variantId === 'opener-squat'))
      expect(e.week >= '2027-W11' && e.week <= '2027-W14').toBe(true);
    // 2027-W11 is 3 weeks out: the opener's family is the least recently used and it is the most specific.
    const firstInWindow = withMeet.entries.find((e) => e.week === '2027-W11')!;
    expect(firstInWindow.variantId).toBe('opener-squat');
    expect(firstInWindow.reasons).toContain('meet-phase pick: 3 weeks out from the meet (allowed within 3 weeks)');
    // Without a meet the opener never comes up.
    const noMeet = generatePlan(handRequest({ variants: library, slots: SQUAT_DAY, rules, weeks }));
    expect(noMeet.entries.some((e) => e.variantId === 'opener-squat')).toBe(false);
    expect(noMeet.unfilled).toEqual([]);
  });

  it('wins a taper week on specificity when variety ties, and says so', () => {
    const rules = quietRules({ taper: [{ weeksOut: 3, maxRisk: 3 }] });
    const req = handRequest({
      variants: [opener, ...only('pause-squat')],
      slots: SQUAT_DAY,
      rules,
      weeks: ['2027-W12'],
      athletes: [athlete({ meetWeek: '2027-W14' })],
    });
    const pick = generatePlan(req).entries[0]!;
    expect(pick.variantId).toBe('opener-squat');
    expect(pick.reasons[0]).toBe('chosen for effect: more specific for the meet (1) than Pause squat (0.9)');
  });
});

describe('rest weeks', () => {
  const req = handRequest({
    weeks: ['2027-W03', '2027-W04', '2027-W05'],
    athletes: [athlete({ restWeeks: ['2027-W04'] })],
    planned: [entry('2027-W04', 'lower', 'pause-squat'), entry('2027-W04', 'upper', 'floor-press', { pinned: true })],
  });

  it('stays empty: an unpinned pick there is cleared, a pinned one is kept and reported', () => {
    const res = generatePlan(req);
    const w04 = res.entries.filter((e) => e.week === '2027-W04');
    expect(w04).toMatchObject([{ slotId: 'upper', variantId: 'floor-press', pinned: true }]);
    expect(w04[0]!.reasons).toContain('kept although 2027-W04 is a rest week for this athlete: no max-effort pick');
    expect(res.unfilled.filter((u) => u.week === '2027-W04')).toEqual([]);
    expect(res.cleared).toEqual([
      { athleteId: 'nora', week: '2027-W04', slotId: 'lower', variantId: 'pause-squat', rule: 'restWeek' },
    ]);
    expect(res.entries.filter((e) => e.week !== '2027-W04')).toHaveLength(4);
    expect(checkPlan(req, [entry('2027-W04', 'upper', 'floor-press', { pinned: true })])).toMatchObject([
      { rule: 'restWeek', message: '2027-W04 is a rest week for this athlete: no max-effort pick' },
    ]);
  });
});

describe('archived variants and the risk ceiling', () => {
  it('never picks an archived variant, swaps a planned one and reports a pinned one', () => {
    const variants = handRequest().variants.map((v) => (v.id === 'pause-squat' ? { ...v, archived: true } : v));
    const weeks = weekRange('2027-W03', '2027-W10');
    const res = generatePlan(handRequest({ variants, weeks }));
    expect(res.entries.some((e) => e.variantId === 'pause-squat')).toBe(false);
    const planned = [entry('2027-W03', 'lower', 'pause-squat')];
    const swapped = generatePlan(handRequest({ variants, weeks: ['2027-W03'], planned }));
    expect(swapped.swaps).toMatchObject([{ week: '2027-W03', slotId: 'lower', from: 'pause-squat', rule: 'archived' }]);
    const pinned = [entry('2027-W03', 'lower', 'pause-squat', { pinned: true })];
    expect(checkPlan(handRequest({ variants }), pinned)).toMatchObject([
      { rule: 'archived', message: 'Pause squat is archived in the library' },
    ]);
  });

  it("keeps to the athlete's risk ceiling", () => {
    const req = handRequest({ weeks: weekRange('2027-W03', '2027-W08'), athletes: [athlete({ maxRisk: 1 })] });
    expect(explainCandidate(req, 'nora', '2027-W03', 'lower', 'gm-cambered')).toMatchObject([
      { rule: 'riskCeiling', message: "Good morning, cambered bar has risk 3, above this athlete's ceiling of 1" },
    ]);
    const risks = new Map(HAND_LIBRARY.map((v) => [v.id, v.risk]));
    for (const e of generatePlan(req).entries) expect(risks.get(e.variantId)).toBe(1);
  });
});

describe('input checks', () => {
  const calls = (req: PlanRequest) => [
    () => generatePlan(req),
    () => checkPlan(req, []),
    () => explainCandidate(req, 'nora', '2027-W03', 'lower', 'pause-squat'),
    () => prepareCandidateChecks(req),
  ];

  it('refuses a restriction with neither a joint cap, an emphasis nor a family', () => {
    const req = handRequest({ athletes: [athlete({ restrictions: [{ fromWeek: '2027-W03' }] })] });
    for (const f of calls(req))
      expect(f).toThrow(
        new RangeError('athlete "nora", restriction 1: give a joint with maxStress, an emphasis list or a family list'),
      );
    const noCap = handRequest({ athletes: [athlete({ restrictions: [{ joint: 'knee' }] })] });
    expect(() => generatePlan(noCap)).toThrow(RangeError);
  });

  it('refuses a toWeek before its fromWeek', () => {
    const req = handRequest({
      athletes: [athlete({ restrictions: [{ families: ['box-squat'], fromWeek: '2027-W09', toWeek: '2027-W05' }] })],
    });
    for (const f of calls(req))
      expect(f).toThrow(new RangeError('athlete "nora", restriction 1: toWeek 2027-W05 is before fromWeek 2027-W09'));
  });

  it('refuses an unknown rule field, naming it', () => {
    const req = handRequest({ rules: { ...quietRules(), comfortRatoi: 0.7 } as unknown as PlanRequest['rules'] });
    for (const f of calls(req)) expect(f).toThrow(/unknown rule field "comfortRatoi"/);
    for (const f of calls(req)) expect(f).toThrow(RangeError);
  });
});
