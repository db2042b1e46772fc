// The roster API: athletes with equipment, a linked account and rule overrides, archiving, restrictions
// with versions, and the read-only history of picks, top sets and bodyweights.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createBodyweight,
  createMeet,
  createMeetEntry,
  createPlanEntry,
  createRestriction,
  createTeam,
  createTopSet,
  createUser,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let coach: request.Agent;
let head: request.Agent;
let otherCoach: request.Agent;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  coach = await t.signIn(team.coach.email);
  head = await t.signIn(team.headCoach.email);
  otherCoach = await t.signIn(other.headCoach.email);
});

const newAthlete = (over: Record<string, unknown> = {}) => ({
  name: 'Ilse Marrow',
  sex: 'F',
  birthYear: 1996,
  division: 'open',
  level: 'advanced',
  ...over,
});

describe('POST /api/athletes', () => {
  it('creates an athlete with the gym’s equipment when none is given', async () => {
    const res = await coach.post('/api/athletes').send(newAthlete());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: 'Ilse Marrow',
      equipment: ['box', 'bands', 'rack pins', 'boards'],
      ruleOverrides: {},
      account: null,
      restrictions: [],
      meets: [],
      archived: false,
      version: 1,
    });
  });

  it('keeps the equipment and rule overrides given', async () => {
    const res = await coach.post('/api/athletes').send(
      newAthlete({
        name: 'Bram Oyelaran',
        sex: 'M',
        equipment: ['box', 'box', ' chains '],
        ruleOverrides: { repeatWindowWeeks: 8, jointBudget: { elbow: 4 } },
      }),
    );
    expect(res.status).toBe(201);
    expect(res.body.equipment).toEqual(['box', 'chains']);
    expect(res.body.ruleOverrides).toEqual({ repeatWindowWeeks: 8, jointBudget: { elbow: 4 } });
  });

  it('answers invalid fields by name', async () => {
    const res = await coach.post('/api/athletes').send({
      name: '',
      sex: 'X',
      birthYear: 1800,
      division: 'masters',
      maxRisk: 7,
      ruleOverrides: { repeatWindowWeeks: 0, taper: [] },
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining(['name', 'sex', 'birthYear', 'division', 'maxRisk', 'ruleOverrides.repeatWindowWeeks']),
    );
    expect(Object.keys(res.body.error.fields).some((k) => k.startsWith('ruleOverrides'))).toBe(true);
  });

  it('links an athlete account of the team, and refuses other accounts', async () => {
    const db = t.ctx.database.db;
    const account = await createUser(db, team.teamId, 'athlete', 'Unlinked Person');
    const ok = await coach.post('/api/athletes').send(newAthlete({ name: 'Unlinked Person', userId: account.id }));
    expect(ok.status).toBe(201);
    expect(ok.body.account).toEqual({ id: account.id, name: 'Unlinked Person', email: account.email });

    const twice = await coach.post('/api/athletes').send(newAthlete({ name: 'Copy', userId: account.id }));
    expect(twice.status).toBe(422);
    expect(twice.body.error.fields.userId[0]).toMatch(/already linked to Unlinked Person/);

    const coachAccount = await coach.post('/api/athletes').send(newAthlete({ userId: team.coach.id }));
    expect(coachAccount.status).toBe(422);
    const foreign = await coach.post('/api/athletes').send(newAthlete({ userId: other.athleteUser.id }));
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.fields).toHaveProperty('userId');
  });
});

describe('GET /api/athletes and /api/athletes/accounts', () => {
  it('lists the team’s athletes with restrictions, meets and latest bodyweight', async () => {
    const db = t.ctx.database.db;
    const id = await createAthlete(db, team.teamId, { name: 'Aaron Listed', maxRisk: 2 });
    await createRestriction(db, team.teamId, id, { joint: 'knee', maxStress: 2, fromDate: '2020-01-06' });
    await createRestriction(db, team.teamId, id, { joint: 'hip', fromDate: '2020-01-06', toDate: '2020-02-01' });
    const meet = await createMeet(db, team.teamId, { name: 'Spring Open', date: '2031-04-05' });
    await createMeetEntry(db, team.teamId, meet, id, { weightClass: '63' });
    await createBodyweight(db, team.teamId, id, '2026-01-01', 61.2);
    await createBodyweight(db, team.teamId, id, '2026-02-01', 62.4);

    const res = await coach.get('/api/athletes?sort=name');
    expect(res.status).toBe(200);
    expect(res.body.total).toBeGreaterThanOrEqual(4);
    const row = res.body.items.find((a: { id: number }) => a.id === id);
    expect(row.restrictions.map((r: { joint: string; active: boolean }) => [r.joint, r.active])).toEqual(
      expect.arrayContaining([
        ['knee', true],
        ['hip', false],
      ]),
    );
    expect(row.meets).toEqual([
      { meetId: meet, entryId: expect.any(Number), name: 'Spring Open', date: '2031-04-05', weightClass: '63' },
    ]);
    expect(row.latestBodyweight).toEqual({ weightKg: 62.4, measuredOn: '2026-02-01' });
    expect(res.body.items.map((a: { name: string }) => a.name)).not.toContain(other.name);
  });

  it('filters by name, sorts by the heaviest risk allowed, and pages', async () => {
    const byName = await coach.get('/api/athletes?q=aaron');
    expect(byName.body.items.map((a: { name: string; maxRisk: number | null }) => [a.name, a.maxRisk])).toEqual([
      ['Aaron Listed', 2],
    ]);
    // Strictest ceiling first; athletes with no ceiling come last.
    const byRisk = await coach.get('/api/athletes?sort=maxRisk');
    const ceilings = byRisk.body.items.map((a: { maxRisk: number | null }) => a.maxRisk ?? 4);
    expect(ceilings).toEqual([...ceilings].sort((a, b) => a - b));
    expect(ceilings[0]).toBe(2);
    const desc = await coach.get('/api/athletes?sort=-name&limit=1');
    expect(desc.body.items).toHaveLength(1);
    expect(desc.body.total).toBeGreaterThan(1);
    const bad = await coach.get('/api/athletes?sort=level');
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['query.sort']);
  });

  it('lists the athlete accounts a roster entry can be linked to', async () => {
    const res = await coach.get('/api/athletes/accounts');
    expect(res.status).toBe(200);
    expect(res.body.items).toContainEqual({
      id: team.athleteUser.id,
      name: expect.any(String),
      email: team.athleteUser.email,
      athleteId: team.athleteId,
    });
    expect(res.body.items.map((a: { id: number }) => a.id)).not.toContain(team.coach.id);
  });
});

describe('GET/PATCH/DELETE /api/athletes/:id', () => {
  it('answers 404 for another team’s athlete', async () => {
    expect((await otherCoach.get(`/api/athletes/${team.athleteId}`)).status).toBe(404);
    expect((await otherCoach.patch(`/api/athletes/${team.athleteId}`).send({ notes: 'x', version: 1 })).status).toBe(
      404,
    );
    expect((await otherCoach.delete(`/api/athletes/${team.athleteId}`)).status).toBe(404);
    expect((await otherCoach.get(`/api/athletes/${team.athleteId}/history`)).status).toBe(404);
  });

  it('edits equipment, overrides and the link with the version read; a stale version gets 409', async () => {
    const created = (await coach.post('/api/athletes').send(newAthlete({ name: 'Versioned One' }))).body;
    const edit = await coach.patch(`/api/athletes/${created.id}`).send({
      equipment: ['box'],
      ruleOverrides: { familyWindowWeeks: 3 },
      version: created.version,
    });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ equipment: ['box'], ruleOverrides: { familyWindowWeeks: 3 }, version: 2 });

    const stale = await head.patch(`/api/athletes/${created.id}`).send({ equipment: [], version: created.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ id: created.id, equipment: ['box'], version: 2 });
  });

  it('unlinks an account with userId null', async () => {
    const db = t.ctx.database.db;
    const account = await createUser(db, team.teamId, 'athlete');
    const created = (
      await coach.post('/api/athletes').send(newAthlete({ name: 'Linked Then Not', userId: account.id }))
    ).body;
    const res = await coach.patch(`/api/athletes/${created.id}`).send({ userId: null, version: created.version });
    expect(res.status).toBe(200);
    expect(res.body.account).toBeNull();
  });

  it('archives with DELETE (the history stays), hides from the list, restores with PATCH', async () => {
    const created = (await coach.post('/api/athletes').send(newAthlete({ name: 'Archived Person' }))).body;
    const archived = await coach.delete(`/api/athletes/${created.id}`);
    expect(archived.status).toBe(200);
    expect(archived.body.archived).toBe(true);
    const list = await coach.get('/api/athletes?limit=500');
    expect(list.body.items.map((a: { id: number }) => a.id)).not.toContain(created.id);
    const all = await coach.get('/api/athletes?includeArchived=true&limit=500');
    expect(all.body.items.map((a: { id: number }) => a.id)).toContain(created.id);
    const back = await coach
      .patch(`/api/athletes/${created.id}`)
      .send({ archived: false, version: archived.body.version });
    expect(back.body.archived).toBe(false);
  });
});

describe('restrictions', () => {
  it('adds, edits and removes a restriction', async () => {
    const created = (await coach.post('/api/athletes').send(newAthlete({ name: 'Sore Elbow' }))).body;
    const add = await coach
      .post(`/api/athletes/${created.id}/restrictions`)
      .send({ joint: 'elbow', maxStress: 1, fromDate: '2026-01-05', note: ' Irritated after benching ' });
    expect(add.status).toBe(201);
    expect(add.body).toMatchObject({
      joint: 'elbow',
      maxStress: 1,
      toDate: null,
      note: 'Irritated after benching',
      version: 1,
    });

    const edit = await coach
      .patch(`/api/athletes/${created.id}/restrictions/${add.body.id}`)
      .send({ toDate: '2026-02-01', version: 1 });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ toDate: '2026-02-01', version: 2, active: false });

    const stale = await coach
      .patch(`/api/athletes/${created.id}/restrictions/${add.body.id}`)
      .send({ maxStress: 0, version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ maxStress: 1, version: 2 });

    const athlete = await coach.get(`/api/athletes/${created.id}`);
    expect(athlete.body.restrictions).toHaveLength(1);
    const del = await coach.delete(`/api/athletes/${created.id}/restrictions/${add.body.id}`);
    expect(del.status).toBe(204);
    expect((await coach.get(`/api/athletes/${created.id}`)).body.restrictions).toEqual([]);
    expect((await coach.delete(`/api/athletes/${created.id}/restrictions/${add.body.id}`)).status).toBe(404);
  });

  it('answers invalid restrictions by field, including an end before the start', async () => {
    const res = await coach
      .post(`/api/athletes/${team.athleteId}/restrictions`)
      .send({ joint: 'neck', maxStress: 4, fromDate: '5 January' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['joint', 'maxStress', 'fromDate']));
    const order = await coach
      .post(`/api/athletes/${team.athleteId}/restrictions`)
      .send({ joint: 'knee', maxStress: 1, fromDate: '2026-03-01', toDate: '2026-02-01' });
    expect(order.status).toBe(422);
    expect(order.body.error.fields.toDate).toEqual(['The end cannot be before the start']);
  });

  it('checks the dates against the stored ones when only one is edited', async () => {
    const db = t.ctx.database.db;
    const id = await createRestriction(db, team.teamId, team.athleteId, { fromDate: '2026-03-01' });
    const res = await coach
      .patch(`/api/athletes/${team.athleteId}/restrictions/${id}`)
      .send({ toDate: '2026-02-01', version: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty('toDate');
  });

  it('answers 404 for another team’s athlete or restriction, and for a restriction of another athlete', async () => {
    const db = t.ctx.database.db;
    const id = await createRestriction(db, team.teamId, team.athleteId);
    const body = { joint: 'knee', maxStress: 1, fromDate: '2026-01-05' };
    expect((await otherCoach.post(`/api/athletes/${team.athleteId}/restrictions`).send(body)).status).toBe(404);
    expect(
      (await otherCoach.patch(`/api/athletes/${team.athleteId}/restrictions/${id}`).send({ note: 'x', version: 1 }))
        .status,
    ).toBe(404);
    expect((await otherCoach.delete(`/api/athletes/${team.athleteId}/restrictions/${id}`)).status).toBe(404);
    const someoneElse = await createAthlete(db, team.teamId);
    expect((await coach.delete(`/api/athletes/${someoneElse}/restrictions/${id}`)).status).toBe(404);
  });
});

describe('GET /api/athletes/:id/history', () => {
  it('returns picks with variant names, top sets with e1RM, and bodyweights, within a week range', async () => {
    const db = t.ctx.database.db;
    const id = await createAthlete(db, team.teamId, { name: 'History Person' });
    const v = await createVariant(db, team.teamId, { name: 'Safety bar box squat', lift: 'squat' });
    const entry = await createPlanEntry(db, team.teamId, id, v, {
      week: '2026-W10',
      source: 'coach',
      pinned: true,
      reason: 'Meet prep',
    });
    await createPlanEntry(db, team.teamId, id, v, { week: '2026-W02' });
    await createTopSet(db, team.teamId, id, v, {
      planEntryId: entry,
      week: '2026-W10',
      performedOn: '2026-03-04',
      weightKg: 150,
      reps: 3,
      rpe: 8.5,
    });
    await createBodyweight(db, team.teamId, id, '2026-03-05', 80.4);
    await createBodyweight(db, team.teamId, id, '2026-01-06', 79.1);

    const res = await coach.get(`/api/athletes/${id}/history`);
    expect(res.status).toBe(200);
    expect(res.body.picks.map((p: { week: string }) => p.week)).toEqual(['2026-W10', '2026-W02']);
    expect(res.body.picks[0]).toMatchObject({
      variantName: 'Safety bar box squat',
      lift: 'squat',
      source: 'coach',
      pinned: true,
      reason: 'Meet prep',
      variantArchived: false,
    });
    // Epley: 150 × (1 + 3/30) = 165 (the factory stores it; the history passes it through unchanged).
    expect(res.body.topSets).toEqual([
      expect.objectContaining({ variantName: 'Safety bar box squat', weightKg: 150, reps: 3, rpe: 8.5, e1rmKg: 165 }),
    ]);
    expect(res.body.bodyweights).toEqual([
      { measuredOn: '2026-01-06', weightKg: 79.1 },
      { measuredOn: '2026-03-05', weightKg: 80.4 },
    ]);

    const range = await coach.get(`/api/athletes/${id}/history?from=2026-W09&to=2026-W10`);
    expect(range.body.picks).toHaveLength(1);
    // 2026-W10 runs Monday 2 March to Sunday 8 March.
    expect(range.body.bodyweights).toEqual([{ measuredOn: '2026-03-05', weightKg: 80.4 }]);
    const bad = await coach.get(`/api/athletes/${id}/history?from=March`);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty('query.from');
  });
});
