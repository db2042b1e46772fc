// The request builder: stored planning facts → the engine's PlanRequest, the same for browser and server.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  athleteInput,
  buildAthleteRequest,
  buildPlanRequests,
  dayWeek,
  engineRestriction,
  engineRules,
  engineVariant,
  restrictionTag,
  restrictionText,
  type PlanningFacts,
  type StoredEntry,
} from '../../../shared/planning';
import { DEFAULT_TEAM_RULES, type BoardAthlete, type BoardVariant } from '../../../shared/schemas';

const variant = (id: number, extra: Partial<BoardVariant> = {}): BoardVariant => ({
  id,
  name: `Variant ${id}`,
  lift: 'squat',
  family: `family ${id}`,
  bar: 'straight',
  equipment: [],
  emphasis: 'midRange',
  stress: { knee: 1 },
  risk: 1,
  specificity: 0.7,
  scheme: 'single',
  meetPhaseWeeks: null,
  archived: false,
  ...extra,
});

const athlete = (id: number, extra: Partial<BoardAthlete> = {}): BoardAthlete => ({
  id,
  name: `Athlete ${id}`,
  equipment: ['box'],
  restrictions: [],
  meet: null,
  ruleOverrides: {},
  maxRisk: null,
  restWeeks: [],
  ...extra,
});

const facts = (athletes: BoardAthlete[], variants = [variant(1), variant(2)]): PlanningFacts => ({
  rules: DEFAULT_TEAM_RULES,
  seed: 'seed',
  slots: DEFAULT_TEAM_RULES.slots,
  variants,
  athletes,
});

describe('stored dates → ISO weeks', () => {
  // ISO 8601: weeks start on Monday and week 1 holds the year's first Thursday. Worked by hand from a
  // calendar: 1 Jan 2026 is a Thursday, so 2026 has 53 weeks and 3 Jan 2027 (a Sunday) is still in 2026-W53.
  it.each([
    ['2026-12-28', '2026-W53'],
    ['2026-12-31', '2026-W53'],
    ['2027-01-03', '2026-W53'],
    ['2027-01-04', '2027-W01'],
    ['2025-12-29', '2026-W01'],
    ['2024-12-30', '2025-W01'],
    ['2027-03-14', '2027-W10'],
  ])('%s falls in %s', (d, w) => {
    expect(dayWeek(d)).toBe(w);
  });

  it('covers the weeks of its first and last day, and leaves the end open when none is set', () => {
    expect(
      engineRestriction({
        joint: null,
        maxStress: null,
        emphasis: ['lockout'],
        families: ['rack pull'],
        fromDate: '2026-12-30',
        toDate: '2027-01-20',
        note: 'x',
      }),
    ).toEqual({ emphasis: ['lockout'], families: ['rack pull'], fromWeek: '2026-W53', toWeek: '2027-W03' });
    expect(
      engineRestriction({
        joint: 'elbow',
        maxStress: 1,
        emphasis: [],
        families: [],
        fromDate: '2027-03-10',
        toDate: null,
        note: null,
      }),
    ).toEqual({ joint: 'elbow', maxStress: 1, fromWeek: '2027-W10' });
  });

  it('never ends a restriction before it starts, for any pair of ordered days', () => {
    const day = fc
      .integer({ min: Date.UTC(2020, 0, 1), max: Date.UTC(2035, 11, 31) })
      .map((ms) => new Date(ms).toISOString().slice(0, 10));
    fc.assert(
      fc.property(day, day, (a, b) => {
        const [from, to] = a <= b ? [a, b] : [b, a];
        const r = engineRestriction({
          joint: 'knee',
          maxStress: 2,
          emphasis: [],
          families: [],
          fromDate: from,
          toDate: to,
          note: null,
        });
        return r.fromWeek! <= r.toWeek!;
      }),
    );
  });
});

describe('variants and rules', () => {
  it('passes archived and meet-phase variants with their own flags, with no stand-in equipment', () => {
    expect(engineVariant(variant(7, { archived: true, equipment: ['box'] }))).toMatchObject({
      id: '7',
      archived: true,
      equipment: ['box'],
    });
    expect(engineVariant(variant(8, { meetPhaseWeeks: 3 })).meetPhaseWeeks).toBe(3);
    const plain = engineVariant(variant(9));
    expect(plain).not.toHaveProperty('archived');
    expect(plain).not.toHaveProperty('meetPhaseWeeks');
    expect(plain).toMatchObject({ emphasis: 'midRange', bar: 'straight' });
  });

  it('puts the athlete’s overrides over the team rules, with comfort and lift balance', () => {
    const rules = engineRules(DEFAULT_TEAM_RULES, 's', { repeatWindowWeeks: 9, jointBudget: { knee: 4 } });
    expect(rules).toMatchObject({
      repeatWindowWeeks: 9,
      familyWindowWeeks: DEFAULT_TEAM_RULES.familyWindowWeeks,
      jointBudget: { ...DEFAULT_TEAM_RULES.jointBudget, knee: 4 },
      comfortRatio: 0.8,
      liftBalanceWeeks: 3,
      seed: 's',
    });
  });
});

describe('athletes', () => {
  it('passes the risk ceiling, rest weeks and every restriction with its own weeks', () => {
    const a = athlete(1, {
      maxRisk: 2,
      restWeeks: ['2027-W12'],
      meet: { id: 1, name: 'Open', date: '2027-04-10', week: '2027-W14' },
      restrictions: [
        // Whatever weeks a caller plans, each restriction keeps its own: the engine applies it to those.
        {
          joint: 'knee',
          maxStress: 0,
          emphasis: [],
          families: [],
          fromDate: '2027-01-04',
          toDate: '2027-02-01',
          note: null,
        },
        {
          joint: null,
          maxStress: null,
          emphasis: ['bottom'],
          families: [],
          fromDate: '2027-03-17',
          toDate: '2027-04-01',
          note: null,
        },
        {
          joint: null,
          maxStress: null,
          emphasis: [],
          families: ['good morning'],
          fromDate: '2027-06-01',
          toDate: null,
          note: null,
        },
      ],
    });
    const input = athleteInput(a, []);
    expect(input).toMatchObject({ id: '1', maxRisk: 2, restWeeks: ['2027-W12'], meetWeek: '2027-W14' });
    expect(input.restrictions).toEqual([
      { joint: 'knee', maxStress: 0, fromWeek: '2027-W01', toWeek: '2027-W05' },
      { emphasis: ['bottom'], fromWeek: '2027-W11', toWeek: '2027-W13' },
      { families: ['good morning'], fromWeek: '2027-W22' },
    ]);
    const free = athleteInput(athlete(2), []);
    expect(free).not.toHaveProperty('maxRisk');
    expect(free).not.toHaveProperty('restWeeks');
  });
});

describe('buildPlanRequests', () => {
  const entries: StoredEntry[] = [
    { athleteId: 1, week: '2027-W08', slotId: 'lower', variantId: 1, pinned: false },
    { athleteId: 1, week: '2027-W10', slotId: 'lower', variantId: 2, pinned: true },
    { athleteId: 1, week: '2027-W11', slotId: 'lower', variantId: null, pinned: false },
    { athleteId: 2, week: '2027-W10', slotId: 'lower', variantId: 1, pinned: false },
    { athleteId: 3, week: '2027-W10', slotId: 'lower', variantId: 2, pinned: false },
  ];
  const team = facts([athlete(1), athlete(2), athlete(3, { ruleOverrides: { repeatWindowWeeks: 2 } })]);

  it('groups athletes by their effective rules, splitting history from what is on the board', () => {
    const groups = buildPlanRequests(team, { weeks: ['2027-W10', '2027-W11'], entries });
    expect(groups.map((g) => g.athleteIds)).toEqual([[1, 2], [3]]);
    const [shared, own] = groups;
    expect(shared!.request.athletes.find((a) => a.id === '1')!.history).toEqual([
      { athleteId: '1', week: '2027-W08', slotId: 'lower', variantId: '1', pinned: false },
    ]);
    // A cleared cell holds nothing for the engine.
    expect(shared!.request.planned).toEqual([
      { athleteId: '1', week: '2027-W10', slotId: 'lower', variantId: '2', pinned: true },
      { athleteId: '2', week: '2027-W10', slotId: 'lower', variantId: '1', pinned: false },
    ]);
    expect(own!.request.rules.repeatWindowWeeks).toBe(2);
    expect(own!.request.planned).toHaveLength(1);
    expect(shared!.request.slots).toEqual([
      { id: 'lower', lifts: ['squat', 'deadlift'] },
      { id: 'upper', lifts: ['bench'] },
    ]);
  });

  it('builds one athlete’s request alone, the same as in the team’s', () => {
    const alone = buildAthleteRequest(team, 1, { weeks: ['2027-W10', '2027-W11'], entries })!;
    const inTeam = buildPlanRequests(team, { weeks: ['2027-W10', '2027-W11'], entries })[0]!.request;
    expect(alone.athletes).toEqual(inTeam.athletes.filter((a) => a.id === '1'));
    expect(alone.planned).toEqual(inTeam.planned!.filter((e) => e.athleteId === '1'));
    expect(buildAthleteRequest(team, 99, { weeks: ['2027-W10'], entries })).toBeUndefined();
  });
});

describe('restriction words', () => {
  const r = { joint: 'elbow' as const, maxStress: 1, emphasis: ['lockout' as const], families: ['rack pull'] };
  it('names every part of a restriction', () => {
    expect(restrictionText(r)).toBe('Elbow: light load only (≤ 1); no lockout work; no rack pull');
    expect(restrictionTag(r)).toBe('elbow ≤ 1 · no lockout · no rack pull');
    expect(restrictionText({ joint: null, maxStress: null, emphasis: ['bottom', 'midRange'], families: [] })).toBe(
      'No bottom or mid-range work',
    );
  });
});
