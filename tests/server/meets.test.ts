// The meets API: meets with versions, athletes entered with a weight class checked against the
// federation's categories, attempt plans, and the bodyweight and current max shown beside each entry.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { addWeeks, mondayOf, weekOfDate } from '../../shared/engine/weeks';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createBodyweight,
  createMeet,
  createTeam,
  createTopSet,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let coach: request.Agent;
let otherCoach: request.Agent;

const lastWeek = addWeeks(weekOfDate(new Date()), -1);
const lastMonday = mondayOf(lastWeek).toISOString().slice(0, 10);

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  coach = await t.signIn(team.coach.email);
  otherCoach = await t.signIn(other.headCoach.email);
});

describe('meets', () => {
  it('creates, lists (upcoming or past, by date) and edits a meet with its version', async () => {
    const made = await coach
      .post('/api/meets')
      .send({ name: ' Harvest Cup ', date: '2031-09-13', location: 'Hall 2', federation: '' });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ name: 'Harvest Cup', federation: null, entries: [], version: 1 });
    await createMeet(t.ctx.database.db, team.teamId, { name: 'Old Open', date: '2020-05-02' });

    const upcoming = await coach.get('/api/meets?when=upcoming');
    expect(upcoming.body.items.map((m: { name: string }) => m.name)).toEqual(['Harvest Cup']);
    const past = await coach.get('/api/meets?when=past');
    expect(past.body.items.map((m: { name: string }) => m.name)).toEqual(['Old Open']);
    const all = await coach.get('/api/meets?sort=-date');
    expect(all.body).toMatchObject({ total: 2 });
    expect(all.body.items[0].name).toBe('Harvest Cup');

    const edit = await coach.patch(`/api/meets/${made.body.id}`).send({ date: '2031-09-20', version: 1 });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ date: '2031-09-20', version: 2 });
    const stale = await coach.patch(`/api/meets/${made.body.id}`).send({ name: 'Renamed', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ name: 'Harvest Cup', version: 2 });
  });

  it('answers invalid fields by name', async () => {
    const res = await coach.post('/api/meets').send({ name: '', date: '13/09/2031' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['name', 'date']));
    const q = await coach.get('/api/meets?when=soon');
    expect(q.status).toBe(422);
    expect(q.body.error.fields).toHaveProperty('query.when');
  });

  it('answers 404 for another team’s meet on every route', async () => {
    const id = await createMeet(t.ctx.database.db, team.teamId);
    expect((await otherCoach.get(`/api/meets/${id}`)).status).toBe(404);
    expect((await otherCoach.patch(`/api/meets/${id}`).send({ name: 'x', version: 1 })).status).toBe(404);
    expect((await otherCoach.delete(`/api/meets/${id}`)).status).toBe(404);
    expect((await otherCoach.post(`/api/meets/${id}/entries`).send({ athleteId: other.athleteId })).status).toBe(404);
    expect((await coach.get(`/api/meets/${id}`)).status).toBe(200);
  });

  it('deletes a meet and its entries', async () => {
    const id = await createMeet(t.ctx.database.db, team.teamId, { name: 'Cancelled' });
    await coach.post(`/api/meets/${id}/entries`).send({ athleteId: team.athleteId });
    expect((await coach.delete(`/api/meets/${id}`)).status).toBe(204);
    expect((await coach.get(`/api/meets/${id}`)).status).toBe(404);
  });
});

describe('meet entries', () => {
  it('enters an athlete with the suggested class from the latest bodyweight and the current max per lift', async () => {
    const db = t.ctx.database.db;
    const athleteId = await createAthlete(db, team.teamId, { name: 'Mira Sollen', sex: 'F', division: 'junior' });
    await createBodyweight(db, team.teamId, athleteId, '2026-01-01', 70.0);
    await createBodyweight(db, team.teamId, athleteId, lastMonday, 62.8);
    const comp = await createVariant(db, team.teamId, { name: 'Competition squat', lift: 'squat', specificity: 1 });
    const box = await createVariant(db, team.teamId, { name: 'Box squat', lift: 'squat', specificity: 0.5 });
    await createTopSet(db, team.teamId, athleteId, comp, {
      week: lastWeek,
      performedOn: lastMonday,
      weightKg: 130,
      reps: 1,
    });
    // Heavier, but on a variant far from the competition squat: not counted.
    await createTopSet(db, team.teamId, athleteId, box, {
      week: lastWeek,
      performedOn: lastMonday,
      weightKg: 150,
      reps: 1,
    });
    // Counted by specificity, but older than the look-back window.
    await createTopSet(db, team.teamId, athleteId, comp, {
      week: '2020-W10',
      performedOn: '2020-03-04',
      weightKg: 160,
      reps: 1,
    });

    const meet = await createMeet(db, team.teamId, { name: 'Entry Open' });
    const res = await coach.post(`/api/meets/${meet}/entries`).send({ athleteId });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      athlete: { id: athleteId, name: 'Mira Sollen', sex: 'F', division: 'junior' },
      division: 'junior',
      weightClass: null,
      attempts: {},
      latestBodyweight: { weightKg: 62.8, measuredOn: lastMonday },
      // Federation women's categories: 57 < 62.8 ≤ 63.
      suggestedClass: '63',
      currentMax: {
        squat: { e1rmKg: 130, variantName: 'Competition squat', performedOn: lastMonday },
        bench: null,
        deadlift: null,
      },
      version: 1,
    });
    const again = await coach.post(`/api/meets/${meet}/entries`).send({ athleteId });
    expect(again.status).toBe(422);
    expect(again.body.error.fields.athleteId[0]).toMatch(/already entered/);
  });

  it('stores weight class, division and attempts; a stale version gets 409', async () => {
    const db = t.ctx.database.db;
    const athleteId = await createAthlete(db, team.teamId, { sex: 'M' });
    const meet = await createMeet(db, team.teamId);
    const entry = (await coach.post(`/api/meets/${meet}/entries`).send({ athleteId, weightClass: '93' })).body;
    expect(entry.weightClass).toBe('93');
    const attempts = { squat: [200, 210, 217.5], bench: [130, 137.5, 142.5], deadlift: [230] };
    const edit = await coach
      .patch(`/api/meets/${meet}/entries/${entry.id}`)
      .send({ attempts, weightClass: '105', version: 1 });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ attempts, weightClass: '105', version: 2 });
    const stale = await coach.patch(`/api/meets/${meet}/entries/${entry.id}`).send({ weightClass: '83', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ weightClass: '105', version: 2 });
    expect((await coach.get(`/api/meets/${meet}`)).body.entries[0].attempts).toEqual(attempts);
  });

  it('refuses a class outside the federation’s categories for the athlete, and bad attempts, by field', async () => {
    const db = t.ctx.database.db;
    const athleteId = await createAthlete(db, team.teamId, { sex: 'F', division: 'open' });
    const meet = await createMeet(db, team.teamId);
    // 93 is a men's class; 43 is for junior and sub-junior women only.
    const men = await coach.post(`/api/meets/${meet}/entries`).send({ athleteId, weightClass: '93' });
    expect(men.status).toBe(422);
    expect(men.body.error.fields.weightClass[0]).toMatch(/open women: use 47, 52, 57, 63, 69, 76, 84, 84\+/);
    expect((await coach.post(`/api/meets/${meet}/entries`).send({ athleteId, weightClass: '43' })).status).toBe(422);
    const junior = await coach
      .post(`/api/meets/${meet}/entries`)
      .send({ athleteId, weightClass: '43', division: 'junior' });
    expect(junior.status).toBe(201);

    const bad = await coach.patch(`/api/meets/${meet}/entries/${junior.body.id}`).send({
      attempts: { squat: [100, 95], bench: [50.3], snatch: [60] },
      version: 1,
    });
    expect(bad.status).toBe(422);
    const keys = Object.keys(bad.body.error.fields);
    expect(keys).toEqual(expect.arrayContaining(['attempts.squat.1', 'attempts.bench.0', 'attempts']));
    // The federation's rules (memory): after a good lift at least 2.5 kg more; 2.5 kg steps except records.
    expect(bad.body.error.fields['attempts.squat.1'][0]).toMatch(/at least 2\.5 kg heavier/);
    expect(bad.body.error.fields['attempts.bench.0'][0]).toMatch(/0\.5 kg/);
    // Changing the division back to open makes the stored 43 wrong: refused.
    const division = await coach
      .patch(`/api/meets/${meet}/entries/${junior.body.id}`)
      .send({ division: 'open', version: 1 });
    expect(division.status).toBe(422);
    expect(division.body.error.fields).toHaveProperty('weightClass');
  });

  it('refuses an athlete of another team by field, and 404s another team’s entries', async () => {
    const db = t.ctx.database.db;
    const meet = await createMeet(db, team.teamId);
    const foreign = await coach.post(`/api/meets/${meet}/entries`).send({ athleteId: other.athleteId });
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.fields).toHaveProperty('athleteId');
    const entry = (await coach.post(`/api/meets/${meet}/entries`).send({ athleteId: team.athleteId })).body;
    expect(
      (await otherCoach.patch(`/api/meets/${meet}/entries/${entry.id}`).send({ weightClass: '63', version: 1 })).status,
    ).toBe(404);
    expect((await otherCoach.delete(`/api/meets/${meet}/entries/${entry.id}`)).status).toBe(404);
    expect((await coach.delete(`/api/meets/${meet}/entries/${entry.id}`)).status).toBe(204);
    expect((await coach.get(`/api/meets/${meet}`)).body.entries).toEqual([]);
  });
});
