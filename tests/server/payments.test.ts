// Paying a fee end to end against a local fake provider started for this file: checkout through the
// SDK, the test card page, the signed events it sends back, renewals, and cancelling.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { athleteBilling, feePlans, outbox, paymentEvents } from '../../server/db/schema';
import { startPaymentsFake } from '../../server/standins/payments';
import { DECLINED_CARD, RENEWAL_FAILING_CARD, SUCCEEDING_CARD } from '../../server/standins/payments/cards';
import { useTestApp } from '../support/app';
import { createAthlete, createFeePlan, createTeam, createUser, type TestTeam } from '../support/factories';
import { athletes } from '../../server/db/schema';

const fake = await startPaymentsFake({ port: 0, retryDelaysMs: [] });
const paymentsEnv = {
  PAYMENTS_HOST: '127.0.0.1',
  PAYMENTS_PORT: String(fake.port),
  PAYMENTS_PROTOCOL: 'http',
  PAYMENTS_SECRET_KEY: 'sk_test_rackturn_local_fake',
  PAYMENTS_WEBHOOK_SECRET: 'whsec_rackturn_local_fake',
};
const t = useTestApp(paymentsEnv);
// The same app pointed at a port where no provider answers.
const down = useTestApp({ ...paymentsEnv, PAYMENTS_PORT: '9' });
const db = () => t.ctx.database.db;
let server: Server;

beforeAll(async () => {
  server = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  fake.setWebhookUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/payments`);
});
afterAll(async () => {
  await fake.stop();
  await new Promise((r) => server.close(r));
});

/** A team with its own paying athlete (linked account) and a plan. */
async function payingAthlete(priceMinor = 4900) {
  const team = await createTeam(db());
  const planId = await createFeePlan(db(), team.teamId, { name: 'Coached online', priceMinor });
  const agent = await t.signIn(team.athleteUser.email);
  return { team, planId, agent, athleteId: team.athleteId };
}

/** Types a test card on the fake's page, as a browser form would post it. */
function pay(url: string, number: string) {
  return fetch(url, {
    method: 'POST',
    body: new URLSearchParams({ number, expiry: '11/39', cvc: '321', name: 'Test Payer' }),
    redirect: 'manual',
  });
}

async function billing(athleteId: number) {
  const [row] = await db().select().from(athleteBilling).where(eq(athleteBilling.athleteId, athleteId));
  return row;
}

async function recordedTypes(eventIds: string[]) {
  const rows = await db().select().from(paymentEvents);
  return rows.filter((r) => eventIds.includes(r.eventId)).map((r) => r.type);
}

const deliveriesSince = (n: number) => fake.store.state.deliveries.slice(n);

async function checkoutAndPay(agent: request.Agent, planId: number, card: string) {
  const start = await agent.post('/api/my-fee/checkout').send({ planId });
  expect(start.status).toBe(200);
  const before = fake.store.state.deliveries.length;
  const paid = await pay(start.body.url, card);
  return { start, paid, deliveries: deliveriesSince(before) };
}

describe('checkout → checkout.session.completed → active', () => {
  it('sends the athlete to the provider’s page and activates the fee from its events', async () => {
    const { planId, agent, athleteId, team } = await payingAthlete();
    const start = await agent.post('/api/my-fee/checkout').send({ planId });
    expect(start.status).toBe(200);
    // The card is typed on the provider's page, never on ours.
    expect(start.body.url.startsWith(`${fake.url}/test-checkout/cs_test_`)).toBe(true);
    const page = await fetch(start.body.url);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('LOCAL TEST CHECKOUT');
    expect((await agent.get('/api/my-fee')).body.status).toBe('none');

    const before = fake.store.state.deliveries.length;
    const paid = await pay(start.body.url, SUCCEEDING_CARD);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(
      `http://127.0.0.1:3999/my-fee?checkout=success&session_id=${start.body.sessionId}`,
    );
    const sent = deliveriesSince(before);
    expect(sent.map((d) => [d.type, d.lastStatus])).toEqual([
      ['checkout.session.completed', 200],
      ['invoice.paid', 200],
    ]);
    expect(await recordedTypes(sent.map((d) => d.eventId))).toEqual(['checkout.session.completed', 'invoice.paid']);

    const fee = await agent.get('/api/my-fee');
    expect(fee.body).toMatchObject({ athleteId, status: 'active', plan: { id: planId, priceMinor: 4900 } });
    const periodDays = (Date.parse(fee.body.currentPeriodEnd) - Date.parse(fee.body.lastPaymentAt)) / 86_400_000;
    expect(periodDays).toBeGreaterThanOrEqual(28);
    expect(periodDays).toBeLessThanOrEqual(31);
    const row = await billing(athleteId);
    expect(row?.providerCustomerId).toMatch(/^cus_/);
    expect(row?.providerSubscriptionId).toMatch(/^sub_/);

    // The plan got its provider price through the SDK, reused by the next checkout.
    const [plan] = await db().select().from(feePlans).where(eq(feePlans.id, planId));
    expect(plan?.providerPriceId).toMatch(/^price_/);
    expect(fake.store.state.prices[plan!.providerPriceId!]).toMatchObject({ unit_amount: 4900, currency: 'eur' });

    // A receipt waits in the outbox for the athlete's address.
    const mail = await db()
      .select()
      .from(outbox)
      .where(and(eq(outbox.kind, 'fee_receipt'), eq(outbox.toEmail, team.athleteUser.email)));
    expect(mail).toHaveLength(1);
    expect(mail[0]!.textBody).toContain('€49.00');
  });

  it('refuses a second checkout while a fee runs', async () => {
    const { planId, agent } = await payingAthlete();
    await checkoutAndPay(agent, planId, SUCCEEDING_CARD);
    const again = await agent.post('/api/my-fee/checkout').send({ planId });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('fee_running');
  });
});

describe('a declined card', () => {
  it('stays on the provider’s page, sends nothing and leaves the status as it was', async () => {
    const { planId, agent, athleteId } = await payingAthlete();
    const { paid, deliveries } = await checkoutAndPay(agent, planId, DECLINED_CARD);
    expect(paid.status).toBe(402);
    expect(await paid.text()).toContain('The card was declined');
    expect(deliveries).toEqual([]);
    expect((await agent.get('/api/my-fee')).body).toMatchObject({ status: 'none', lastPaymentAt: null });
    expect((await billing(athleteId))?.providerSubscriptionId ?? null).toBeNull();
  });

  it('an invalid number or a past expiry is refused on the page itself', async () => {
    const { planId, agent } = await payingAthlete();
    const start = await agent.post('/api/my-fee/checkout').send({ planId });
    const invalid = await pay(start.body.url, '4111 2222 3333 4449');
    expect(invalid.status).toBe(422);
    expect(await invalid.text()).toContain('This card number is not valid.');
    const expired = await fetch(start.body.url, {
      method: 'POST',
      body: new URLSearchParams({ number: SUCCEEDING_CARD, expiry: '01/20', cvc: '321', name: 'Test Payer' }),
    });
    expect(await expired.text()).toContain('This card has expired.');
  });
});

describe('renewals', () => {
  it('a failed renewal makes the fee past due, keeping the last payment', async () => {
    const { planId, agent, athleteId } = await payingAthlete();
    await checkoutAndPay(agent, planId, RENEWAL_FAILING_CARD);
    const active = await agent.get('/api/my-fee');
    expect(active.body.status).toBe('active');
    const sub = (await billing(athleteId))!.providerSubscriptionId!;

    const renewal = await fake.renew(sub);
    expect(renewal.delivery).toMatchObject({ type: 'invoice.payment_failed', lastStatus: 200, delivered: true });
    const after = await agent.get('/api/my-fee');
    expect(after.body).toMatchObject({ status: 'past_due', lastPaymentAt: active.body.lastPaymentAt });
  });

  it('a paid renewal moves the next renewal a month on and records the payment', async () => {
    const { planId, agent, athleteId } = await payingAthlete();
    await checkoutAndPay(agent, planId, SUCCEEDING_CARD);
    const first = (await agent.get('/api/my-fee')).body;
    const renewal = await fake.renew((await billing(athleteId))!.providerSubscriptionId!);
    expect(renewal.delivery.type).toBe('invoice.paid');
    const next = (await agent.get('/api/my-fee')).body;
    expect(next.status).toBe('active');
    const days = (Date.parse(next.currentPeriodEnd) - Date.parse(first.currentPeriodEnd)) / 86_400_000;
    expect(days).toBeGreaterThanOrEqual(28);
    expect(days).toBeLessThanOrEqual(31);
    expect(Date.parse(next.lastPaymentAt)).toBeGreaterThanOrEqual(Date.parse(first.lastPaymentAt));
  });
});

describe('cancel → cancelled', () => {
  it('ends the subscription through the SDK now, and the provider’s event agrees', async () => {
    const { planId, agent, athleteId } = await payingAthlete();
    await checkoutAndPay(agent, planId, SUCCEEDING_CARD);
    const sub = (await billing(athleteId))!.providerSubscriptionId!;
    const before = fake.store.state.deliveries.length;

    const res = await agent.post('/api/my-fee/cancel');
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('cancelled');
    expect(fake.store.state.subscriptions[sub]?.status).toBe('canceled');
    const sent = deliveriesSince(before);
    expect(sent.map((d) => [d.type, d.lastStatus])).toEqual([['customer.subscription.deleted', 200]]);
    expect(await recordedTypes(sent.map((d) => d.eventId))).toEqual(['customer.subscription.deleted']);

    const again = await agent.post('/api/my-fee/cancel');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('no_running_fee');
    // A cancelled subscription does not renew, and a new plan can be chosen.
    await expect(fake.renew(sub)).rejects.toThrow(/does not renew/);
    expect((await agent.post('/api/my-fee/checkout').send({ planId })).status).toBe(200);
  });
});

describe('the head coach on an athlete’s behalf', () => {
  let team: TestTeam;
  let head: request.Agent;
  beforeAll(async () => {
    team = await createTeam(db());
    head = await t.signIn(team.headCoach.email);
  });

  it('starts a checkout that returns to the Fees page, and sees the athlete active after paying', async () => {
    // An athlete without an account of their own.
    const athleteId = await createAthlete(db(), team.teamId, { name: 'Walk-in Athlete' });
    const planId = await createFeePlan(db(), team.teamId, { priceMinor: 3000 });
    const start = await head.post(`/api/fees/athletes/${athleteId}/checkout`).send({ planId });
    expect(start.status).toBe(200);
    const paid = await pay(start.body.url, SUCCEEDING_CARD);
    expect(paid.headers.get('location')).toMatch(
      new RegExp(`^http://127\\.0\\.0\\.1:3999/fees\\?checkout=success&athlete=${athleteId}&session_id=cs_test_`),
    );
    const list = await head.get('/api/fees/athletes?status=active');
    expect(list.body.items.map((a: { athleteId: number }) => a.athleteId)).toEqual([athleteId]);
    // No account, so no receipt address.
    expect(fake.store.state.customers[(await billing(athleteId))!.providerCustomerId!]?.email).toBeNull();

    const cancelled = await head.post(`/api/fees/athletes/${athleteId}/cancel`);
    expect(cancelled.body.status).toBe('cancelled');
  });

  it('validates, and cannot reach another team’s athletes or plans', async () => {
    const other = await createTeam(db());
    const theirPlan = await createFeePlan(db(), other.teamId);
    const mine = await createFeePlan(db(), team.teamId);
    expect((await head.post(`/api/fees/athletes/${other.athleteId}/checkout`).send({ planId: mine })).status).toBe(404);
    expect((await head.post(`/api/fees/athletes/${other.athleteId}/cancel`)).status).toBe(404);
    const foreignPlan = await head.post(`/api/fees/athletes/${team.athleteId}/checkout`).send({ planId: theirPlan });
    expect(foreignPlan.status).toBe(422);
    expect(foreignPlan.body.error.fields).toEqual({ planId: ['Choose one of the plans on offer'] });
    const bad = await head.post('/api/fees/athletes/x/checkout').send({ planId: 'one' });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['params.athleteId', 'planId']);
    const coach = await t.signIn(team.coach.email);
    expect((await coach.post(`/api/fees/athletes/${team.athleteId}/checkout`).send({ planId: mine })).status).toBe(403);
  });
});

describe('the athlete’s own fee', () => {
  it('refuses archived plans, missing plans and athletes without a roster entry', async () => {
    const { team, agent } = await payingAthlete();
    const archived = await createFeePlan(db(), team.teamId, { archivedAt: new Date() });
    const res = await agent.post('/api/my-fee/checkout').send({ planId: archived });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.planId).toEqual(['This plan is no longer offered']);
    expect((await agent.post('/api/my-fee/checkout').send({})).body.error.fields).toHaveProperty('planId');
    expect((await agent.post('/api/my-fee/cancel')).status).toBe(409);

    const unlinked = await createUser(db(), team.teamId, 'athlete');
    const lone = await t.signIn(unlinked.email);
    expect((await lone.get('/api/my-fee')).status).toBe(404);
  });

  it('an archived athlete’s fee is out of reach', async () => {
    const { agent, athleteId } = await payingAthlete();
    await db().update(athletes).set({ archivedAt: new Date() }).where(eq(athletes.id, athleteId));
    expect((await agent.get('/api/my-fee')).status).toBe(404);
  });

  it('a provider that cannot be reached answers 502 without details', async () => {
    const team = await createTeam(down.ctx.database.db);
    const planId = await createFeePlan(down.ctx.database.db, team.teamId);
    const agent = await down.signIn(team.athleteUser.email);
    const res = await agent.post('/api/my-fee/checkout').send({ planId });
    expect(res.status).toBe(502);
    expect(res.body).toEqual({
      error: {
        code: 'payment_provider_error',
        message: 'The payment provider did not answer as expected. Try again in a moment.',
      },
    });
  });
});
