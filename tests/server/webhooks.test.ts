// The payment webhook: signatures checked with the provider's SDK, every event handled once, and
// events arriving late, twice or out of order never corrupting an athlete's fee.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import request from 'supertest';
import Stripe from 'stripe';
import { eq } from 'drizzle-orm';
import { athleteBilling, paymentEvents } from '../../server/db/schema';
import { startPaymentsFake } from '../../server/standins/payments';
import { RENEWAL_FAILING_CARD, SUCCEEDING_CARD } from '../../server/standins/payments/cards';
import { useTestApp } from '../support/app';
import { createFeePlan, createTeam, setAthleteBilling } from '../support/factories';

const SECRET = 'whsec_rackturn_local_fake';
const fake = await startPaymentsFake({ port: 0, retryDelaysMs: [] });
const t = useTestApp({
  PAYMENTS_HOST: '127.0.0.1',
  PAYMENTS_PORT: String(fake.port),
  PAYMENTS_PROTOCOL: 'http',
  PAYMENTS_SECRET_KEY: 'sk_test_rackturn_local_fake',
  PAYMENTS_WEBHOOK_SECRET: SECRET,
});
const db = () => t.ctx.database.db;
let server: Server;
let hookUrl = '';

beforeAll(async () => {
  server = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  hookUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/payments`;
  fake.setWebhookUrl(hookUrl);
});
afterAll(async () => {
  await fake.stop();
  await new Promise((r) => server.close(r));
});

async function billing(athleteId: number) {
  const [row] = await db().select().from(athleteBilling).where(eq(athleteBilling.athleteId, athleteId));
  return row!;
}

async function eventCount() {
  return (await db().select({ id: paymentEvents.id }).from(paymentEvents)).length;
}

/** A team whose linked athlete has paid through the fake with the given card. */
async function paidAthlete(card = SUCCEEDING_CARD) {
  const team = await createTeam(db());
  const planId = await createFeePlan(db(), team.teamId);
  const agent = await t.signIn(team.athleteUser.email);
  const start = await agent.post('/api/my-fee/checkout').send({ planId });
  const before = fake.store.state.deliveries.length;
  const res = await fetch(start.body.url, {
    method: 'POST',
    body: new URLSearchParams({ number: card, expiry: '08/38', cvc: '123', name: 'Test Payer' }),
    redirect: 'manual',
  });
  expect(res.status).toBe(303);
  const events = fake.store.state.deliveries.slice(before).map((d) => d.eventId);
  return { team, athleteId: team.athleteId, agent, events, row: await billing(team.athleteId) };
}

/** Posts a payload as the provider would, signed with `secret` at `timestamp`. */
function postSigned(payload: string, opts: { secret?: string; timestamp?: number } = {}) {
  const header = Stripe.webhooks.generateTestHeaderString({
    payload,
    secret: opts.secret ?? SECRET,
    ...(opts.timestamp ? { timestamp: opts.timestamp } : {}),
  });
  return request(t.app)
    .post('/api/webhooks/payments')
    .set('Content-Type', 'application/json')
    .set('Stripe-Signature', header)
    .send(payload);
}

const payloadOf = (eventId: string) => JSON.stringify(fake.store.state.events[eventId]);

/** A cancellation event for this customer's subscription, as if from the provider. */
function endedEvent(row: { providerCustomerId: string | null; providerSubscriptionId: string | null }) {
  return JSON.stringify({
    id: `evt_forged_${Date.now()}`,
    object: 'event',
    type: 'customer.subscription.deleted',
    created: Math.floor(Date.now() / 1000),
    data: {
      object: {
        id: row.providerSubscriptionId,
        object: 'subscription',
        customer: row.providerCustomerId,
        status: 'canceled',
        items: { data: [] },
      },
    },
  });
}

describe('signatures', () => {
  it('refuses a forged signature, a stale timestamp, a changed body and a missing header; nothing changes', async () => {
    const { row } = await paidAthlete();
    const payload = endedEvent(row);
    const count = await eventCount();

    const forged = await postSigned(payload, { secret: 'whsec_somebody_else' });
    expect(forged.status).toBe(400);
    expect(forged.body.error.code).toBe('invalid_signature');

    // The SDK's default tolerance is five minutes.
    const stale = await postSigned(payload, { timestamp: Math.floor(Date.now() / 1000) - 600 });
    expect(stale.status).toBe(400);

    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET });
    const tampered = await request(t.app)
      .post('/api/webhooks/payments')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', header)
      .send(payload.replace('canceled', 'cancelled'));
    expect(tampered.status).toBe(400);

    const bare = await request(t.app)
      .post('/api/webhooks/payments')
      .set('Content-Type', 'application/json')
      .send(payload);
    expect(bare.status).toBe(400);
    expect(JSON.stringify(bare.body)).not.toMatch(/at .*\.ts:\d+/);

    const after = await billing(row.athleteId);
    expect(after).toMatchObject({ status: 'active', version: row.version });
    expect(await eventCount()).toBe(count);

    // The same payload, signed with the right secret, is accepted: the refusals were the signature's.
    const genuine = await postSigned(payload);
    expect(genuine.body).toEqual({ received: true, outcome: 'processed' });
    expect((await billing(row.athleteId)).status).toBe('cancelled');
  });

  it('needs no session or Origin, and any content type reaches the handler as raw bytes', async () => {
    const payload = JSON.stringify({
      id: `evt_other_${Date.now()}`,
      object: 'event',
      type: 'balance.available',
      data: { object: {} },
    });
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET });
    const res = await request(t.app)
      .post('/api/webhooks/payments')
      .set('Origin', 'https://elsewhere.example')
      .set('Content-Type', 'text/plain')
      .set('Stripe-Signature', header)
      .send(payload);
    expect(res.body).toEqual({ received: true, outcome: 'ignored' });
  });
});

describe('each event once', () => {
  it('a replayed event is acknowledged and changes nothing', async () => {
    const { athleteId, events } = await paidAthlete(RENEWAL_FAILING_CARD);
    const sub = (await billing(athleteId)).providerSubscriptionId!;
    await fake.renew(sub);
    const pastDue = await billing(athleteId);
    expect(pastDue.status).toBe('past_due');

    // The first payment's events again: once from the provider itself, once posted directly.
    const paidEvent = events[1]!;
    const resent = await fake.resend(paidEvent);
    expect(resent).toMatchObject({ lastStatus: 200, delivered: true });
    const direct = await postSigned(payloadOf(paidEvent));
    expect(direct.status).toBe(200);
    expect(direct.body.outcome).toBe('duplicate');
    expect((await postSigned(payloadOf(events[0]!))).body.outcome).toBe('duplicate');

    expect(await billing(athleteId)).toEqual(pastDue);
    const rows = await db().select().from(paymentEvents).where(eq(paymentEvents.eventId, paidEvent));
    expect(rows).toHaveLength(1);
  });

  it('two copies arriving at the same moment are handled once', async () => {
    const { row } = await paidAthlete();
    const payload = endedEvent(row);
    const answers = await Promise.all([postSigned(payload), postSigned(payload), postSigned(payload)]);
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200]);
    expect(answers.map((a) => a.body.outcome).sort()).toEqual(['duplicate', 'duplicate', 'processed']);
    const after = await billing(row.athleteId);
    expect(after).toMatchObject({ status: 'cancelled', version: row.version + 1 });
  });
});

describe('order and relevance', () => {
  it('the first invoice arriving before the checkout event still ends with an active fee', async () => {
    fake.setWebhookUrl('http://127.0.0.1:9/unreachable');
    try {
      const { athleteId, events } = await paidAthlete();
      expect((await billing(athleteId)).status).toBe('none');
      fake.setWebhookUrl(hookUrl);
      expect((await fake.resend(events[1]!)).lastStatus).toBe(200); // invoice.paid first
      const mid = await billing(athleteId);
      expect(mid).toMatchObject({ status: 'active' });
      expect(mid.lastPaymentAt).not.toBeNull();
      expect((await fake.resend(events[0]!)).lastStatus).toBe(200); // then the session
      const done = await billing(athleteId);
      expect(done).toMatchObject({ status: 'active', lastPaymentAt: mid.lastPaymentAt });
      expect(done.feePlanId).not.toBeNull();
    } finally {
      fake.setWebhookUrl(hookUrl);
    }
  });

  it('a late failure or payment of an ended subscription does not revive the fee', async () => {
    const team = await createTeam(db());
    await setAthleteBilling(db(), team.teamId, team.athleteId, {
      status: 'cancelled',
      providerCustomerId: `cus_late_${team.teamId}`,
      providerSubscriptionId: 'sub_old',
    });
    const invoice = (type: string, reason: string) =>
      JSON.stringify({
        id: `evt_${type}_${team.teamId}_${reason}`,
        object: 'event',
        type,
        data: {
          object: {
            id: `in_${reason}`,
            object: 'invoice',
            customer: `cus_late_${team.teamId}`,
            billing_reason: reason,
            amount_paid: 4500,
            currency: 'eur',
            parent: { subscription_details: { subscription: 'sub_old' } },
            lines: { data: [{ period: { start: 1, end: 2 } }] },
            status_transitions: { paid_at: 1 },
          },
        },
      });
    expect((await postSigned(invoice('invoice.payment_failed', 'subscription_cycle'))).body.outcome).toBe('ignored');
    expect((await postSigned(invoice('invoice.paid', 'subscription_cycle'))).body.outcome).toBe('processed');
    expect((await billing(team.athleteId)).status).toBe('cancelled');
  });

  it('records events for customers it does not know, and changes nothing', async () => {
    const count = await eventCount();
    const res = await postSigned(
      endedEvent({ providerCustomerId: 'cus_nobody_here', providerSubscriptionId: 'sub_nobody' }),
    );
    expect(res.body).toEqual({ received: true, outcome: 'ignored' });
    expect(await eventCount()).toBe(count + 1);
  });

  it('a signed event with an unexpected shape is a client error, not a crash', async () => {
    const payload = JSON.stringify({
      id: `evt_bad_${Date.now()}`,
      object: 'event',
      type: 'invoice.paid',
      data: { object: { id: 'in_x', customer: 42 } },
    });
    const res = await postSigned(payload);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
  });
});
