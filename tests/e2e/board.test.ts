// The coach's board in Chromium, as the demo head coach: Fill next week, drops with the mouse and with
// the keyboard that survive a reload, a rule-breaking drop that needs a reason, two coaches editing one
// cell, and the athlete seeing the saved pick on My week.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page, Response, Route } from 'playwright-core';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { athleteNames, cell, fittingCards, keyboardTo, library, mouseDrag, showOnly } from './support/board';
import { openBrowser, signInAs, type Browser } from './support/browser';

const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);
const LOWER = 'Lower max effort';
const UPPER = 'Upper max effort';
// Tall enough that every demo athlete's row is in the document without scrolling.
const VIEW = { width: 1500, height: 2400 };

let b: Browser;
beforeAll(async () => {
  b = await openBrowser(VIEW);
  await signInAs(b, 'coach@rackturn.test');
  await b.page.waitForURL(/\/board$/);
});
afterAll(async () => {
  await b?.close();
});

async function openBoard(page: Page) {
  await page.goto(`${b.baseUrl}/board`);
  await page.getByRole('table').waitFor();
}

const isSave = (r: Response) =>
  /\/api\/plans\/\d+\/\d{4}-W\d{2}\/[a-z-]+$/.test(new URL(r.url()).pathname) && r.request().method() === 'PUT';

/**
 * Drops the best library card (of a lift) that the server rates clean or a warning for the target, with
 * the mouse; returns its name. The board must rate it the same way just before the drop.
 */
async function dropCleanPick(page: Page, target: Locator, lift: 'Squat' | 'Bench' | 'Deadlift', skip: string[] = []) {
  const name = (await fittingCards(page, target, lift)).find((n) => !skip.includes(n));
  if (!name) throw new Error('no library card is clean for that cell');
  const card = await showOnly(page, name);
  const saved = page.waitForResponse(isSave, { timeout: 20_000 });
  saved.catch(() => undefined); // awaited below; a drag that fails first must not leave it unhandled
  const rating = await mouseDrag(page, card, target, true);
  expect(['clean', 'warning']).toContain(rating);
  expect((await saved).status()).toBeLessThan(300);
  return name;
}

describe('the board', () => {
  it('shows past weeks greyed, this week marked, and the planning actions', async () => {
    await openBoard(b.page);
    await expect(b.page.getByRole('columnheader', { name: /This week/ }).getAttribute('aria-current')).resolves.toBe(
      'date',
    );
    for (const name of ['Fill next week', 'Plan to meet', 'Reshuffle']) {
      await expect(b.page.getByRole('button', { name, exact: true }).isEnabled()).resolves.toBe(true);
    }
    const headers = await b.page.getByRole('columnheader').allTextContents();
    expect(headers.filter((h) => h.includes('Done'))).toHaveLength(4);
    expect(headers).toHaveLength(1 + 13);
    await b.page.screenshot({ path: '.tmp/e2e-board-start.png' });
  });

  it('Fill next week fills every demo athlete’s cells with no rule break shown', async () => {
    await openBoard(b.page);
    const ran = b.page.waitForResponse((r) => r.url().endsWith('/api/plans/generate'));
    await b.page.getByRole('button', { name: 'Fill next week', exact: true }).click();
    expect((await ran).status()).toBe(200);
    const report = b.page.getByRole('region', { name: 'Plan run' });
    await expect(report.getByRole('status').textContent()).resolves.toMatch(/0 could not be filled/);
    const names = await athleteNames(b.page);
    expect(names.length).toBeGreaterThanOrEqual(12);
    for (const name of names) {
      for (const slot of [LOWER, UPPER]) {
        const target = cell(b.page, name, wk(1), slot);
        await expect(target.getByRole('button').count()).resolves.toBe(1);
        await expect(target.getByText('Breaks rule').count()).resolves.toBe(0);
      }
    }
    // Running it again plans the same: nothing changes.
    const again = b.page.waitForResponse((r) => r.url().endsWith('/api/plans/generate'));
    await b.page.getByRole('button', { name: 'Fill next week', exact: true }).click();
    expect(((await (await again).json()) as { changes: unknown[] }).changes).toEqual([]);
    await b.page.screenshot({ path: '.tmp/e2e-board-filled.png' });
  });

  it('keeps a library card dropped with the mouse after a reload', async () => {
    await openBoard(b.page);
    const [athlete] = await athleteNames(b.page);
    const target = cell(b.page, athlete!, wk(4), LOWER);
    const name = await dropCleanPick(b.page, target, 'Squat');
    await openBoard(b.page);
    await expect(target.getByRole('button', { name, exact: true }).count()).resolves.toBe(1);
  });

  it('undoes the last change, version and all', async () => {
    await openBoard(b.page);
    // The first athlete by name has no meet ahead, so no taper narrows the choice in week 8.
    const [athlete] = await athleteNames(b.page);
    const target = cell(b.page, athlete!, wk(8), LOWER);
    const name = await dropCleanPick(b.page, target, 'Squat');
    await target.getByRole('button', { name, exact: true }).waitFor();
    const undone = b.page.waitForResponse((r) => r.request().method() === 'DELETE' && r.url().includes('/api/plans/'));
    await b.page.getByRole('button', { name: /^Undo/ }).click();
    expect((await undone).status()).toBe(200);
    await openBoard(b.page);
    await expect(target.getByRole('button').count()).resolves.toBe(0);
  });

  it('keeps a library card dropped with the keyboard only after a reload', async () => {
    await openBoard(b.page);
    const names = await athleteNames(b.page);
    const athlete = names[1]!;
    const targetLabel = `${athlete} · ${wk(5)} · ${UPPER}`;
    const candidates = await fittingCards(b.page, cell(b.page, athlete, wk(5), UPPER), 'Bench');
    let saved: string | null = null;
    for (const name of candidates.slice(0, 6)) {
      await library(b.page).getByLabel('Search', { exact: true }).fill(name);
      // From the search box, Tab reaches the filters and then the first card.
      await library(b.page).getByLabel('Search', { exact: true }).focus();
      for (let i = 0; i < 8; i++) {
        await b.page.keyboard.press('Tab');
        const role = await b.page.evaluate(() => document.activeElement?.getAttribute('aria-roledescription'));
        if (role === 'library card') break;
      }
      await expect(b.page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).resolves.toBe(name);
      await b.page.keyboard.press('Space');
      await b.page.waitForFunction(() => document.activeElement?.getAttribute('aria-pressed') === 'true');
      const status = await keyboardTo(b.page, targetLabel, names);
      if (/: (Clean|Warning)/.test(status)) {
        const done = b.page.waitForResponse(isSave);
        await b.page.keyboard.press('Space');
        expect((await done).status()).toBeLessThan(300);
        saved = name;
        break;
      }
      await b.page.keyboard.press('Escape');
    }
    expect(saved).not.toBeNull();
    await openBoard(b.page);
    await expect(
      cell(b.page, athlete, wk(5), UPPER).getByRole('button', { name: saved!, exact: true }).count(),
    ).resolves.toBe(1);
  });

  it('asks for a reason for a drop that breaks a rule, then shows a coach pick with a warning', async () => {
    await openBoard(b.page);
    // The demo's athlete with the irritated elbow (elbow stress at most 1) and a bench variant that loads it.
    const target = cell(b.page, 'Dario Menditto', wk(6), UPPER);
    const card = await showOnly(b.page, 'Bench press with bands');
    const rating = await mouseDrag(b.page, card, target);
    expect(rating).toBe('break');
    const dialog = b.page.getByRole('dialog', { name: 'This pick breaks a rule' });
    await dialog.waitFor();
    await expect(dialog.textContent()).resolves.toMatch(/elbow stress 3 over this athlete's limit of 1/);
    await dialog.getByRole('button', { name: 'Save as coach pick' }).click();
    await expect(dialog.getByRole('alert').textContent()).resolves.toBe('Say why in a few words');
    await dialog.getByLabel('Why keep it anyway?').fill('Banded work at 60%, cleared with the physio');
    const saved = b.page.waitForResponse(isSave);
    await dialog.getByRole('button', { name: 'Save as coach pick' }).click();
    const res = await saved;
    expect(res.status()).toBe(201);
    expect(await res.json()).toMatchObject({ source: 'coach', pinned: true });
    await openBoard(b.page);
    const pick = target.getByRole('button', { name: 'Bench press with bands', exact: true });
    await expect(pick.getAttribute('aria-description')).resolves.toMatch(
      /Coach pick, pinned: Banded work.*Breaks a rule/,
    );
    await expect(target.getByText('Breaks rule').isVisible()).resolves.toBe(true);
    await b.page.screenshot({ path: '.tmp/e2e-board-break.png' });
  });

  it('handles two coaches saving the same cell: one 409, the other pick shown, mine re-applied on request', async () => {
    const other = await openBrowser(VIEW);
    try {
      await signInAs(other, 'coach2@rackturn.test');
      await openBoard(b.page);
      await openBoard(other.page);
      const names = await athleteNames(b.page);
      const athlete = names[2]!;
      const mine = cell(b.page, athlete, wk(7), LOWER);
      const theirs = cell(other.page, athlete, wk(7), LOWER);
      // The second coach saves first; this page still shows the cell empty. Its board would catch up by
      // itself (every half minute, or when told of the change): held back here until the refusal, so the
      // test does not depend on how fast the machine is.
      const boardReads = (url: URL) => url.pathname === '/api/board';
      const held: Route[] = [];
      await b.page.route(boardReads, (route) => {
        held.push(route);
      });
      const first = await dropCleanPick(other.page, theirs, 'Deadlift');
      const statuses: number[] = [];
      b.page.on('response', (r) => {
        if (isSave(r)) statuses.push(r.status());
      });
      // This coach's drop meets the newer version and is refused.
      await expect(dropCleanPick(b.page, mine, 'Squat')).rejects.toThrow();
      expect(statuses).toEqual([409]);
      await b.page.unroute(boardReads);
      // A read the page has since given up (a newer one replaced it) needs no answer.
      for (const route of held) await route.continue().catch(() => undefined);
      const notice = b.page.getByRole('alert').filter({ hasText: 'Someone else changed this first' });
      await notice.waitFor();
      await expect(notice.textContent()).resolves.toContain(first);
      // The board refetched and shows the other coach's pick.
      await mine.getByRole('button', { name: first, exact: true }).waitFor();
      const reapplied = b.page.waitForResponse(isSave);
      await notice.getByRole('button', { name: 'Apply my change again' }).click();
      expect((await reapplied).status()).toBe(200);
      expect(statuses).toEqual([409, 200]);
      await openBoard(other.page);
      const now = await theirs.getByRole('button').getAttribute('aria-label');
      expect(now).not.toBe(first);
      await openBoard(b.page);
      await expect(mine.getByRole('button').getAttribute('aria-label')).resolves.toBe(now);
    } finally {
      await other.close();
    }
  });

  it('shows the athlete this week’s pick as soon as it is saved', async () => {
    await openBoard(b.page);
    const target = cell(b.page, 'Noor Halvorsen', thisWeek, LOWER);
    const before = await target
      .getByRole('button')
      .getAttribute('aria-label')
      .catch(() => null);
    const name = await dropCleanPick(b.page, target, 'Deadlift', before ? [before] : []);
    const athlete = await openBrowser({ width: 375, height: 812 });
    try {
      await signInAs(athlete, 'athlete@rackturn.test');
      await athlete.page.waitForURL(/\/my-week$/);
      await athlete.page.getByRole('heading', { name, exact: true }).waitFor();
      await athlete.page.screenshot({ path: '.tmp/e2e-board-my-week.png' });
    } finally {
      await athlete.close();
    }
  });

  it('raised no console errors besides the refused saves', () => {
    expect(b.problems.filter((p) => !/409|422/.test(p))).toEqual([]);
  });
});
