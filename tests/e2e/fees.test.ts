// End to end: the demo athlete pays a plan on the local provider's test checkout page, comes back,
// and the head coach's Fees table shows the fee active; plans are added with field errors shown.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { DECLINED_CARD, SUCCEEDING_CARD } from '../../server/standins/payments/cards';
import { openBrowser, signInAs, type Browser } from './support/browser';

const SHOTS = join(process.env.TMPDIR ?? '.tmp', 'fees-screens');
mkdirSync(SHOTS, { recursive: true });

let phone: Browser;
let desk: Browser;
beforeAll(async () => {
  phone = await openBrowser({ width: 375, height: 812 });
  desk = await openBrowser();
});
afterAll(async () => {
  await phone?.close();
  await desk?.close();
});

async function typeCard(b: Browser, number: string) {
  await b.page.getByLabel('Card number').fill(number);
  await b.page.getByLabel('Expiry (MM/YY)').fill('10/39');
  await b.page.getByLabel('Security code').fill('456');
  await b.page.getByLabel('Name on card').fill('Noor Halvorsen');
  await b.page.getByRole('button', { name: /^Pay / }).click();
}

describe('paying a coaching fee', () => {
  it('the demo athlete chooses a plan, pays on the test checkout and comes back to an active fee', async () => {
    const b = phone;
    await signInAs(b, 'athlete@rackturn.test');
    await b.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Coaching fee' }).click();
    await b.page.waitForURL(/\/my-fee$/);
    await b.page.getByRole('heading', { name: 'Coaching fee' }).waitFor();
    await b.page.screenshot({ path: join(SHOTS, 'my-fee-choose-375.png'), fullPage: true });

    // Submitting without a choice names the missing field.
    await b.page.getByRole('button', { name: 'Continue to payment' }).click();
    await expect(b.page.getByRole('alert').first().textContent()).resolves.toContain('Choose a plan');

    await b.page.getByRole('radio', { name: /Coached block/ }).check();
    await b.page.getByRole('button', { name: 'Continue to payment' }).click();
    await b.page.waitForURL(/\/test-checkout\/cs_test_/);
    expect(new URL(b.page.url()).origin).not.toBe(b.baseUrl);
    await b.page.getByText('LOCAL TEST CHECKOUT').waitFor();
    await expect(b.page.getByText('€79.00', { exact: true }).first().isVisible()).resolves.toBe(true);

    // A declined card keeps the payer on the page with a message.
    await typeCard(b, DECLINED_CARD);
    await b.page.getByText('The card was declined').waitFor();
    expect(b.page.url()).toMatch(/\/test-checkout\//);
    await b.page.screenshot({ path: join(SHOTS, 'checkout-declined-375.png'), fullPage: true });

    await typeCard(b, SUCCEEDING_CARD);
    await b.page.waitForURL((u) => u.origin === b.baseUrl && u.pathname === '/my-fee');
    expect(new URL(b.page.url()).searchParams.get('checkout')).toBe('success');
    await b.page.getByText('Payment confirmed').waitFor();
    const status = b.page.getByRole('region', { name: 'Your fee' });
    await expect(status.getByText('Active').textContent()).resolves.toBe('Active');
    await expect(status.getByText('Coached block').isVisible()).resolves.toBe(true);
    await b.page.screenshot({ path: join(SHOTS, 'my-fee-active-375.png'), fullPage: true });
    // The page fits a phone: nothing wider than the screen.
    const overflow = await b.page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  });

  it('the head coach’s Fees table shows the athlete active, and the past-due filter narrows it', async () => {
    const b = desk;
    await signInAs(b, 'coach@rackturn.test');
    await b.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Fees' }).click();
    await b.page.waitForURL(/\/fees$/);
    const table = b.page.getByRole('table', { name: /Athletes’ fees/ });
    const noor = table.getByRole('row').filter({ hasText: 'Noor Halvorsen' });
    await noor.waitFor();
    await expect(noor.locator('[data-status]').textContent()).resolves.toBe('Active');
    await expect(noor.textContent()).resolves.toContain('Coached block');
    await b.page.screenshot({ path: join(SHOTS, 'fees-desktop.png'), fullPage: true });

    await b.page.getByRole('group', { name: 'Show' }).getByRole('button', { name: 'Past due' }).click();
    await b.page.waitForURL(/status=past_due/);
    await table.getByRole('row').filter({ hasText: 'Noor Halvorsen' }).waitFor({ state: 'detached' });
    const statuses = await table.locator('[data-status]').allTextContents();
    expect(statuses.length).toBeGreaterThan(0);
    expect(new Set(statuses)).toEqual(new Set(['Past due']));
  });

  it('the head coach adds a plan, with field errors from the form first', async () => {
    const b = desk;
    await b.page.goto(`${b.baseUrl}/fees`);
    await b.page.getByRole('button', { name: 'New plan' }).click();
    const form = b.page.getByRole('form', { name: 'New plan' });
    await form.getByRole('button', { name: 'Add plan' }).click();
    await form.getByText('Give the plan a name').waitFor();
    await form.getByText('Enter the monthly price').waitFor();
    const name = `Team kit ${Date.now() % 100000}`;
    await form.getByLabel('Name').fill(name);
    await form.getByLabel(/Monthly price/).fill('12.345');
    await form.getByRole('button', { name: 'Add plan' }).click();
    await form.getByText('Enter an amount like 45 or 45.50').waitFor();
    await form.getByLabel(/Monthly price/).fill('24,50');
    await form.getByRole('button', { name: 'Add plan' }).click();
    const card = b.page.getByRole('listitem', { name });
    await card.waitFor();
    await expect(card.textContent()).resolves.toContain('€24.50');
  });

  it('raised no console errors or Content-Security-Policy violations', () => {
    expect(phone.problems.filter((p) => !p.includes('402'))).toEqual([]);
    expect(desk.problems).toEqual([]);
  });
});
