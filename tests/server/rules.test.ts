// The team rules API: every coach reads, the head coach writes the whole document with the version read.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { eq } from 'drizzle-orm';
import { teamRules, teams } from '../../server/db/schema';
import { DEFAULT_TEAM_RULES, type TeamRules } from '../../shared/schemas';
import { useTestApp } from '../support/app';
import { createTeam, createUser, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let head: request.Agent;
let coach: request.Agent;

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
  head = await t.signIn(team.headCoach.email);
  coach = await t.signIn(team.coach.email);
});

const edited = (r: TeamRules): TeamRules => ({
  ...r,
  repeatWindowWeeks: 8,
  jointBudget: { ...r.jointBudget, elbow: 6 },
  taper: [{ weeksOut: 2, maxRisk: 1, minSpecificity: 0.75 }],
  tissue: { ...r.tissue, maxConsecutiveWeeks: 2 },
});

describe('GET /api/rules', () => {
  it('gives coaches the rules, the gym’s equipment and the version', async () => {
    const res = await coach.get('/api/rules');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      rules: DEFAULT_TEAM_RULES,
      equipment: ['box', 'bands', 'rack pins', 'boards'],
      version: 1,
    });
  });

  it('fills settings stored before they existed with their defaults', async () => {
    const db = t.ctx.database.db;
    const older = await createTeam(db);
    const { tissue: _tissue, bodyweightGainCautionKg: _bw, ...old } = DEFAULT_TEAM_RULES;
    await db
      .update(teamRules)
      .set({ rules: { ...old, repeatWindowWeeks: 5 } })
      .where(eq(teamRules.teamId, older.teamId));
    const res = await (await t.signIn(older.coach.email)).get('/api/rules');
    expect(res.body.rules).toEqual({ ...DEFAULT_TEAM_RULES, repeatWindowWeeks: 5 });
  });
});

describe('stored tissue settings', () => {
  it('load when saved with fewer than 100 high-rep reps (clamped to 100) or with settings since dropped', async () => {
    const db = t.ctx.database.db;
    const older = await createTeam(db);
    const { highRepMinReps: _reps, sessionsPerWeek: _sessions, ...tissue } = DEFAULT_TEAM_RULES.tissue;
    await db
      .update(teamRules)
      .set({
        rules: {
          ...DEFAULT_TEAM_RULES,
          repeatWindowWeeks: 7,
          // Left from older versions: a floor of 60 reps and the loaded stretch's weekly step and cap.
          tissue: {
            ...tissue,
            maxConsecutiveWeeks: 2,
            highRepMinReps: 60,
            stretchStepSeconds: 15,
            stretchMaxSeconds: 180,
          },
        },
      })
      .where(eq(teamRules.teamId, older.teamId));
    const res = await (await t.signIn(older.coach.email)).get('/api/rules');
    expect(res.status).toBe(200);
    expect(res.body.rules).toEqual({
      ...DEFAULT_TEAM_RULES,
      repeatWindowWeeks: 7,
      tissue: { ...DEFAULT_TEAM_RULES.tissue, maxConsecutiveWeeks: 2, highRepMinReps: 100 },
    });
    // Without the settings at all: their defaults.
    await db
      .update(teamRules)
      .set({ rules: { ...DEFAULT_TEAM_RULES, tissue } })
      .where(eq(teamRules.teamId, older.teamId));
    expect((await (await t.signIn(older.coach.email)).get('/api/rules')).body.rules).toEqual(DEFAULT_TEAM_RULES);
  });

  it('refuses fewer than 100 high-rep reps with a field error, and saves nothing', async () => {
    const current = (await head.get('/api/rules')).body;
    const res = await head.put('/api/rules').send({
      ...current,
      rules: {
        ...current.rules,
        repeatWindowWeeks: 9,
        tissue: { ...current.rules.tissue, highRepMinReps: 60, sessionsPerWeek: 8 },
      },
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields['rules.tissue.highRepMinReps']).toEqual([
      'High-rep work is 100 reps or more: use at least 100',
    ]);
    expect(res.body.error.fields['rules.tissue.sessionsPerWeek']).toEqual(['At most 7 sessions a week']);
    expect((await head.get('/api/rules')).body).toEqual(current);
  });
});

describe('PUT /api/rules', () => {
  it('saves the head coach’s change, bumps the version and records who saved', async () => {
    const current = (await head.get('/api/rules')).body;
    const res = await head
      .put('/api/rules')
      .send({ rules: edited(current.rules), equipment: ['box', ' chains ', 'box'], version: current.version });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      rules: { repeatWindowWeeks: 8, jointBudget: { elbow: 6 }, tissue: { maxConsecutiveWeeks: 2 } },
      equipment: ['box', 'chains'],
      version: current.version + 1,
      updatedBy: { id: team.headCoach.id },
    });
    expect((await coach.get('/api/rules')).body.rules.taper).toEqual([
      { weeksOut: 2, maxRisk: 1, minSpecificity: 0.75 },
    ]);
  });

  it('refuses a stale version with the current rules, and changes nothing', async () => {
    const current = (await head.get('/api/rules')).body;
    await head.put('/api/rules').send({ ...current, rules: { ...current.rules, familyWindowWeeks: 3 } });
    const stale = await head.put('/api/rules').send({ ...current, rules: { ...current.rules, familyWindowWeeks: 9 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ version: current.version + 1, rules: { familyWindowWeeks: 3 } });
    expect((await head.get('/api/rules')).body.rules.familyWindowWeeks).toBe(3);
  });

  it('answers invalid settings by field path', async () => {
    const current = (await head.get('/api/rules')).body;
    const res = await head.put('/api/rules').send({
      version: current.version,
      equipment: [''],
      rules: {
        ...current.rules,
        repeatWindowWeeks: 0,
        jointBudget: { elbow: -1 },
        taper: [{ weeksOut: 2, maxRisk: 5 }],
        slots: [
          { id: 'lower', label: 'A', lifts: ['squat'] },
          { id: 'lower', label: 'B', lifts: [] },
        ],
        tissue: { ...current.rules.tissue, sorenessThreshold: 11 },
      },
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining([
        'equipment.0',
        'rules.repeatWindowWeeks',
        'rules.jointBudget.elbow',
        'rules.taper.0.maxRisk',
        'rules.slots.1.lifts',
        'rules.tissue.sorenessThreshold',
      ]),
    );
  });

  it('is the head coach’s alone', async () => {
    const current = (await coach.get('/api/rules')).body;
    expect((await coach.put('/api/rules').send(current)).status).toBe(403);
  });

  it('creates the rules of a team that never had any, from version 0', async () => {
    const db = t.ctx.database.db;
    const [row] = await db.insert(teams).values({ name: 'Rule-less team' }).$returningId();
    const user = await createUser(db, row!.id, 'head_coach');
    const agent = await t.signIn(user.email);
    const blank = (await agent.get('/api/rules')).body;
    expect(blank).toMatchObject({ rules: DEFAULT_TEAM_RULES, equipment: [], version: 0, updatedAt: null });
    const res = await agent.put('/api/rules').send({ rules: blank.rules, equipment: ['box'], version: 0 });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(1);
    expect((await agent.put('/api/rules').send({ rules: blank.rules, equipment: [], version: 0 })).status).toBe(409);
  });

  it('keeps teams apart: one team’s save leaves the other’s rules alone', async () => {
    const db = t.ctx.database.db;
    const other = await createTeam(db);
    const otherHead = await t.signIn(other.headCoach.email);
    const before = (await head.get('/api/rules')).body;
    const theirs = (await otherHead.get('/api/rules')).body;
    await otherHead.put('/api/rules').send({ ...theirs, equipment: ['only theirs'] });
    expect((await head.get('/api/rules')).body).toEqual(before);
  });
});

describe('back-off sets and accessory rotation windows in the rules', () => {
  it('a team saved before they existed reads the defaults (two back-off sets 10 % lighter, 3-week blocks, 6-week window)', async () => {
    const db = t.ctx.database.db;
    const older = await createTeam(db);
    const { backOff: _b, accessoryRotation: _a, ...old } = DEFAULT_TEAM_RULES;
    await db.update(teamRules).set({ rules: old }).where(eq(teamRules.teamId, older.teamId));
    const res = await (await t.signIn(older.coach.email)).get('/api/rules');
    expect(res.body.rules.backOff).toEqual({ sets: 2, dropPct: 10 });
    expect(res.body.rules.accessoryRotation).toEqual({ blockWeeks: 3, repeatWindowWeeks: 6 });
  });

  it('the head coach saves them, 0 back-off sets included', async () => {
    const current = (await head.get('/api/rules')).body;
    const rules = {
      ...current.rules,
      backOff: { sets: 0, dropPct: 15 },
      accessoryRotation: { blockWeeks: 4, repeatWindowWeeks: 8 },
    };
    const res = await head.put('/api/rules').send({ ...current, rules });
    expect(res.status).toBe(200);
    expect(res.body.rules).toMatchObject({
      backOff: { sets: 0, dropPct: 15 },
      accessoryRotation: { blockWeeks: 4, repeatWindowWeeks: 8 },
    });
    expect((await coach.get('/api/rules')).body.rules.accessoryRotation).toEqual({
      blockWeeks: 4,
      repeatWindowWeeks: 8,
    });
  });

  it('refuses bad values on their fields and saves nothing', async () => {
    const current = (await head.get('/api/rules')).body;
    const send = (backOff: unknown, accessoryRotation: unknown = current.rules.accessoryRotation) =>
      head.put('/api/rules').send({ ...current, rules: { ...current.rules, backOff, accessoryRotation } });
    const bad = await send({ sets: 6, dropPct: 30 }, { blockWeeks: 4, repeatWindowWeeks: 3 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.code).toBe('validation_failed');
    expect(bad.body.error.fields).toMatchObject({
      'rules.backOff.sets': ['At most 5 back-off sets'],
      'rules.backOff.dropPct': ['Use 5 to 25 %'],
      'rules.accessoryRotation.repeatWindowWeeks': [expect.stringMatching(/^At least one block \(4 weeks\)/)],
    });
    const fractions = await send({ sets: 1.5, dropPct: 2 }, { blockWeeks: 0, repeatWindowWeeks: 27 });
    expect(fractions.body.error.fields).toMatchObject({
      'rules.backOff.sets': ['Use whole sets'],
      'rules.backOff.dropPct': ['Use 5 to 25 %'],
      'rules.accessoryRotation.blockWeeks': ['At least 1 week'],
      'rules.accessoryRotation.repeatWindowWeeks': ['At most 26 weeks'],
    });
    const negative = await send({ sets: -1, dropPct: 'ten' });
    expect(negative.body.error.fields).toMatchObject({
      'rules.backOff.sets': ['Use 0 for no back-off sets'],
      'rules.backOff.dropPct': ['Enter a percentage from 5 to 25'],
    });
    const extra = await send({ sets: 2, dropPct: 10, reps: 3 });
    expect(extra.status).toBe(422);
    expect((await head.get('/api/rules')).body).toEqual(current);
  });
});
