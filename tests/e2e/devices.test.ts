// The account menu and Signed-in devices: the list shows each signed-in browser, and "Sign out
// everywhere" ends them all, the other browser included.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, signInAs, type Browser } from './support/browser';

let phone: Browser;
let laptop: Browser;
beforeAll(async () => {
  phone = await openBrowser({ width: 375, height: 800 });
  laptop = await openBrowser();
});
afterAll(async () => {
  await phone?.close();
  await laptop?.close();
});

describe('signed-in devices', () => {
  it('lists both browsers, and signing out everywhere ends the other one too', async () => {
    await signInAs(laptop, 'other@rackturn.test');
    await laptop.page.waitForURL(/\/board$/);
    await signInAs(phone, 'other@rackturn.test');
    await phone.page.waitForURL(/\/board$/);

    // The account menu opens from the keyboard and closes with Escape.
    const menu = phone.page.getByRole('button', { name: /Account/ });
    await menu.focus();
    await phone.page.keyboard.press('Enter');
    await expect(menu.getAttribute('aria-expanded')).resolves.toBe('true');
    await phone.page.keyboard.press('Escape');
    await expect(menu.getAttribute('aria-expanded')).resolves.toBe('false');
    await menu.click();
    await phone.page.getByRole('link', { name: 'Signed-in devices' }).click();
    await phone.page.waitForURL(/\/devices$/);
    const list = phone.page.getByRole('list', { name: 'Signed-in devices' });
    await list.getByText('This device').waitFor();
    expect(await list.getByRole('listitem').count()).toBeGreaterThanOrEqual(2);

    await phone.page.getByRole('button', { name: 'Sign out everywhere' }).click();
    await phone.page.waitForURL(/\/sign-in/);
    // The other browser is signed out as well (after at most the server's few-second session cache).
    await new Promise((r) => setTimeout(r, 3_500));
    await laptop.page.goto(`${laptop.baseUrl}/library`);
    await laptop.page.waitForURL(/\/sign-in/);
  });

  it('raised no console errors or Content-Security-Policy violations', () => {
    // The signed-out browser's first request answers 401, which the console logs.
    expect(phone.problems).toEqual([]);
    expect(laptop.problems.filter((p) => !p.includes('401'))).toEqual([]);
  });
});
