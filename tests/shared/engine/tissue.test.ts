// Connective-tissue prescriptions: worked examples of each behaviour, and properties over random histories.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  BAND_LEVELS,
  DEFAULT_TISSUE_RULES,
  JOINT_WORKING_RANGE,
  TISSUE_CAUTION,
  TISSUE_KINDS,
  isometricAngles,
  jointLoadOf,
  restrictedJoints,
  prescribeTissueWork,
  type BandLevel,
  type TissueCheckin,
  type TissueInput,
  type TissueKind,
  type TissuePrescription,
  type TissueRules,
} from '../../../shared/engine/tissue';
import { JOINTS, type Joint, type Restriction } from '../../../shared/engine/types';
import { addWeeks, weekNumber } from '../../../shared/engine/weeks';

const WEEK = '2027-W10';

function input(over: Partial<TissueInput> = {}): TissueInput {
  return { week: WEEK, rules: DEFAULT_TISSUE_RULES, history: [], checkins: [], focusJoints: ['elbow'], ...over };
}

function highRep(week: string, joint: Joint, reps = 100, band: BandLevel = 'light'): TissuePrescription {
  return { week, joint, kind: 'highRep', exercise: 'x', instructions: [], sessionsPerWeek: 3, dose: { reps, band } };
}
function iso(week: string, joint: Joint, seconds: number): TissuePrescription {
  return {
    week,
    joint,
    kind: 'isometric',
    exercise: 'x',
    instructions: [],
    sessionsPerWeek: 3,
    dose: { seconds, pulsesPerAngle: 3, angles: [] },
  };
}
function stretch(week: string, joint: Joint, holdSeconds: number): TissuePrescription {
  return {
    week,
    joint,
    kind: 'loadedStretch',
    exercise: 'x',
    instructions: [],
    sessionsPerWeek: 3,
    dose: { fatigueReps: 25, holdSeconds },
  };
}
function checkin(week: string, kind: TissueKind, soreness: number, painJoints: Joint[] = []): TissueCheckin {
  return { week, kind, soreness, painJoints };
}
const before = (n: number): string => addWeeks(WEEK, -n);

describe('starting out', () => {
  it('begins with the gentlest kind, the default dose, and the usual cautions', () => {
    const out = prescribeTissueWork(input({ focusJoints: ['elbow', 'knee'] }));
    expect(out.kind).toBe('highRep');
    expect(out.items.map((i) => [i.joint, i.kind, i.exercise])).toEqual([
      ['elbow', 'highRep', 'Banded triceps pushdown'],
      ['knee', 'highRep', 'Banded terminal knee extension'],
    ]);
    expect(out.items[0]!.dose).toEqual({ reps: 100, band: 'light' });
    expect(out.items[0]!.week).toBe(WEEK);
    expect(out.items[0]!.instructions.join(' ')).toMatch(/least effort/);
    expect(out.items[0]!.instructions.join(' ')).toMatch(/Soreness the next day means it was done too hard/);
    expect(out.notes).toEqual(expect.arrayContaining([...TISSUE_CAUTION]));
    expect(out.notes.join(' ')).toMatch(/sharp or unusual pain/);
    expect(out.notes.join(' ')).toMatch(/not medical advice/);
    expect(out.notes.join(' ')).toMatch(/hot, swollen or sore/);
    expect(out.suggestions).toEqual([]);
  });

  it('uses at least 100 reps by default (common practice: very-high-rep work of 100 or more)', () => {
    expect(DEFAULT_TISSUE_RULES.highRepReps).toBeGreaterThanOrEqual(100);
  });

  it('says so when there are no joints to work', () => {
    const out = prescribeTissueWork(input({ focusJoints: [] }));
    expect(out.items).toEqual([]);
    expect(out.notes.join(' ')).toMatch(/No focus joints/);
  });
});

describe('rotation', () => {
  it('keeps a kind going while its run is under the limit', () => {
    const out = prescribeTissueWork(input({ history: [iso(before(2), 'elbow', 3), iso(before(1), 'elbow', 3)] }));
    expect(out.kind).toBe('isometric');
    expect(out.notes[0]).toBe('Isometric pulses again: week 3 of at most 3 in a row.');
  });

  it('rotates a kind out after the limit, to the least recently used one', () => {
    const history = [iso(before(5), 'elbow', 3), ...[3, 2, 1].map((n) => highRep(before(n), 'elbow'))];
    const out = prescribeTissueWork(input({ history }));
    // Loaded stretch was never used, isometrics five weeks ago: the stretch is least recent.
    expect(out.kind).toBe('loadedStretch');
    expect(out.notes[0]).toMatch(/high-rep light work has run 3 weeks in a row, so it rotates out/);
  });

  it('breaks ties between unused kinds gentlest first', () => {
    const out = prescribeTissueWork(input({ history: [1, 2, 3].map((n) => highRep(before(n), 'elbow')) }));
    expect(out.kind).toBe('isometric');
  });

  it('counts a missed week as the end of a run', () => {
    const history = [highRep(before(4), 'elbow'), highRep(before(3), 'elbow'), highRep(before(1), 'elbow')];
    expect(prescribeTissueWork(input({ history })).kind).toBe('highRep');
  });

  it('follows the team limit', () => {
    const rules = { ...DEFAULT_TISSUE_RULES, maxConsecutiveWeeks: 1 };
    expect(prescribeTissueWork(input({ rules, history: [highRep(before(1), 'elbow')] })).kind).toBe('isometric');
  });

  it('ignores history from this week on', () => {
    const history = [highRep(WEEK, 'elbow'), highRep(addWeeks(WEEK, 1), 'elbow'), iso(before(1), 'elbow', 3)];
    expect(prescribeTissueWork(input({ history })).kind).toBe('isometric');
  });
});

describe('before a meet', () => {
  it('pulls loaded stretch first (4 weeks out by default), then isometrics (2 weeks out)', () => {
    const stretchHistory = [1, 2, 3].map((n) => highRep(before(n), 'elbow'));
    const allButStretch = [iso(before(6), 'elbow', 3), ...stretchHistory];
    // Stretch would be next (least recent), but 4 weeks out it is pulled; isometrics still allowed.
    const fourOut = prescribeTissueWork(input({ meetWeek: addWeeks(WEEK, 4), history: allButStretch }));
    expect(fourOut.kind).toBe('isometric');
    expect(fourOut.notes[0]).toBe('Loaded stretch is pulled: the meet is 4 weeks away.');
    const fiveOut = prescribeTissueWork(input({ meetWeek: addWeeks(WEEK, 5), history: allButStretch }));
    expect(fiveOut.kind).toBe('loadedStretch');
    const twoOut = prescribeTissueWork(input({ meetWeek: addWeeks(WEEK, 2), history: [iso(before(1), 'elbow', 4)] }));
    expect(twoOut.kind).toBe('highRep');
    expect(twoOut.notes[0]).toBe('Isometric pulses and loaded stretch are pulled: the meet is 2 weeks away.');
  });

  it('rests the week when only high-rep work is left and it has used up its run', () => {
    const out = prescribeTissueWork(
      input({ meetWeek: addWeeks(WEEK, 1), history: [1, 2, 3].map((n) => highRep(before(n), 'elbow')) }),
    );
    expect(out.kind).toBeNull();
    expect(out.items).toEqual([]);
    expect(out.notes.join(' ')).toMatch(/rest week/);
  });

  it('keeps high-rep work very easy in the last week before the meet and in meet week', () => {
    for (const d of [0, 1]) {
      const out = prescribeTissueWork(input({ meetWeek: addWeeks(WEEK, d) }));
      expect(out.kind).toBe('highRep');
      expect(out.notes.join(' ')).toMatch(/keep any high-rep work very easy and finish it early in the week/);
    }
    expect(prescribeTissueWork(input({ meetWeek: addWeeks(WEEK, 2) })).notes.join(' ')).not.toMatch(/finish it early/);
  });

  it('pulls nothing once the meet is past, and nothing with a window of -1', () => {
    const history = [1, 2, 3].map((n) => highRep(before(n), 'elbow'));
    expect(prescribeTissueWork(input({ meetWeek: before(1), history })).kind).toBe('isometric');
    const rules = { ...DEFAULT_TISSUE_RULES, pullIsometricWeeksOut: -1, pullStretchWeeksOut: -1 };
    expect(prescribeTissueWork(input({ rules, meetWeek: WEEK, history })).kind).toBe('isometric');
  });

  it('counts weeks to the meet across a 53-week year', () => {
    // 2026 has 53 ISO weeks: 2026-W52 → 2027-W02 is 3 weeks, inside the 4-week stretch window.
    const history = [
      iso('2026-W45', 'elbow', 3),
      ...['2026-W49', '2026-W50', '2026-W51'].map((w) => highRep(w, 'elbow')),
    ];
    const out = prescribeTissueWork(input({ week: '2026-W52', meetWeek: '2027-W03', history }));
    expect(out.notes[0]).toBe('Loaded stretch is pulled: the meet is 4 weeks away.');
    expect(out.kind).toBe('isometric');
  });
});

describe('isometric pulses', () => {
  const isoWeek = (history: TissuePrescription[], checkins: TissueCheckin[] = []) =>
    prescribeTissueWork(input({ history, checkins })).items[0]!;

  it('start very short, at 1 s', () => {
    // Common practice, no single published source: start with very short pulses (about 1 s) and build
    // toward about 3–5 s over weeks. The 1 s start, the 0.5 s step and the 5 s cap are our choice.
    expect(DEFAULT_TISSUE_RULES.isometricStartSeconds).toBe(1);
    expect(DEFAULT_TISSUE_RULES.isometricStepSeconds).toBe(0.5);
    expect(DEFAULT_TISSUE_RULES.isometricMaxSeconds).toBe(5);
    const out = prescribeTissueWork(input({ history: [1, 2, 3].map((n) => highRep(before(n), 'elbow')) }));
    expect(out.items[0]!.dose).toEqual({ seconds: 1, pulsesPerAngle: 3, angles: [10, 30, 50, 70, 90, 110, 130] });
    expect(out.items[0]!.instructions.join(' ')).toMatch(/No weight/);
    expect(out.items[0]!.instructions.join(' ')).toMatch(/3 pulses of 1 s at each angle: 10°, 30°/);
  });

  it('build from 1 s to 3 s in four easy weeks and to the 5 s cap in eight, then stay there', () => {
    const rules = { ...DEFAULT_TISSUE_RULES, maxConsecutiveWeeks: 12 };
    let history = Array.from({ length: 12 }, (_, i) => highRep(before(12 - i), 'elbow'));
    const checkins: TissueCheckin[] = [];
    const seconds: number[] = [];
    for (let i = 0; i < 10; i++) {
      const week = addWeeks(WEEK, i);
      const out = prescribeTissueWork(input({ week, rules, history, checkins }));
      const item = out.items[0]!;
      if (item.kind !== 'isometric') throw new Error(`expected isometrics in ${week}`);
      seconds.push(item.dose.seconds);
      history = [...history, item];
      checkins.push(checkin(week, 'isometric', 0));
    }
    expect(seconds).toEqual([1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5]);
  });

  it('lengthen by 0.5 s after a week without soreness, up to 5 s', () => {
    const item = isoWeek([iso(before(1), 'elbow', 3.5)], [checkin(before(1), 'isometric', 1)]);
    expect(item.dose).toMatchObject({ seconds: 4 });
    expect(item.instructions.join(' ')).toMatch(/one step up/);
    expect(isoWeek([iso(before(1), 'elbow', 5)], [checkin(before(1), 'isometric', 0)]).dose).toMatchObject({
      seconds: 5,
    });
    expect(isoWeek([iso(before(1), 'elbow', 4.8)], [checkin(before(1), 'isometric', 0)]).dose).toMatchObject({
      seconds: 5,
    });
  });

  it('step back after a sore week, hold without a check-in, start over after a long gap', () => {
    expect(isoWeek([iso(before(1), 'elbow', 4.5)], [checkin(before(1), 'isometric', 3)]).dose).toMatchObject({
      seconds: 4,
    });
    expect(isoWeek([iso(before(1), 'elbow', 3)], [checkin(before(1), 'isometric', 8)]).dose).toMatchObject({
      seconds: 2.5,
    });
    expect(isoWeek([iso(before(1), 'elbow', 1)], [checkin(before(1), 'isometric', 8)]).dose).toMatchObject({
      seconds: 1,
    });
    const held = isoWeek([iso(before(1), 'elbow', 4)]);
    expect(held.dose).toMatchObject({ seconds: 4 });
    expect(held.instructions.join(' ')).toMatch(/no check-in/);
    // Last isometrics 9 weeks ago, more than the 8-week reset: back to the start.
    const gap = [
      iso(before(9), 'elbow', 5),
      stretch(before(5), 'elbow', 60),
      ...[3, 2, 1].map((n) => highRep(before(n), 'elbow')),
    ];
    const restarted = isoWeek(gap, [checkin(before(9), 'isometric', 0)]);
    expect(restarted.dose).toMatchObject({ seconds: 1 });
    expect(restarted.instructions.join(' ')).toMatch(/starting over after 9 weeks away/);
  });

  it('follow the team’s start, step and cap', () => {
    const rules: TissueRules = {
      ...DEFAULT_TISSUE_RULES,
      isometricStartSeconds: 2,
      isometricStepSeconds: 1,
      isometricMaxSeconds: 4,
    };
    const out = prescribeTissueWork(
      input({ rules, history: [iso(before(1), 'elbow', 3.5)], checkins: [checkin(before(1), 'isometric', 0)] }),
    );
    expect(out.items[0]!.dose).toMatchObject({ seconds: 4 });
  });

  it('spread angles so that each, covering about ±10°, spans the working range', () => {
    // Common practice, no single source: each angle covers roughly ±10°.
    expect(isometricAngles('elbow', 10)).toEqual([10, 30, 50, 70, 90, 110, 130]);
    expect(isometricAngles('lowerBack', 10)).toEqual([10, 30]);
    expect(isometricAngles('wrist', 10)).toEqual([-50, -30, -10, 10, 30, 50]);
    expect(isometricAngles('hip', 10)).toEqual([10, 28, 46, 64, 82, 100]);
    for (const joint of JOINTS) {
      for (const cover of [5, 10, 15, 25]) {
        const angles = isometricAngles(joint, cover);
        const { from, to } = JOINT_WORKING_RANGE[joint];
        for (let a = from; a <= to; a++) {
          expect(Math.min(...angles.map((x) => Math.abs(x - a))), `${joint} ${a}° with ±${cover}°`).toBeLessThanOrEqual(
            cover + 0.5,
          );
        }
      }
    }
  });
});

describe('loaded stretch', () => {
  const history = (extra: TissuePrescription[]) => [iso(before(8), 'elbow', 3), ...extra];

  it('tires the muscle with high reps, then holds the stretch for minutes', () => {
    // Common practice, no single published source: hold the stretched position for minutes. The 2 min
    // set time is our choice.
    const out = prescribeTissueWork(input({ history: history([1, 2, 3].map((n) => highRep(before(n), 'elbow'))) }));
    expect(out.kind).toBe('loadedStretch');
    expect(out.items[0]!.dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
    expect(out.items[0]!.instructions[0]).toBe('First tire the muscle: 25 light reps of the same movement.');
    expect(out.items[0]!.instructions[1]).toMatch(/^Then hold the stretched position for 2 min,/);
    expect(out.items[0]!.instructions.join(' ')).toMatch(/do not lengthen it on your own/);
  });

  const stretchWeek = (holdSeconds: number, soreness?: number) =>
    prescribeTissueWork(
      input({
        history: [stretch(before(1), 'elbow', holdSeconds)],
        checkins: soreness === undefined ? [] : [checkin(before(1), 'loadedStretch', soreness)],
      }),
    ).items[0]!;

  it('keeps the hold at the set time week on week: no progression after easy weeks', () => {
    expect(stretchWeek(120, 0).dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
    expect(stretchWeek(120, 2).dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
    expect(stretchWeek(120).dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
    // A hold progressed under older rules comes back to the set time.
    expect(stretchWeek(180, 0).dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
    expect(stretchWeek(180).dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
  });

  it('shortens the hold by a quarter after a sore week, never under 30 s, and goes back to the set time', () => {
    const sore = stretchWeek(120, 4);
    expect(sore.dose).toEqual({ fatigueReps: 25, holdSeconds: 90 });
    expect(sore.instructions.join(' ')).toMatch(/Hold time shortened: soreness 4\/10 after 2027-W09/);
    expect(stretchWeek(90, 6).dose).toEqual({ fatigueReps: 25, holdSeconds: 70 });
    expect(stretchWeek(35, 9).dose).toEqual({ fatigueReps: 25, holdSeconds: 30 });
    expect(stretchWeek(30, 9).dose).toEqual({ fatigueReps: 25, holdSeconds: 30 });
    expect(stretchWeek(90).dose).toEqual({ fatigueReps: 25, holdSeconds: 90 });
    const back = stretchWeek(90, 1);
    expect(back.dose).toEqual({ fatigueReps: 25, holdSeconds: 120 });
    expect(back.instructions.join(' ')).toMatch(/back to the set time/);
  });

  it('ignores the step and cap settings of older rules', () => {
    const old = { ...DEFAULT_TISSUE_RULES, stretchStartSeconds: 60, stretchStepSeconds: 15, stretchMaxSeconds: 180 };
    const inp = input({
      history: [stretch(before(1), 'elbow', 120)],
      checkins: [checkin(before(1), 'loadedStretch', 0)],
    });
    expect(prescribeTissueWork({ ...inp, rules: old as TissueRules })).toEqual(prescribeTissueWork(inp));
  });
});

describe('high-rep dose after the next-day check-in', () => {
  const next = (last: TissuePrescription, soreness?: number) =>
    prescribeTissueWork(
      input({ history: [last], checkins: soreness === undefined ? [] : [checkin(last.week, 'highRep', soreness)] }),
    ).items[0]!;

  it('goes one band lighter, same reps, when soreness reaches the threshold', () => {
    const item = next(highRep(before(1), 'elbow', 100, 'light'), 3);
    expect(item.dose).toEqual({ reps: 100, band: 'lightest' });
    expect(item.instructions.join(' ')).toMatch(/Band one step lighter, same reps: soreness 3\/10 after 2027-W09/);
  });

  it('keeps the reps on the lightest band, splits them into easy sets and tells the coach', () => {
    // Common practice, no single published source: lower the effort, not the reps (100 or more).
    const out = prescribeTissueWork(
      input({ history: [highRep(before(1), 'elbow', 100, 'lightest')], checkins: [checkin(before(1), 'highRep', 6)] }),
    );
    const item = out.items[0]!;
    expect(item.dose).toEqual({ reps: 100, band: 'lightest', easySets: 4 });
    expect(item.instructions[0]).toBe(
      '100 reps with the lightest band, split into 4 easy sets of about 25 with 30–60 s rest between them.',
    );
    expect(item.instructions.join(' ')).toMatch(/Already on the lightest band and still sore \(soreness 6\/10/);
    expect(out.suggestions).toEqual([
      { joint: 'elbow', reason: 'soreness', message: expect.stringMatching(/lightest band .*4 easy sets/) },
    ]);
    // A sore week again on the split work: still the same reps, never fewer.
    const again = next(highRep(before(1), 'elbow', 100, 'lightest'), 10);
    expect(again.dose).toEqual({ reps: 100, band: 'lightest', easySets: 4 });
  });

  it('brings doses stored below 100 reps back to 100 (the floor)', () => {
    expect(next(highRep(before(1), 'elbow', 60, 'lightest'), 6).dose).toEqual({
      reps: 100,
      band: 'lightest',
      easySets: 4,
    });
    expect(next(highRep(before(1), 'elbow', 80, 'light'), 6).dose).toEqual({ reps: 100, band: 'lightest' });
  });

  it('follows a team floor above 100: no fewer reps than it, even sore', () => {
    const rules = { ...DEFAULT_TISSUE_RULES, highRepMinReps: 150, highRepReps: 150 };
    const out = prescribeTissueWork(
      input({
        rules,
        history: [highRep(before(1), 'elbow', 100, 'lightest')],
        checkins: [checkin(before(1), 'highRep', 5)],
      }),
    );
    expect(out.items[0]!.dose).toEqual({ reps: 150, band: 'lightest', easySets: 6 });
  });

  it('keeps the dose below the threshold or without a check-in, and never raises the band by itself', () => {
    expect(next(highRep(before(1), 'elbow', 100, 'light'), 2).dose).toEqual({ reps: 100, band: 'light' });
    expect(next(highRep(before(1), 'elbow', 100, 'lightest'), 1).dose).toEqual({ reps: 100, band: 'lightest' });
    const noCheckin = next(highRep(before(1), 'elbow', 100, 'lightest'));
    expect(noCheckin.dose).toEqual({ reps: 100, band: 'lightest' });
    expect(noCheckin.instructions.join(' ')).toMatch(/no check-in/);
    // Under a higher target the reps climb back by the step after a week without soreness.
    const rules = { ...DEFAULT_TISSUE_RULES, highRepReps: 140 };
    const climbed = prescribeTissueWork(
      input({
        rules,
        history: [highRep(before(1), 'elbow', 100, 'light')],
        checkins: [checkin(before(1), 'highRep', 0)],
      }),
    );
    expect(climbed.items[0]!.dose).toEqual({ reps: 120, band: 'light' });
    expect(climbed.items[0]!.instructions.join(' ')).toMatch(/20 reps back on/);
  });

  it('takes the lighter of two entries for the same week and joint, whatever their order', () => {
    const a = highRep(before(1), 'elbow', 100, 'light');
    const b = highRep(before(1), 'elbow', 80, 'lightest');
    for (const history of [
      [a, b],
      [b, a],
    ]) {
      const out = prescribeTissueWork(input({ history, checkins: [checkin(before(1), 'highRep', 5)] }));
      expect(out.items[0]!.dose).toEqual({ reps: 100, band: 'lightest', easySets: 4 });
    }
  });

  it('merges two check-ins for the same week to the worse soreness', () => {
    const checkins = [checkin(before(1), 'highRep', 1), checkin(before(1), 'highRep', 4)];
    const out = prescribeTissueWork(input({ history: [highRep(before(1), 'elbow')], checkins }));
    expect(out.items[0]!.dose).toEqual({ reps: 100, band: 'lightest' });
  });

  it('reads the check-in after the last high-rep week, not a later one of another kind', () => {
    const rules = { ...DEFAULT_TISSUE_RULES, highRepBand: 'medium' as const };
    const history = [
      highRep(before(5), 'elbow', 100, 'medium'),
      stretch(before(4), 'elbow', 60),
      ...[3, 2, 1].map((n) => iso(before(n), 'elbow', 3)),
    ];
    const checkins = [checkin(before(5), 'highRep', 7), checkin(before(1), 'isometric', 0)];
    // Isometrics have used up their run; high-rep work (5 weeks ago) is less recent than the stretch (4).
    const out = prescribeTissueWork(input({ rules, history, checkins }));
    expect(out.kind).toBe('highRep');
    expect(out.items[0]!.dose).toEqual({ reps: 100, band: 'light' });
  });
});

describe('pain on a joint', () => {
  it('pauses that joint and suggests a restriction to the coach, for two weeks', () => {
    const history = [highRep(before(1), 'elbow'), highRep(before(1), 'knee')];
    const checkins = [checkin(before(1), 'highRep', 1, ['elbow'])];
    const out = prescribeTissueWork(input({ focusJoints: ['elbow', 'knee'], history, checkins }));
    expect(out.items.map((i) => i.joint)).toEqual(['knee']);
    expect(out.suggestions).toHaveLength(1);
    expect(out.suggestions[0]!.joint).toBe('elbow');
    expect(out.suggestions[0]!.message).toMatch(/Pain at the elbow reported after high-rep light work \(2027-W09\)/);
    expect(out.suggestions[0]!.message).toMatch(/restriction on the elbow/);
    expect(out.suggestions[0]!.message).toMatch(/licensed clinician/);
    expect(out.notes.join(' ')).toMatch(/No work on the elbow this week/);
    const weekAfter = prescribeTissueWork(
      input({ week: addWeeks(WEEK, 1), focusJoints: ['elbow', 'knee'], history, checkins }),
    );
    expect(weekAfter.suggestions.map((s) => s.joint)).toEqual(['elbow']);
    const twoAfter = prescribeTissueWork(
      input({ week: addWeeks(WEEK, 2), focusJoints: ['elbow', 'knee'], history, checkins }),
    );
    expect(twoAfter.suggestions).toEqual([]);
    expect(twoAfter.items.map((i) => i.joint)).toEqual(['elbow', 'knee']);
  });

  it('suggests for a joint outside the focus list too, one suggestion per joint', () => {
    const checkins = [
      checkin(before(1), 'highRep', 0, ['wrist']),
      checkin(before(2), 'isometric', 0, ['wrist', 'lowerBack']),
    ];
    const out = prescribeTissueWork(input({ checkins }));
    expect(out.suggestions.map((s) => s.joint)).toEqual(['wrist', 'lowerBack']);
    expect(out.suggestions[0]!.message).toMatch(
      /after isometric pulses and high-rep light work \(2027-W08, 2027-W09\)/,
    );
    expect(out.items.map((i) => i.joint)).toEqual(['elbow']);
  });
});

describe('joint restrictions', () => {
  it('gives no work to a joint restricted that week, says why, and does not fill its place', () => {
    const restrictions: Restriction[] = [
      { joint: 'elbow', maxStress: 1, fromWeek: before(2), toWeek: addWeeks(WEEK, 2) },
      // By family only: names no joint, keeps nothing out.
      { families: ['board press'], fromWeek: before(1) },
    ];
    const out = prescribeTissueWork(input({ focusJoints: ['elbow', 'knee'], restrictions }));
    expect(out.items.map((i) => i.joint)).toEqual(['knee']);
    expect(out.notes).toContain(
      'No work on the elbow this week: the athlete has a restriction on it (2027-W08 to 2027-W12).',
    );
  });

  it('keeps to the restriction’s weeks: before it starts and after it ends the joint is worked', () => {
    const restrictions: Restriction[] = [
      { joint: 'knee', maxStress: 0, fromWeek: addWeeks(WEEK, 1), toWeek: addWeeks(WEEK, 3) },
    ];
    const at = (w: string) => prescribeTissueWork(input({ week: w, focusJoints: ['knee'], restrictions })).items;
    expect(at(WEEK).map((i) => i.joint)).toEqual(['knee']);
    expect(at(addWeeks(WEEK, 1))).toEqual([]);
    expect(at(addWeeks(WEEK, 3))).toEqual([]);
    expect(at(addWeeks(WEEK, 4)).map((i) => i.joint)).toEqual(['knee']);
    const open = prescribeTissueWork(
      input({ focusJoints: ['knee', 'hip'], restrictions: [{ joint: 'knee', maxStress: 2, fromWeek: before(4) }] }),
    );
    expect(open.items.map((i) => i.joint)).toEqual(['hip']);
    expect(open.notes.join(' ')).toMatch(/restriction on it \(from 2027-W06, no end set\)/);
  });

  it('tells the coach a restriction is already in place when pain is flagged on a restricted joint', () => {
    const out = prescribeTissueWork(
      input({
        checkins: [checkin(before(1), 'highRep', 1, ['elbow'])],
        restrictions: [{ joint: 'elbow', maxStress: 1, fromWeek: before(1) }],
      }),
    );
    expect(out.suggestions).toHaveLength(1);
    expect(out.suggestions[0]!.message).toMatch(
      /A restriction on the elbow is in place \(from 2027-W09, no end set\): keep it while the pain lasts/,
    );
    expect(out.suggestions[0]!.message).not.toMatch(/Consider adding/);
    expect(out.suggestions[0]!.message).toMatch(/licensed clinician/);
  });

  it('lists the restricted joints of a week', () => {
    const restrictions: Restriction[] = [
      { joint: 'wrist', maxStress: 1, toWeek: WEEK },
      { joint: 'wrist', maxStress: 2, fromWeek: before(3), toWeek: addWeeks(WEEK, 1) },
      { joint: 'hip', maxStress: 1, fromWeek: addWeeks(WEEK, 1) },
    ];
    expect([...restrictedJoints(WEEK, restrictions)]).toEqual([['wrist', 'until 2027-W10']]);
  });

  it('refuses a restriction on an unknown joint or with a malformed week', () => {
    expect(() => prescribeTissueWork(input({ restrictions: [{ joint: 'neck' as Joint, maxStress: 1 }] }))).toThrow(
      /restricted joint .*neck/,
    );
    expect(() =>
      prescribeTissueWork(input({ restrictions: [{ joint: 'knee', maxStress: 1, fromWeek: 'soon' }] })),
    ).toThrow(/soon/);
  });
});

describe('sessions a week', () => {
  it('puts the team’s weekly session count on every item: three by default', () => {
    // Common practice, no single published source (from memory): short tendon work about three times a
    // week, on separate days. Three is our default; the team sets its own.
    expect(DEFAULT_TISSUE_RULES.sessionsPerWeek).toBe(3);
    const out = prescribeTissueWork(input({ focusJoints: ['elbow', 'knee'] }));
    expect(out.items.map((i) => i.sessionsPerWeek)).toEqual([3, 3]);
    const two = prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, sessionsPerWeek: 2 } }));
    expect(two.items[0]!.sessionsPerWeek).toBe(2);
  });

  it('refuses a count outside 1–7', () => {
    for (const sessionsPerWeek of [0, 8, 2.5]) {
      expect(() => prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, sessionsPerWeek } }))).toThrow(
        /sessionsPerWeek must be/,
      );
    }
  });
});

describe('target joints', () => {
  it('orders the focus list by max-effort load, then adds other loaded joints, up to the weekly cap', () => {
    const jointLoad = { elbow: 2, knee: 5, hip: 4, wrist: 1 };
    const out = prescribeTissueWork(input({ focusJoints: ['elbow', 'knee', 'elbow'], jointLoad }));
    expect(out.items.map((i) => i.joint)).toEqual(['knee', 'elbow', 'hip']);
    const two = prescribeTissueWork(
      input({ focusJoints: [], jointLoad, rules: { ...DEFAULT_TISSUE_RULES, maxJointsPerWeek: 2 } }),
    );
    expect(two.items.map((i) => i.joint)).toEqual(['knee', 'hip']);
  });

  it('sums variant stress into a joint load', () => {
    const picks = [{ stress: { lowerBack: 3, hip: 2 } }, { stress: { elbow: 2, lowerBack: 1, knee: 0 } }];
    expect(jointLoadOf(picks)).toEqual({ lowerBack: 4, hip: 2, elbow: 2 });
  });
});

describe('bad input', () => {
  it('throws a RangeError naming the bad value', () => {
    expect(() => prescribeTissueWork(input({ week: '2027-W60' }))).toThrow(RangeError);
    expect(() => prescribeTissueWork(input({ meetWeek: 'soon' }))).toThrow(/soon/);
    expect(() => prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, maxConsecutiveWeeks: 0 } }))).toThrow(
      /maxConsecutiveWeeks .*0/,
    );
    expect(() => prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, sorenessThreshold: 11 } }))).toThrow(
      /sorenessThreshold .*11/,
    );
    expect(() => prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, isometricMaxSeconds: 0.5 } }))).toThrow(
      /isometricMaxSeconds \(0.5\)/,
    );
    expect(() =>
      prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, highRepBand: 'heavy' as BandLevel } })),
    ).toThrow(/heavy/);
    expect(() => prescribeTissueWork(input({ checkins: [checkin(before(1), 'highRep', 12)] }))).toThrow(
      /soreness .*12/,
    );
    expect(() => prescribeTissueWork(input({ checkins: [checkin(before(1), 'highRep', Number.NaN)] }))).toThrow(
      /soreness .*NaN/,
    );
    expect(() => prescribeTissueWork(input({ focusJoints: ['neck' as Joint] }))).toThrow(/neck/);
    expect(() => prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, stretchHoldSeconds: 10 } }))).toThrow(
      /stretchHoldSeconds must be at least 30, got 10/,
    );
    expect(() => prescribeTissueWork(input({ history: [highRep(before(1), 'elbow', 0)] }))).toThrow(
      /reps in history .*0/,
    );
    for (const highRepMinReps of [99, 60, 100.5]) {
      expect(() => prescribeTissueWork(input({ rules: { ...DEFAULT_TISSUE_RULES, highRepMinReps } }))).toThrow(
        new RangeError(
          `highRepMinReps must be a whole number of at least 100 (high-rep work is 100 reps or more), got ${highRepMinReps}`,
        ),
      );
    }
  });
});

// ---- properties over random histories ------------------------------------------------------------------

const jointArb = fc.constantFrom(...JOINTS);

function randomItem(week: string, kind: TissueKind, joint: Joint, n: number): TissuePrescription {
  if (kind === 'highRep') return highRep(week, joint, 60 + 20 * (n % 3), BAND_LEVELS[n % 3]!);
  // Stored pulses from 0.5 s to 5.5 s: outside today's start and cap too (older rules).
  if (kind === 'isometric') return iso(week, joint, 0.5 + 0.5 * (n % 11));
  return stretch(week, joint, 60 + 15 * (n % 9));
}

/** A random past: some weeks empty, some with one kind on a few joints, some with coach-mixed kinds. */
const historyArb = fc
  .array(
    fc.record({
      kinds: fc.subarray([...TISSUE_KINDS]),
      joints: fc.uniqueArray(jointArb, { maxLength: 3 }),
      n: fc.nat(100),
    }),
    { maxLength: 12 },
  )
  .map((weeks) =>
    weeks.flatMap((w, i) => {
      const week = addWeeks(WEEK, i - weeks.length);
      return w.kinds.flatMap((k, j) => w.joints.map((joint) => randomItem(week, k, joint, w.n + j)));
    }),
  );

const rulesArb: fc.Arbitrary<TissueRules> = fc
  .record({
    maxConsecutiveWeeks: fc.integer({ min: 1, max: 4 }),
    pullIsometricWeeksOut: fc.integer({ min: -1, max: 5 }),
    pullStretchWeeksOut: fc.integer({ min: -1, max: 6 }),
    sorenessThreshold: fc.integer({ min: 1, max: 8 }),
  })
  .map((r) => ({ ...DEFAULT_TISSUE_RULES, ...r }));

interface Scenario {
  rules: TissueRules;
  history: TissuePrescription[];
  focusJoints: Joint[];
  meetIn: number | null;
  weeks: number;
  restrictions: Restriction[];
  feel: { soreness: number; pain: Joint[] }[];
}

const scenarioArb = (rules: fc.Arbitrary<TissueRules>): fc.Arbitrary<Scenario> =>
  fc.record({
    rules,
    history: historyArb,
    focusJoints: fc.uniqueArray(jointArb, { minLength: 1, maxLength: 4 }),
    meetIn: fc.option(fc.integer({ min: 0, max: 20 })),
    weeks: fc.integer({ min: 1, max: 16 }),
    restrictions: fc.array(
      fc
        .record({
          joint: jointArb,
          from: fc.option(fc.integer({ min: -4, max: 16 })),
          length: fc.option(fc.integer({ min: 0, max: 6 })),
        })
        .map(({ joint, from, length }) => ({
          joint,
          maxStress: 1,
          ...(from !== null ? { fromWeek: addWeeks(WEEK, from) } : {}),
          ...(length !== null ? { toWeek: addWeeks(WEEK, (from ?? 0) + length) } : {}),
        })),
      { maxLength: 3 },
    ),
    feel: fc.array(
      fc.record({
        soreness: fc.integer({ min: 0, max: 10 }),
        pain: fc.oneof(
          { weight: 4, arbitrary: fc.constant<Joint[]>([]) },
          { weight: 1, arbitrary: fc.uniqueArray(jointArb, { maxLength: 2 }) },
        ),
      }),
      { minLength: 16, maxLength: 16 },
    ),
  });

interface Step {
  week: string;
  input: TissueInput;
  out: ReturnType<typeof prescribeTissueWork>;
}

/** Plays the scenario week by week, each week's items and check-in feeding the next. */
function play(s: Scenario): { steps: Step[]; history: TissuePrescription[]; checkins: TissueCheckin[] } {
  let history = [...s.history];
  const checkins: TissueCheckin[] = [];
  const meetWeek = s.meetIn === null ? undefined : addWeeks(WEEK, s.meetIn);
  const steps: Step[] = [];
  for (let i = 0; i < s.weeks; i++) {
    const week = addWeeks(WEEK, i);
    const inp: TissueInput = {
      week,
      meetWeek,
      rules: s.rules,
      history,
      checkins: [...checkins],
      focusJoints: s.focusJoints,
      restrictions: s.restrictions,
    };
    const out = prescribeTissueWork(inp);
    steps.push({ week, input: inp, out });
    history = [...history, ...out.items];
    const feel = s.feel[i]!;
    if (out.kind) checkins.push(checkin(week, out.kind, feel.soreness, feel.pain));
  }
  return { steps, history, checkins };
}

function kindsByWeek(history: TissuePrescription[]): Map<number, Set<TissueKind>> {
  const m = new Map<number, Set<TissueKind>>();
  for (const h of history) {
    const n = weekNumber(h.week);
    m.set(n, (m.get(n) ?? new Set()).add(h.kind));
  }
  return m;
}

describe('properties', () => {
  it('never runs one kind more than the team limit in a row, whatever came before', () => {
    fc.assert(
      fc.property(scenarioArb(rulesArb), (s) => {
        const { steps, history } = play(s);
        const byWeek = kindsByWeek(history);
        for (const { week, out } of steps) {
          if (!out.kind) continue;
          expect(new Set(out.items.map((i) => i.kind)).size).toBeLessThanOrEqual(1);
          let run = 1;
          while (byWeek.get(weekNumber(week) - run)?.has(out.kind)) run++;
          expect(run, `${out.kind} in ${week}`).toBeLessThanOrEqual(s.rules.maxConsecutiveWeeks);
        }
      }),
    );
  });

  it('never gives isometrics or loaded stretch inside their pull windows before the meet', () => {
    fc.assert(
      fc.property(scenarioArb(rulesArb), (s) => {
        for (const { week, input: inp, out } of play(s).steps) {
          if (!inp.meetWeek) continue;
          const d = weekNumber(inp.meetWeek) - weekNumber(week);
          for (const item of out.items) {
            if (item.kind === 'isometric') expect(d >= 0 && d <= s.rules.pullIsometricWeeksOut).toBe(false);
            if (item.kind === 'loadedStretch') expect(d >= 0 && d <= s.rules.pullStretchWeeksOut).toBe(false);
          }
        }
      }),
    );
  });

  it('keeps isometric pulses within [start, cap], at most one step up, and never longer after a sore week', () => {
    const isoRules = fc
      .tuple(rulesArb, fc.integer({ min: 1, max: 6 }), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 0, max: 8 }))
      .map(([r, start, step, room]) => ({
        ...r,
        isometricStartSeconds: start / 2,
        isometricStepSeconds: step / 2,
        isometricMaxSeconds: (start + room) / 2,
      }));
    fc.assert(
      fc.property(fc.oneof(scenarioArb(isoRules), scenarioArb(fc.constant(DEFAULT_TISSUE_RULES))), (s) => {
        const r = s.rules;
        for (const { input: inp, out } of play(s).steps) {
          for (const item of out.items) {
            if (item.kind !== 'isometric') continue;
            expect(item.dose.seconds).toBeGreaterThanOrEqual(r.isometricStartSeconds);
            expect(item.dose.seconds).toBeLessThanOrEqual(r.isometricMaxSeconds);
            const prev = inp.history
              .filter(
                (h): h is Extract<TissuePrescription, { kind: 'isometric' }> =>
                  h.kind === 'isometric' && h.joint === item.joint,
              )
              .sort((a, b) => weekNumber(b.week) - weekNumber(a.week) || a.dose.seconds - b.dose.seconds)[0];
            if (!prev) continue;
            const last = Math.min(r.isometricMaxSeconds, Math.max(r.isometricStartSeconds, prev.dose.seconds));
            expect(item.dose.seconds).toBeLessThanOrEqual(last + r.isometricStepSeconds);
            const soreness = inp.checkins
              .filter((c) => c.week === prev.week && c.kind === 'isometric')
              .reduce((m, c) => Math.max(m, c.soreness), -1);
            // After a sore week, or with no check-in, the pulses never get longer.
            if (soreness < 0 || soreness >= r.sorenessThreshold) expect(item.dose.seconds).toBeLessThanOrEqual(last);
          }
        }
      }),
    );
  });

  it('never holds a loaded stretch longer than the set time, nor longer than last time after a sore week', () => {
    const holdRules = fc
      .tuple(rulesArb, fc.integer({ min: 6, max: 60 }))
      .map(([r, fives]) => ({ ...r, stretchHoldSeconds: fives * 5 }));
    fc.assert(
      fc.property(fc.oneof(scenarioArb(holdRules), scenarioArb(fc.constant(DEFAULT_TISSUE_RULES))), (s) => {
        for (const { input: inp, out } of play(s).steps) {
          for (const item of out.items) {
            if (item.kind !== 'loadedStretch') continue;
            expect(item.dose.holdSeconds).toBeLessThanOrEqual(s.rules.stretchHoldSeconds);
            expect(item.dose.holdSeconds).toBeGreaterThanOrEqual(30);
            const prev = inp.history
              .filter(
                (h): h is Extract<TissuePrescription, { kind: 'loadedStretch' }> =>
                  h.kind === 'loadedStretch' && h.joint === item.joint,
              )
              .sort((a, b) => weekNumber(b.week) - weekNumber(a.week) || a.dose.holdSeconds - b.dose.holdSeconds)[0];
            if (!prev || weekNumber(item.week) - weekNumber(prev.week) > s.rules.progressionResetWeeks) continue;
            const sore = inp.checkins.some(
              (c) => c.week === prev.week && c.kind === 'loadedStretch' && c.soreness >= s.rules.sorenessThreshold,
            );
            if (sore) expect(item.dose.holdSeconds).toBeLessThanOrEqual(Math.max(30, prev.dose.holdSeconds));
          }
        }
      }),
    );
  });

  it('never makes high-rep work heavier after a sore check-in: a lighter band, or easy sets on the lightest', () => {
    fc.assert(
      fc.property(scenarioArb(rulesArb), (s) => {
        const { steps } = play(s);
        for (const { input: inp, out } of steps) {
          for (const item of out.items) {
            if (item.kind !== 'highRep') continue;
            const prev = inp.history
              .filter(
                (h): h is Extract<TissuePrescription, { kind: 'highRep' }> =>
                  h.kind === 'highRep' && h.joint === item.joint,
              )
              .sort(
                (a, b) =>
                  weekNumber(b.week) - weekNumber(a.week) ||
                  BAND_LEVELS.indexOf(a.dose.band) - BAND_LEVELS.indexOf(b.dose.band) ||
                  a.dose.reps - b.dose.reps,
              )[0];
            if (!prev) continue;
            const sore = inp.checkins.some(
              (c) => c.week === prev.week && c.kind === 'highRep' && c.soreness >= s.rules.sorenessThreshold,
            );
            if (!sore) continue;
            const shown = `${JSON.stringify(prev.dose)} → ${JSON.stringify(item.dose)}`;
            // The reps stay (or come up to the floor); only the effort goes down.
            expect(item.dose.reps, shown).toBe(
              Math.max(s.rules.highRepMinReps, Math.min(prev.dose.reps, s.rules.highRepReps)),
            );
            const prevBand = Math.min(BAND_LEVELS.indexOf(prev.dose.band), BAND_LEVELS.indexOf(s.rules.highRepBand));
            if (prevBand > 0) {
              expect(BAND_LEVELS.indexOf(item.dose.band), shown).toBe(prevBand - 1);
              expect(item.dose.easySets, shown).toBeUndefined();
            } else {
              expect(item.dose.band, shown).toBe('lightest');
              expect(item.dose.easySets, shown).toBe(Math.ceil(item.dose.reps / 25));
              expect(out.suggestions.some((g) => g.joint === item.joint && g.reason === 'soreness')).toBe(true);
            }
          }
        }
      }),
    );
  });

  it('never gives high-rep work fewer than 100 reps, or fewer than the team floor, whatever came before', () => {
    const floorRules = fc
      .tuple(rulesArb, fc.integer({ min: 100, max: 300 }), fc.integer({ min: 0, max: 100 }))
      .map(([r, min, extra]) => ({ ...r, highRepMinReps: min, highRepReps: min + extra }));
    fc.assert(
      fc.property(scenarioArb(floorRules), (s) => {
        for (const { out } of play(s).steps) {
          for (const item of out.items) {
            if (item.kind !== 'highRep') continue;
            expect(item.dose.reps).toBeGreaterThanOrEqual(100);
            expect(item.dose.reps).toBeGreaterThanOrEqual(s.rules.highRepMinReps);
            expect(item.dose.reps).toBeLessThanOrEqual(s.rules.highRepReps);
          }
        }
      }),
    );
  });

  it('never gives an item on a joint restricted that week', () => {
    fc.assert(
      fc.property(scenarioArb(rulesArb), (s) => {
        for (const { week, out } of play(s).steps) {
          const n = weekNumber(week);
          for (const item of out.items) {
            const covering = s.restrictions.filter(
              (r) =>
                r.joint === item.joint &&
                (r.fromWeek === undefined || weekNumber(r.fromWeek) <= n) &&
                (r.toWeek === undefined || n <= weekNumber(r.toWeek)),
            );
            expect(covering, `${item.joint} in ${week}`).toEqual([]);
          }
        }
      }),
    );
  });

  it('is deterministic and does not depend on the order of history or check-ins', () => {
    fc.assert(
      fc.property(scenarioArb(rulesArb), fc.nat(), (s, seed) => {
        const { history, checkins } = play(s);
        const inp: TissueInput = {
          week: addWeeks(WEEK, s.weeks),
          meetWeek: s.meetIn === null ? undefined : addWeeks(WEEK, s.meetIn),
          rules: s.rules,
          history,
          checkins,
          focusJoints: s.focusJoints,
        };
        const first = prescribeTissueWork(inp);
        expect(prescribeTissueWork(structuredClone(inp))).toEqual(first);
        const shuffle = <T>(xs: T[]): T[] =>
          xs
            .map((x, i) => ({ x, k: (i * 7919 + seed) % 104729 }))
            .sort((a, b) => a.k - b.k)
            .map((e) => e.x);
        expect(prescribeTissueWork({ ...inp, history: shuffle(history), checkins: shuffle(checkins) })).toEqual(first);
      }),
    );
  });
});
