// Bodyweight log: one reading a day (a second write replaces it), validation, scoping, and the weight
// class and pre-meet gain caution on the week page.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { meetEntries, meets } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createTeam, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let athlete: request.Agent;

const DAY = 86_400_000;
const day = (offset: number) => new Date(Date.now() + offset * DAY).toISOString().slice(0, 10);

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
  other = await createTeam(t.ctx.database.db);
  athlete = await t.signIn(team.athleteUser.email);
});

describe('PUT /api/bodyweights/:measuredOn', () => {
  it('writes a reading, and a second one for the same day replaces it', async () => {
    const first = await athlete.put(`/api/bodyweights/${day(-3)}`).send({ unit: 'kg', weight: 61.8 });
    expect(first.status).toBe(201);
    const again = await athlete.put(`/api/bodyweights/${day(-3)}`).send({ unit: 'lb', weight: 137 });
    expect(again.status).toBe(200);
    // 137 lb × 0.45359237 kg/lb (the international pound) = 62.142 kg.
    expect(again.body).toMatchObject({ id: first.body.id, measuredOn: day(-3), weightKg: 62.14 });
    const list = await athlete.get(`/api/bodyweights?from=${day(-3)}&to=${day(-3)}`);
    expect(list.body).toMatchObject({ total: 1, items: [{ weightKg: 62.14 }] });
  });

  it('answers field errors for a bad date, unit and weight, and refuses future days', async () => {
    const bad = await athlete.put('/api/bodyweights/2026-02-30').send({ unit: 'st', weight: 'heavy' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['params.measuredOn', 'unit', 'weight']);
    const tooLight = await athlete.put(`/api/bodyweights/${day(-1)}`).send({ unit: 'kg', weight: 4 });
    expect(tooLight.body.error.fields.weight[0]).toMatch(/too light/);
    const future = await athlete.put(`/api/bodyweights/${day(5)}`).send({ unit: 'kg', weight: 60 });
    expect(future.status).toBe(422);
    expect(future.body.error.fields['params.measuredOn'][0]).toMatch(/not come/);
  });

  it("keeps coaches to their team's athletes", async () => {
    const coach = await t.signIn(team.coach.email);
    expect((await coach.get(`/api/bodyweights?athleteId=${team.athleteId}`)).body.total).toBeGreaterThan(0);
    const stranger = await t.signIn(other.coach.email);
    expect((await stranger.get(`/api/bodyweights?athleteId=${team.athleteId}`)).status).toBe(404);
  });
});

describe('bodyweight on the week page', () => {
  it('shows the weight class and, in the last week before a meet, a caution for a fast gain', async () => {
    const db = t.ctx.database.db;
    const [m] = await db
      .insert(meets)
      .values({ teamId: team.teamId, name: 'Test Open', date: day(4) })
      .$returningId();
    await db
      .insert(meetEntries)
      .values({ teamId: team.teamId, meetId: m!.id, athleteId: team.athleteId, weightClass: '63', attempts: {} });
    await athlete.put(`/api/bodyweights/${day(-6)}`).send({ unit: 'kg', weight: 61.0 });
    await athlete.put(`/api/bodyweights/${day(0)}`).send({ unit: 'kg', weight: 63.4 });
    const res = await athlete.get('/api/my-week');
    expect(res.status).toBe(200);
    const bw = res.body.bodyweight;
    // Federation (IPF) women's open classes …, 63, 69, …: 63.4 kg is over the 63 limit, so it falls in 69.
    expect(bw).toMatchObject({ weightClass: '69', enteredClass: '63', thresholdKg: 2 });
    expect(bw.change7d).toMatchObject({ gainKg: 2.4, fromDate: day(-6), toDate: day(0) });
    expect(bw.caution).toMatchObject({ gainKg: 2.4, meetName: 'Test Open', meetDate: day(4) });
    expect(res.body.meet).toMatchObject({ name: 'Test Open', daysOut: 4 });
  });
});
