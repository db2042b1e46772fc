// Signing in as each demo role shows that role's navigation, and only that.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, signInAs, type Browser } from './support/browser';

let b: Browser;
beforeAll(async () => {
  b = await openBrowser();
});
afterAll(async () => {
  await b?.close();
});

describe('signing in', () => {
  it('a signed-out visitor is sent to sign-in, and back to the page asked for after', async () => {
    await b.page.goto(`${b.baseUrl}/library`);
    await b.page.waitForURL(/\/sign-in\?next=%2Flibrary/);
    await b.page.getByLabel('E-mail').fill('coach@rackturn.test');
    await b.page.getByLabel('Password').fill('rackturn-demo');
    await b.page.getByRole('button', { name: 'Sign in' }).click();
    await b.page.waitForURL(/\/library$/);
    await b.page.getByRole('button', { name: 'Sign out' }).click();
    await b.page.waitForURL(/\/sign-in/);
  });

  it('shows a clear message for a wrong password', async () => {
    await b.page.goto(`${b.baseUrl}/sign-in`);
    await b.page.getByLabel('E-mail').fill('coach@rackturn.test');
    await b.page.getByLabel('Password').fill('wrong-password');
    await b.page.getByRole('button', { name: 'Sign in' }).click();
    await expect(b.page.getByRole('alert').first().textContent()).resolves.toMatch(/do not match/);
  });

  it('the head coach sees the coach navigation with Rules', async () => {
    await signInAs(b, 'coach@rackturn.test');
    await b.page.waitForURL(/\/board$/);
    const nav = b.page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Board' }).waitFor();
    const links = await nav.getByRole('link').allTextContents();
    expect(links).toEqual(['Board', 'Library', 'Accessories', 'Roster', 'Meets', 'Rules', 'Fees']);
    await b.page.getByRole('button', { name: 'Sign out' }).click();
    await b.page.waitForURL(/\/sign-in/);
  });

  it('the athlete sees only their own pages, and coach pages send them home', async () => {
    await signInAs(b, 'athlete@rackturn.test');
    await b.page.waitForURL(/\/my-week$/);
    await b.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My week' }).waitFor();
    const links = await b.page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents();
    expect(links).toEqual(['My week', 'My history', 'Coaching fee']);
    await b.page.goto(`${b.baseUrl}/board`);
    await b.page.waitForURL(/\/my-week$/);
    await b.page.getByRole('button', { name: 'Sign out' }).click();
  });

  it('raised no console errors or Content-Security-Policy violations', () => {
    // The wrong-password attempt logs its 401 in the console; nothing else may.
    expect(b.problems.filter((p) => !p.includes('401'))).toEqual([]);
  });
});
