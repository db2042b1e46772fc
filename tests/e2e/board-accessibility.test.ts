// Accessibility in Chromium: axe-core (WCAG 2.x A/AA and best practices) on every page of the app, as
// each role sees it (coach pages at 1440 px, athlete pages on a 375 px phone, the signed-out pages),
// and on the board while a card is carried with the keyboard. Also: the skip links, focus after a
// keyboard drop, and how many Tab presses it takes to reach the first library card.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { axeViolations } from './support/axe';
import { athleteNames, cell, fittingCards, keyboardTo, library, showOnly } from './support/board';
import { openBrowser, signInAs, type Browser } from './support/browser';

let coach: Browser;
let athlete: Browser;
let guest: Browser;
beforeAll(async () => {
  coach = await openBrowser({ width: 1440, height: 900 });
  await signInAs(coach, 'coach@rackturn.test');
  await coach.page.waitForURL(/\/board$/);
  athlete = await openBrowser({ width: 375, height: 812 });
  await signInAs(athlete, 'athlete@rackturn.test');
  await athlete.page.waitForURL(/\/my-week$/);
  guest = await openBrowser({ width: 1024, height: 800 });
});
afterAll(async () => {
  await coach?.close();
  await athlete?.close();
  await guest?.close();
});

async function api<T>(page: Page, path: string): Promise<T> {
  return page.evaluate(async (p) => (await fetch(`/api${p}`)).json(), path);
}

/** Opens a page, waits for its main heading and for the network to settle, then runs axe. */
async function checkPage(b: Browser, path: string, heading: RegExp | string): Promise<string[]> {
  await b.page.goto(`${b.baseUrl}${path}`);
  await b.page.getByRole('heading', { name: heading, level: 1 }).first().waitFor();
  // Let the page's queries answer: no "Loading…" left on screen, then a moment for the last paint.
  await b.page.getByText('Loading…', { exact: true }).first().waitFor({ state: 'detached' });
  await b.page.waitForTimeout(500);
  return axeViolations(b.page);
}

describe('zero axe-core violations on every page', () => {
  it('signed-out pages', async () => {
    const pages: [string, RegExp | string][] = [
      ['/sign-in', /./],
      ['/forgot-password', /./],
      ['/reset-password?token=x', /./],
      ['/accept-invitation?token=x', /./],
    ];
    const found: Record<string, string[]> = {};
    for (const [path, heading] of pages) found[path] = await checkPage(guest, path, heading);
    expect(found, JSON.stringify(found, null, 1)).toEqual(Object.fromEntries(pages.map(([p]) => [p, []])));
  });

  it('coach pages at 1440 px', async () => {
    const meets = await api<{ items: { id: number }[] }>(coach.page, '/meets');
    const athletes = await api<{ items: { id: number }[] }>(coach.page, '/athletes');
    const meetId = meets.items[0]!.id;
    const pages: [string, RegExp | string][] = [
      ['/board', 'Board'],
      ['/library', 'Library'],
      ['/roster', 'Roster'],
      [`/athletes/${athletes.items[0]!.id}`, /./],
      [`/athletes/${athletes.items[0]!.id}/weeks/${addWeeks(weekOfDate(new Date()), 1)}`, /./],
      ['/meets', 'Meets'],
      [`/meets/${meetId}/day`, /./],
      [`/meets/${meetId}/sheet`, /./],
      ['/rules', 'Rules'],
      ['/fees', /fee/i],
      ['/devices', /device/i],
      ['/no-such-page', /./],
    ];
    const found: Record<string, string[]> = {};
    for (const [path, heading] of pages) found[path] = await checkPage(coach, path, heading);
    expect(found, JSON.stringify(found, null, 1)).toEqual(Object.fromEntries(pages.map(([p]) => [p, []])));
  });

  it('coach pages on a 375 px phone: the meet is run from one, and the board reads on one', async () => {
    const phone = await openBrowser({ width: 375, height: 812 });
    try {
      await signInAs(phone, 'coach@rackturn.test');
      await phone.page.waitForURL(/\/board$/);
      const meets = await api<{ items: { id: number }[] }>(phone.page, '/meets');
      const meetId = meets.items[0]!.id;
      const pages: [string, RegExp | string][] = [
        ['/board', 'Board'],
        ['/meets', 'Meets'],
        [`/meets/${meetId}/day`, /./],
        [`/meets/${meetId}/sheet`, /./],
        ['/roster', 'Roster'],
      ];
      const found: Record<string, string[]> = {};
      for (const [path, heading] of pages) found[path] = await checkPage(phone, path, heading);
      expect(found, JSON.stringify(found, null, 1)).toEqual(Object.fromEntries(pages.map(([p]) => [p, []])));
    } finally {
      await phone.close();
    }
  });

  it('athlete pages on a 375 px phone', async () => {
    const pages: [string, RegExp | string][] = [
      ['/my-week', 'My week'],
      ['/my-history', /history/i],
      ['/my-fee', /fee/i],
      ['/devices', /device/i],
    ];
    const found: Record<string, string[]> = {};
    for (const [path, heading] of pages) found[path] = await checkPage(athlete, path, heading);
    expect(found, JSON.stringify(found, null, 1)).toEqual(Object.fromEntries(pages.map(([p]) => [p, []])));
  });
});

describe('the keyboard on the board', () => {
  it('one Tab and Enter reach the first card through "Skip to the board"', async () => {
    const page = coach.page;
    await page.goto(`${coach.baseUrl}/board`);
    await page.getByRole('table').waitFor();
    // Measured before the skip link: 16 Tab presses (brand, six links, account, sign out, five
    // toolbar controls, the library toggle) to the first card.
    await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.textContent)).resolves.toBe('Skip to the board');
    await page.keyboard.press('Enter');
    const onCard = await page.evaluate(() => {
      const e = document.activeElement;
      return e?.tagName === 'BUTTON' && !!e.closest('[data-drop-id]') ? e.getAttribute('aria-label') : null;
    });
    expect(onCard).toBeTruthy();
    // The second stop on every signed-in page: skip to the main content.
    await page.goto(`${coach.baseUrl}/roster`);
    await page.getByRole('heading', { name: 'Roster', level: 1 }).waitFor();
    await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.textContent)).resolves.toBe('Skip to main content');
    await page.keyboard.press('Enter');
    await expect(page.evaluate(() => document.activeElement?.id)).resolves.toBe('main');
  });

  it('no axe violations while a card is carried with the keyboard; after the drop the focus stays on that cell', async () => {
    const page = coach.page;
    // Tall enough that every demo athlete's row is drawn, so the arrow keys can reach any of them.
    await page.setViewportSize({ width: 1500, height: 2400 });
    await page.goto(`${coach.baseUrl}/board`);
    await page.getByRole('table').waitFor();
    const names = await athleteNames(page);
    const week = addWeeks(weekOfDate(new Date()), 6);
    const athleteName = names[3]!;
    const label = `${athleteName} · ${week} · Upper max effort`;
    let dropped: string | null = null;
    const target = cell(page, athleteName, week, 'Upper max effort');
    for (const name of (await fittingCards(page, target, 'Bench')).slice(0, 6)) {
      await showOnly(page, name);
      await library(page).getByRole('button', { name, exact: true }).focus();
      await page.keyboard.press('Space');
      await page.waitForFunction(() => document.activeElement?.getAttribute('aria-pressed') === 'true');
      const said = await keyboardTo(page, label, names);
      // While carried: the rated cells, the overlay and the live region pass axe too.
      expect(await axeViolations(page)).toEqual([]);
      if (!/: (Clean|Warning)/.test(said)) {
        await page.keyboard.press('Escape');
        continue;
      }
      const saved = page.waitForResponse((r) => r.url().includes('/api/plans/') && r.request().method() === 'PUT');
      await page.keyboard.press('Space');
      expect((await saved).status()).toBeLessThan(300);
      dropped = name;
      break;
    }
    expect(dropped).not.toBeNull();
    await expect
      .poll(() =>
        page.evaluate(() => {
          const e = document.activeElement;
          return `${e?.closest('[data-cell]')?.getAttribute('aria-label')} / ${e?.getAttribute('aria-label')}`;
        }),
      )
      .toBe(`${label} / ${dropped}`);
    await page.setViewportSize({ width: 1440, height: 900 });
  });
});
