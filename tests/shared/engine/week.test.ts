// The training week's engine rules: which week of the speed wave a week is, the default speed work, deloads,
// and sessions for rules saved before sessions existed.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addWeeks } from '../../../shared/engine/weeks';
import { defaultSpeedWork, deloaded, sessionWorkFor, waveWeek } from '../../../shared/engine/week';
import {
  DEFAULT_SESSIONS,
  DEFAULT_TEAM_RULES,
  readTeamRules,
  teamRulesSchema,
  type SessionWork,
} from '../../../shared/schemas';

describe('speed wave weeks (three-week waves: common practice, no published source)', () => {
  it('cycles 1, 2, 3 week after week, across a year end', () => {
    const start = '2026-W51';
    const seq = Array.from({ length: 6 }, (_, i) => waveWeek(addWeeks(start, i)));
    expect(new Set(seq.slice(0, 3))).toEqual(new Set([1, 2, 3]));
    seq.forEach((w, i) => {
      if (i > 0) expect(w).toBe((seq[i - 1]! % 3) + 1);
    });
  });
  it('the default speed work follows the wave: 50, 55, 60 % and the lift’s sets × reps', () => {
    const week = '2027-W10';
    const pct = 50 + 5 * (waveWeek(week) - 1);
    expect(defaultSpeedWork('bench', week)).toEqual({ pct, sets: 9, reps: 3, accommodation: 'none' });
  });
});

describe('sessionWorkFor', () => {
  it('keeps the coach’s work and gives a session only the parts it has', () => {
    const speed = DEFAULT_SESSIONS.find((s) => s.id === 'upper-speed')!;
    const me = DEFAULT_SESSIONS.find((s) => s.id === 'lower-me')!;
    const stored: SessionWork = { speed: { pct: 58, sets: 7, reps: 3, accommodation: 'chains' }, accessories: [] };
    expect(sessionWorkFor(speed, '2027-W10', stored)).toEqual(stored);
    expect(sessionWorkFor(me, '2027-W10', undefined)).toEqual({ speed: null, accessories: [] });
  });
});

describe('deloaded (lighter speed and accessory work: common practice, no published source)', () => {
  it('lowers speed work 10 points with a third fewer sets, accessories one set fewer and RPE ≤ 7', () => {
    const out = deloaded({
      speed: { pct: 55, sets: 9, reps: 3, accommodation: 'none' },
      accessories: [{ name: 'Row', category: 'upperBack', sets: 4, reps: 10, loadKg: null, rpe: 8.5 }],
    });
    expect(out.speed).toEqual({ pct: 45, sets: 6, reps: 3, accommodation: 'none' });
    expect(out.accessories[0]).toMatchObject({ sets: 3, rpe: 7 });
  });
  it('never goes under 30 % or one set, never asks for more (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 30, max: 100 }),
        fc.integer({ min: 1, max: 20 }),
        fc.integer({ min: 1, max: 10 }),
        (pct, sets, accSets) => {
          const out = deloaded({
            speed: { pct, sets, reps: 2, accommodation: 'none' },
            accessories: [{ name: 'Curl', category: 'grip', sets: accSets, reps: 12, loadKg: 20, rpe: null }],
          });
          expect(out.speed!.pct).toBeGreaterThanOrEqual(30);
          expect(out.speed!.pct).toBeLessThanOrEqual(pct);
          expect(out.speed!.sets).toBeGreaterThanOrEqual(1);
          expect(out.speed!.sets).toBeLessThanOrEqual(sets);
          expect(out.accessories[0]!.sets).toBeGreaterThanOrEqual(1);
          expect(out.accessories[0]!.sets).toBeLessThanOrEqual(accSets);
        },
      ),
    );
  });
});

describe('rules saved before sessions existed', () => {
  it('get the default week when their slots fit it', () => {
    const { sessions: _, ...old } = DEFAULT_TEAM_RULES;
    expect(readTeamRules({ ...old, repeatWindowWeeks: 9 })).toMatchObject({
      repeatWindowWeeks: 9,
      sessions: DEFAULT_SESSIONS,
    });
  });
  it('with slots of their own, one max-effort session per slot, keeping the rest of the rules', () => {
    const { sessions: _, ...old } = DEFAULT_TEAM_RULES;
    const rules = readTeamRules({
      ...old,
      repeatWindowWeeks: 9,
      slots: [{ id: 'heavy', label: 'Heavy day', lifts: ['squat'] }],
    });
    expect(rules.repeatWindowWeeks).toBe(9);
    expect(rules.sessions).toEqual([
      {
        id: 'me-1',
        name: 'Heavy day',
        weekday: 1,
        parts: ['maxEffort', 'accessories'],
        slotId: 'heavy',
        speedLift: null,
      },
    ]);
  });
});

describe('back-off and accessory rotation settings in the team rules', () => {
  it('a team saved before they existed reads the defaults: 2 back-off sets 10 % lighter, 3-week blocks, 6-week window', () => {
    const { backOff: _b, accessoryRotation: _a, ...old } = DEFAULT_TEAM_RULES;
    expect(readTeamRules({ ...old, repeatWindowWeeks: 9 })).toMatchObject({
      repeatWindowWeeks: 9,
      backOff: { sets: 2, dropPct: 10 },
      accessoryRotation: { blockWeeks: 3, repeatWindowWeeks: 6 },
    });
  });
  it('a stored value out of range reads its default without losing the team’s other rules', () => {
    const rules = readTeamRules({
      ...DEFAULT_TEAM_RULES,
      familyWindowWeeks: 5,
      backOff: { sets: 9, dropPct: 10 },
      accessoryRotation: { blockWeeks: 4, repeatWindowWeeks: 2 },
    });
    expect(rules).toMatchObject({
      familyWindowWeeks: 5,
      backOff: { sets: 2, dropPct: 10 },
      accessoryRotation: { blockWeeks: 3, repeatWindowWeeks: 6 },
    });
  });
  it('the request schema refuses bad values on their fields', () => {
    const bad = teamRulesSchema.safeParse({
      ...DEFAULT_TEAM_RULES,
      backOff: { sets: 1.5, dropPct: 40 },
      accessoryRotation: { blockWeeks: 4, repeatWindowWeeks: 3 },
    });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(
      expect.arrayContaining(['backOff.sets', 'backOff.dropPct', 'accessoryRotation.repeatWindowWeeks']),
    );
    const none = teamRulesSchema.safeParse({ ...DEFAULT_TEAM_RULES, backOff: { sets: 0, dropPct: 10 } });
    expect(none.success).toBe(true);
  });
});
