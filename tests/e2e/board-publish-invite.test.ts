// From the board's publish dialog: an athlete without an account is invited with one button, which opens
// the invitation form for that athlete in place (the roster holds no e-mail for them), and the mail goes out.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inboxClient } from '../../server/standins/smtp';
import { axeViolations } from './support/axe';
import { openBrowser, signInAs, type Browser } from './support/browser';

const email = `invited-from-publish-${Date.now().toString(36)}@example.test`;
const inbox = inboxClient();

let b: Browser;
beforeAll(async () => {
  b = await openBrowser({ width: 1440, height: 900 });
  await signInAs(b, 'coach@rackturn.test');
  await b.page.waitForURL(/\/board$/);
  await b.page.getByRole('table').waitFor();
});
afterAll(async () => {
  await b?.close();
});

describe('publish dialog invitations', () => {
  it('invites an athlete without an account from the list, in place, and the invitation is mailed', async () => {
    const page = b.page;
    await page.getByRole('button', { name: /^Publish (week|changes)$/ }).click();
    const dialog = page.getByRole('dialog', { name: /^Publish / });
    const list = dialog.getByRole('region', { name: 'Athletes without an account' });
    await list.waitFor();
    const invite = list.getByRole('button', { name: /^Invite / }).first();
    const name = (await invite.textContent())!.replace(/^Invite /, '');
    const before = await list.getByRole('button', { name: /^Invite / }).count();
    expect(before).toBeGreaterThan(0);

    await invite.click();
    const form = list.getByRole('form', { name: `Invite ${name}` });
    await form.waitFor();
    // The form opens for that athlete with the focus on the one thing it needs.
    await expect(page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.type)).resolves.toBe('email');
    expect(await axeViolations(page)).toEqual([]);

    // Bad input first: the browser's own check keeps an address that is not one from being sent.
    await form.getByLabel(`${name}: e-mail`).fill('not an address');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await expect(form.isVisible()).resolves.toBe(true);

    await form.getByLabel(`${name}: e-mail`).fill(email);
    const sent = page.waitForResponse((r) => r.url().endsWith('/api/invitations') && r.request().method() === 'POST');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    expect((await sent).status()).toBe(201);
    await list.getByText(`${name}: invitation sent to ${email}.`).waitFor();
    const [mail] = await inbox.waitFor(email, { timeoutMs: 15_000 });
    expect(mail).toBeDefined();
    // The other athletes keep their own button.
    await expect(list.getByRole('button', { name: /^Invite / }).count()).resolves.toBe(before - 1);
  });

  it('raised no console errors', () => {
    expect(b.problems).toEqual([]);
  });
});
