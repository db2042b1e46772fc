// A board for forty athletes, in Chromium at 1440 × 900: a team of its own (the demo library, forty
// invented athletes) filled for next week in one plan run, then how many rows a screen shows with and
// without compact rows, a jump to the fortieth athlete, the name filter, and week columns that keep their
// width when an override with a reason marks cells around it.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { createDatabase, type Database } from '../../server/db/client';
import { insertLibrary } from '../../server/db/seed/demo';
import { DEMO_LIBRARY } from '../../server/db/seed/demo-library';
import { createAthlete, createTeam } from '../support/factories';
import { TEST_PASSWORD } from '../support/app';
import { axeViolations } from './support/axe';
import { athleteNames, cell, jumpTo, library, mouseDrag, showOnly } from './support/board';
import { openBrowser, signInAs, type Browser } from './support/browser';

const ATHLETES = 40;
const next = addWeeks(weekOfDate(new Date()), 1);
let database: Database;
let b: Browser;
let names: string[];
let teamId: number;

beforeAll(async () => {
  database = createDatabase(inject('e2eDatabaseUrl'), { connectionLimit: 2 });
  const team = await createTeam(database.db, `Forty Strong Test Club ${Date.now()}`);
  teamId = team.teamId;
  await insertLibrary(database.db, team.teamId, DEMO_LIBRARY);
  // The team's linked athlete makes one; thirty-nine more, named so they sort in order.
  names = ['Linked Athlete'];
  for (let i = 1; i < ATHLETES; i++) {
    const name = `Lifter ${String(i).padStart(2, '0')}`;
    await createAthlete(database.db, team.teamId, { name, sex: i % 2 ? 'M' : 'F' });
    names.push(name);
  }
  b = await openBrowser({ width: 1440, height: 900 });
  await signInAs(b, team.headCoach.email, TEST_PASSWORD);
  await b.page.waitForURL(/\/board$/);
  await b.page.getByRole('table').waitFor();
});
afterAll(async () => {
  await b?.close();
  await database?.close();
});

const filters = (page: Page) => page.getByRole('search', { name: 'Athletes on the board' });
/**
 * Rows wholly visible in the board's own scrolling box, with the box itself scrolled fully into the
 * window (as a coach scrolls the page down to the board).
 */
async function rowsInView(page: Page): Promise<number> {
  await page.locator('[data-board-scroll]').evaluate((el) => el.scrollIntoView({ block: 'end' }));
  return page.locator('[data-board-scroll]').evaluate((view) => {
    const box = view.getBoundingClientRect();
    const top = Math.max(box.top, 0) + (view.querySelector('thead')?.getBoundingClientRect().height ?? 0);
    const bottom = Math.min(box.bottom, window.innerHeight);
    return [...view.querySelectorAll('tbody th[scope="row"]')].filter((th) => {
      const r = th.getBoundingClientRect();
      return r.top >= top - 1 && r.bottom <= bottom + 1;
    }).length;
  });
}
const columnWidths = (page: Page) =>
  page.locator('thead th').evaluateAll((ths) => ths.map((th) => Math.round(th.getBoundingClientRect().width)));

describe('a board for forty athletes', () => {
  it('fills next week for all forty in one plan run, every cell filled', async () => {
    const page = b.page;
    await filters(page).getByText(`${ATHLETES} athletes`, { exact: true }).waitFor();
    const ran = page.waitForResponse((r) => r.url().endsWith('/api/plans/generate'), { timeout: 60_000 });
    await page.getByRole('button', { name: 'Fill next week', exact: true }).click();
    expect((await ran).status()).toBe(200);
    const report = page.getByRole('region', { name: 'Plan run' });
    await expect(report.getByRole('status').textContent()).resolves.toMatch(/0 could not be filled/);
    const [[row]] = (await database.pool.query(
      'SELECT COUNT(*) AS filled FROM plan_entries WHERE team_id = ? AND week = ?',
      [teamId, next],
    )) as unknown as [{ filled: number }[]];
    expect(Number(row!.filled)).toBe(ATHLETES * 2);
  });

  it('shows more rows on one screen with compact rows, and jumps to the fortieth athlete', async () => {
    const page = b.page;
    const normal = await rowsInView(page);
    await filters(page).getByLabel('Compact rows').check();
    await expect.poll(() => rowsInView(page)).toBeGreaterThan(normal);
    const compact = await rowsInView(page);
    console.log(`rows in view at 1440 × 900 with ${ATHLETES} athletes: ${normal} normal, ${compact} compact`);
    expect(normal).toBeGreaterThanOrEqual(3);
    expect(compact).toBeGreaterThanOrEqual(normal * 1.8);

    const last = names[names.length - 1]!;
    await jumpTo(page, last);

    await filters(page).getByLabel('Name').fill('lifter 3');
    await expect.poll(() => athleteNames(page)).toEqual(names.filter((n) => n.startsWith('Lifter 3')));
    await filters(page).getByText(`Showing 10 of ${ATHLETES} athletes`).waitFor();
    expect(await axeViolations(page)).toEqual([]);
    await filters(page).getByRole('button', { name: 'Show everyone' }).click();
    await filters(page).getByLabel('Compact rows').uncheck();
  });

  it('keeps every column’s width when an override with a reason marks the cells it affects', async () => {
    const page = b.page;
    const athlete = names[1]!;
    await filters(page).getByLabel('Name').fill(athlete);
    await expect.poll(() => athleteNames(page)).toEqual([athlete]);
    const before = await columnWidths(page);
    // The pick of next week's lower slot again in the week after: it repeats too soon, so the drop
    // breaks a rule and asks for a reason.
    const pick = (await cell(page, athlete, next, 'Lower max effort').getByRole('button').getAttribute('aria-label'))!;
    const target = cell(page, athlete, addWeeks(next, 1), 'Lower max effort');
    const card = await showOnly(page, pick);
    const rating = await mouseDrag(page, card, target, true);
    expect(rating).toBe('break');
    const dialog = page.getByRole('dialog', { name: 'This pick breaks a rule' });
    await dialog.getByLabel('Why keep it anyway?').fill('Testing a repeat on purpose');
    const saved = page.waitForResponse((r) => r.request().method() === 'PUT' && r.url().includes('/api/plans/'));
    await dialog.getByRole('button', { name: 'Save as coach pick' }).click();
    expect((await saved).status()).toBeLessThan(300);
    await target.getByRole('button', { name: pick, exact: true }).waitFor();
    // The week before now repeats too soon as well: the save named it, and the board marks it.
    await expect.poll(() => cell(page, athlete, next, 'Lower max effort').getAttribute('data-flagged')).toBe('true');
    await library(page).getByLabel('Search', { exact: true }).fill('');
    expect(await columnWidths(page)).toEqual(before);
    await filters(page).getByRole('button', { name: 'Show everyone' }).click();
  });
});
