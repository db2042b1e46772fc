// The local payments fake on its own: test cards, monthly periods, and the SDK's view of its API.
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import Stripe from 'stripe';
import { startPaymentsFake } from '../../server/standins/payments';
import { TEST_CARDS, checkCard, digitsOf, luhnValid } from '../../server/standins/payments/cards';
import { addMonth } from '../../server/standins/payments/store';

describe('test cards', () => {
  it('checks the Luhn digit (ISO/IEC 7812-1 Annex B; worked example 79927398713 is valid)', () => {
    expect(luhnValid('79927398713')).toBe(false); // 11 digits: shorter than any card number
    expect(luhnValid('000079927398713')).toBe(true); // the same worked example, zero-padded to card length
    expect(luhnValid('000079927398710')).toBe(false);
    for (const card of TEST_CARDS) expect(luhnValid(digitsOf(card.number)), card.number).toBe(true);
  });

  it('accepts only the listed cards, with a future expiry, a code and a name', () => {
    const now = new Date(Date.UTC(2030, 5, 15));
    const ok = { number: TEST_CARDS[0]!.number, expiry: '06/30', cvc: '123', name: 'A' };
    expect(checkCard(ok, now)).toMatchObject({ ok: true, behaviour: 'succeeds', last4: '4448' });
    expect(checkCard({ ...ok, expiry: '05/30' }, now)).toMatchObject({ ok: false, field: 'expiry' });
    expect(checkCard({ ...ok, expiry: '13/30' }, now)).toMatchObject({ ok: false, field: 'expiry' });
    expect(checkCard({ ...ok, cvc: '12' }, now)).toMatchObject({ ok: false, field: 'cvc' });
    expect(checkCard({ ...ok, name: ' ' }, now)).toMatchObject({ ok: false, field: 'name' });
    // A valid number that is not one of the test cards.
    expect(checkCard({ ...ok, number: '4242 4242 4242 4242' }, now)).toMatchObject({ ok: false, field: 'number' });
    expect(checkCard({ ...ok, number: TEST_CARDS[1]!.number }, now)).toMatchObject({ behaviour: 'declined' });
    expect(checkCard({ ...ok, number: TEST_CARDS[2]!.number }, now)).toMatchObject({ behaviour: 'fails_at_renewal' });
  });
});

describe('monthly periods', () => {
  const at = (s: string) => Date.parse(s) / 1000;
  it('bill on the same day next month, the month’s last day when it is shorter', () => {
    expect(addMonth(at('2030-01-15T10:00:00Z'))).toBe(at('2030-02-15T10:00:00Z'));
    expect(addMonth(at('2030-01-31T10:00:00Z'))).toBe(at('2030-02-28T10:00:00Z'));
    expect(addMonth(at('2032-01-31T10:00:00Z'))).toBe(at('2032-02-29T10:00:00Z')); // leap year
    expect(addMonth(at('2030-12-20T00:00:00Z'))).toBe(at('2031-01-20T00:00:00Z'));
    // Back to the anchor day after a short month.
    expect(addMonth(at('2030-02-28T10:00:00Z'), 31)).toBe(at('2030-03-31T10:00:00Z'));
  });
});

describe('the fake’s API through the SDK', async () => {
  const dir = mkdtempSync(join(tmpdir(), 'rackturn-payments-'));
  const fake = await startPaymentsFake({ port: 0, dataDir: dir });
  const sdk = (key = 'sk_test_rackturn_local_fake', port = fake.port) =>
    new Stripe(key, { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0 });
  afterAll(async () => {
    await fake.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('answers a repeated idempotency key with the first answer', async () => {
    const a = await sdk().customers.create({ name: 'Once' }, { idempotencyKey: 'same-key' });
    const b = await sdk().customers.create({ name: 'Once' }, { idempotencyKey: 'same-key' });
    expect(b.id).toBe(a.id);
    expect(a.id).toMatch(/^cus_[A-Za-z0-9]{14}$/);
  });

  it('refuses a wrong key and unknown ids the way the provider does', async () => {
    await expect(sdk('sk_test_wrong').customers.create({})).rejects.toBeInstanceOf(
      Stripe.errors.StripeAuthenticationError,
    );
    const missing = await sdk()
      .subscriptions.retrieve('sub_nope')
      .catch((e: unknown) => e);
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((missing as Stripe.errors.StripeError).code).toBe('resource_missing');
    await expect(sdk().checkout.sessions.create({ mode: 'payment' })).rejects.toThrow(/subscription/);
  });

  it('keeps its state in the data folder across a restart', async () => {
    const c = await sdk().customers.create({ name: 'Kept', metadata: { athleteId: '7' } });
    await fake.stop();
    const again = await startPaymentsFake({ port: 0, dataDir: dir });
    try {
      const back = await sdk('sk_test_rackturn_local_fake', again.port).customers.retrieve(c.id);
      expect(back).toMatchObject({ id: c.id, name: 'Kept', metadata: { athleteId: '7' } });
    } finally {
      await again.stop();
    }
  });
});
