// Fee plans (create, edit, archive, delete, versions) and the head coach's table of athletes' fees.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { eq } from 'drizzle-orm';
import { teams } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createAthlete, createFeePlan, createTeam, setAthleteBilling, type TestTeam } from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
let team: TestTeam;
let other: TestTeam;
let head: request.Agent;
let coach: request.Agent;
let athlete: request.Agent;
let otherHead: request.Agent;

beforeAll(async () => {
  team = await createTeam(db());
  other = await createTeam(db());
  head = await t.signIn(team.headCoach.email);
  coach = await t.signIn(team.coach.email);
  athlete = await t.signIn(team.athleteUser.email);
  otherHead = await t.signIn(other.headCoach.email);
});

const create = (body: object, agent = head) => agent.post('/api/fees/plans').send(body);

describe('POST /api/fees/plans', () => {
  it('creates a plan with the price in minor units of the team currency', async () => {
    const res = await create({ name: 'Online coaching', price: '89.90', description: 'Weekly check-in and plan' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: 'Online coaching',
      priceMinor: 8990,
      currency: 'EUR',
      description: 'Weekly check-in and plan',
      archived: false,
      inUse: false,
      subscribers: 0,
      version: 1,
    });
  });

  it('takes a comma as the decimal mark and whole amounts; an empty description is stored as none', async () => {
    const comma = await create({ name: `Comma ${Date.now()}`, price: '45,5', description: '' });
    expect(comma.status).toBe(201);
    expect(comma.body).toMatchObject({ priceMinor: 4550, description: null });
    const whole = await create({ name: `Whole ${Date.now()}`, price: '60' });
    expect(whole.body.priceMinor).toBe(6000);
  });

  it('reports each wrong field', async () => {
    const res = await create({ name: '  ', price: 'twelve', description: 'x'.repeat(1001) });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['description', 'name', 'price']);
    for (const price of ['0', '0.00', '12.345', '-5', '1234567']) {
      const r = await create({ name: 'Odd price', price });
      expect(r.status, price).toBe(422);
      expect(Object.keys(r.body.error.fields), price).toEqual(['price']);
    }
  });

  it('refuses a second active plan with the same name', async () => {
    const name = `Twin ${Date.now()}`;
    expect((await create({ name, price: '10' })).status).toBe(201);
    const res = await create({ name, price: '12' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.name).toEqual(['Another plan already has this name']);
  });

  it('follows the currency: a currency without decimals takes whole amounts only', async () => {
    const yen = await createTeam(db());
    await db().update(teams).set({ currency: 'JPY' }).where(eq(teams.id, yen.teamId));
    const agent = await t.signIn(yen.headCoach.email);
    const bad = await create({ name: 'Monthly', price: '5000.5' }, agent);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.price[0]).toMatch(/no decimals/);
    const ok = await create({ name: 'Monthly', price: '5000' }, agent);
    expect(ok.body).toMatchObject({ priceMinor: 5000, currency: 'JPY' });
  });

  it('is for head coaches only', async () => {
    expect((await create({ name: 'Nope', price: '10' }, coach)).status).toBe(403);
    expect((await create({ name: 'Nope', price: '10' }, athlete)).status).toBe(403);
  });
});

describe('GET /api/fees/plans', () => {
  let teamOf: TestTeam;
  let agent: request.Agent;
  beforeAll(async () => {
    teamOf = await createTeam(db());
    agent = await t.signIn(teamOf.headCoach.email);
    await createFeePlan(db(), teamOf.teamId, { name: 'Basic', priceMinor: 3000 });
    await createFeePlan(db(), teamOf.teamId, { name: 'Competition', priceMinor: 9000 });
    await createFeePlan(db(), teamOf.teamId, { name: 'Old', priceMinor: 2000, archivedAt: new Date() });
  });

  it('lists the offered plans by price, with total, and sorts and pages', async () => {
    const res = await agent.get('/api/fees/plans');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    // New plans are priced in the team's currency, so the list names it even when empty.
    expect(res.body.currency).toBe('EUR');
    expect(res.body.items.map((p: { name: string }) => p.name)).toEqual(['Basic', 'Competition']);
    const down = await agent.get('/api/fees/plans?sort=-price&limit=1&offset=0');
    expect(down.body).toMatchObject({ total: 2, items: [{ name: 'Competition' }] });
    const all = await agent.get('/api/fees/plans?status=all&sort=name');
    expect(all.body.items.map((p: { name: string }) => p.name)).toEqual(['Basic', 'Competition', 'Old']);
    const archived = await agent.get('/api/fees/plans?status=archived');
    expect(archived.body.items.map((p: { archived: boolean }) => p.archived)).toEqual([true]);
  });

  it('shows athletes only the plans on offer, and never another team’s', async () => {
    const own = await t.signIn(teamOf.athleteUser.email);
    const res = await own.get('/api/fees/plans?status=all');
    expect(res.body.items.map((p: { name: string }) => p.name)).toEqual(['Basic', 'Competition']);
    const theirs = await otherHead.get('/api/fees/plans?status=all');
    expect(theirs.body.items.map((p: { name: string }) => p.name)).not.toContain('Competition');
  });

  it('rejects an unknown sort or status with field errors', async () => {
    const res = await agent.get('/api/fees/plans?sort=colour&status=maybe&limit=0');
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['query.limit', 'query.sort', 'query.status']);
  });
});

describe('PATCH /api/fees/plans/:id', () => {
  it('saves with the version read and bumps it; a new price drops the provider price', async () => {
    const id = await createFeePlan(db(), team.teamId, {
      name: `Edit ${Date.now()}`,
      providerProductId: 'prod_x',
      providerPriceId: 'price_x',
    });
    const res = await head.patch(`/api/fees/plans/${id}`).send({ name: 'Edited', price: '50', version: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'Edited', priceMinor: 5000, version: 2, description: null });
    // The provider price belonged to the old amount; the next checkout creates a new one.
    const again = await head.get('/api/fees/plans?status=all&limit=500');
    expect(again.body.items.find((p: { id: number }) => p.id === id).inUse).toBe(false);
  });

  it('answers a stale version with 409 and the plan as it is now', async () => {
    const id = await createFeePlan(db(), team.teamId, { name: `Race ${Date.now()}` });
    expect((await head.patch(`/api/fees/plans/${id}`).send({ name: 'First', price: '40', version: 1 })).status).toBe(
      200,
    );
    const late = await head.patch(`/api/fees/plans/${id}`).send({ name: 'Second', price: '41', version: 1 });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('version_conflict');
    expect(late.body.error.current).toMatchObject({ id, name: 'First', version: 2 });
  });

  it('answers 404 for another team’s plan and 422 with fields for a bad body', async () => {
    const theirs = await createFeePlan(db(), other.teamId);
    const res = await head.patch(`/api/fees/plans/${theirs}`).send({ name: 'Mine now', price: '1', version: 1 });
    expect(res.status).toBe(404);
    const bad = await head.patch('/api/fees/plans/abc').send({ price: '', version: 0 });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['name', 'params.id', 'price', 'version']);
  });
});

describe('archive, restore and delete', () => {
  it('archives and restores with versions', async () => {
    const id = await createFeePlan(db(), team.teamId, { name: `Season ${Date.now()}` });
    const archived = await head.post(`/api/fees/plans/${id}/archive`).send({ version: 1 });
    expect(archived.body).toMatchObject({ archived: true, version: 2 });
    expect((await head.post(`/api/fees/plans/${id}/restore`).send({ version: 1 })).status).toBe(409);
    const restored = await head.post(`/api/fees/plans/${id}/restore`).send({ version: 2 });
    expect(restored.body).toMatchObject({ archived: false, version: 3 });
  });

  it('deletes an unused plan, but a used one must be archived', async () => {
    const unused = await createFeePlan(db(), team.teamId);
    expect((await head.delete(`/api/fees/plans/${unused}?version=1`)).status).toBe(204);
    expect((await head.delete(`/api/fees/plans/${unused}?version=1`)).status).toBe(404);

    const used = await createFeePlan(db(), team.teamId);
    const athleteId = await createAthlete(db(), team.teamId);
    await setAthleteBilling(db(), team.teamId, athleteId, { feePlanId: used, status: 'cancelled' });
    const refused = await head.delete(`/api/fees/plans/${used}?version=1`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'plan_in_use', current: { id: used, inUse: true } });

    const checkedOut = await createFeePlan(db(), team.teamId, {
      providerProductId: 'prod_y',
      providerPriceId: 'price_y',
    });
    expect((await head.delete(`/api/fees/plans/${checkedOut}?version=1`)).status).toBe(409);
  });

  it('checks the version on delete, and 404s another team’s plan', async () => {
    const id = await createFeePlan(db(), team.teamId);
    const stale = await head.delete(`/api/fees/plans/${id}?version=7`);
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ id, version: 1 });
    expect((await head.delete(`/api/fees/plans/${id}`)).body.error.fields).toHaveProperty('query.version');
    const theirs = await createFeePlan(db(), other.teamId);
    expect((await head.delete(`/api/fees/plans/${theirs}?version=1`)).status).toBe(404);
    expect((await head.post(`/api/fees/plans/${theirs}/archive`).send({ version: 1 })).status).toBe(404);
  });
});

describe('GET /api/fees/athletes', () => {
  let fees: TestTeam;
  let agent: request.Agent;
  const ids: Record<string, number> = {};
  beforeAll(async () => {
    fees = await createTeam(db());
    agent = await t.signIn(fees.headCoach.email);
    const plan = await createFeePlan(db(), fees.teamId, { name: 'Club', priceMinor: 5500 });
    for (const name of ['Ada', 'Bo', 'Cy', 'Di']) ids[name] = await createAthlete(db(), fees.teamId, { name });
    await createAthlete(db(), fees.teamId, { name: 'Gone', archivedAt: new Date() });
    const day = (n: number) => new Date(Date.UTC(2030, 0, n));
    await setAthleteBilling(db(), fees.teamId, ids.Ada!, {
      feePlanId: plan,
      status: 'active',
      currentPeriodEnd: day(20),
      lastPaymentAt: day(1),
    });
    await setAthleteBilling(db(), fees.teamId, ids.Bo!, {
      feePlanId: plan,
      status: 'past_due',
      currentPeriodEnd: day(5),
    });
    await setAthleteBilling(db(), fees.teamId, ids.Cy!, { feePlanId: plan, status: 'cancelled' });
  });

  it('lists every current athlete with status, plan, next renewal and last payment', async () => {
    const res = await agent.get('/api/fees/athletes');
    expect(res.status).toBe(200);
    // The linked athlete from the factory counts too; archived athletes do not.
    expect(res.body.total).toBe(5);
    const ada = res.body.items.find((a: { name: string }) => a.name === 'Ada');
    expect(ada).toEqual({
      athleteId: ids.Ada,
      name: 'Ada',
      status: 'active',
      plan: { id: expect.any(Number), name: 'Club', priceMinor: 5500, currency: 'EUR', archived: false },
      currentPeriodEnd: '2030-01-20T00:00:00.000Z',
      lastPaymentAt: '2030-01-01T00:00:00.000Z',
    });
    const di = res.body.items.find((a: { name: string }) => a.name === 'Di');
    expect(di).toMatchObject({ status: 'none', plan: null, currentPeriodEnd: null, lastPaymentAt: null });
  });

  it('filters to past due, and sorts by urgency or renewal with empty dates last', async () => {
    const due = await agent.get('/api/fees/athletes?status=past_due');
    expect(due.body).toMatchObject({ total: 1, items: [{ name: 'Bo', status: 'past_due' }] });
    const byStatus = await agent.get('/api/fees/athletes?sort=status');
    expect(byStatus.body.items.map((a: { status: string }) => a.status)).toEqual([
      'past_due',
      'active',
      'cancelled',
      'none',
      'none',
    ]);
    const byRenewal = await agent.get('/api/fees/athletes?sort=-renewal');
    expect(byRenewal.body.items.slice(0, 2).map((a: { name: string }) => a.name)).toEqual(['Ada', 'Bo']);
    const paged = await agent.get('/api/fees/athletes?sort=name&limit=2&offset=2');
    expect(paged.body.items.map((a: { name: string }) => a.name)).toEqual(['Cy', 'Di']);
  });

  it('never shows another team’s athletes, refuses coaches and athletes, and validates filters', async () => {
    const theirs = await otherHead.get('/api/fees/athletes?limit=500');
    expect(theirs.body.items.map((a: { athleteId: number }) => a.athleteId)).not.toContain(ids.Ada);
    expect((await coach.get('/api/fees/athletes')).status).toBe(403);
    expect((await athlete.get('/api/fees/athletes')).status).toBe(403);
    const bad = await agent.get('/api/fees/athletes?status=late&sort=age');
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['query.sort', 'query.status']);
  });
});
