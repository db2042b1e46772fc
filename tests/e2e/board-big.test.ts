// The board for a big team, in Chromium: rows filtered by name, meet, restriction and "needs a look",
// a jump to one athlete's row, cells of the wrong lift staying quiet while a card is carried, and the
// joint strip's bars named in place.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { axeViolations } from './support/axe';
import { athleteNames, jumpTo, library, showOnly } from './support/board';
import { openBrowser, signInAs, type Browser } from './support/browser';

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

const filters = (page: Page) => page.getByRole('search', { name: 'Athletes on the board' });
const rowHeaders = (page: Page) => page.locator('tbody th[scope="row"]');

describe('a board for many athletes', () => {
  it('filters the rows by name, meet, restriction and "needs a look", and shows everyone again', async () => {
    const page = b.page;
    // The rows drawn now (rows far below the view are left out of the document) and the team's size.
    const all = await athleteNames(page);
    const f = filters(page);
    const total = Number(/^(\d+) athletes$/.exec((await f.getByRole('status').textContent())!)![1]);
    await f.getByLabel('Name').fill('noor');
    await expect.poll(() => athleteNames(page)).toEqual(['Noor Halvorsen']);
    await f.getByText(`Showing 1 of ${total} athletes`).waitFor();
    await f.getByRole('button', { name: 'Show everyone' }).click();
    await expect.poll(() => athleteNames(page)).toEqual(all);

    await f.getByLabel('Meet').selectOption({ label: 'Has a meet ahead' });
    const withMeet = await athleteNames(page);
    expect(withMeet.length).toBeGreaterThan(0);
    await f.getByText(`Showing ${withMeet.length} of ${total} athletes`).waitFor();
    expect(withMeet.length).toBeLessThan(total);
    for (const text of await rowHeaders(page).allTextContents()) expect(text).toMatch(/Meet W\d+/);
    await f.getByLabel('Meet').selectOption({ label: 'Any' });

    await f.getByLabel('Restriction').selectOption({ label: 'Has a restriction' });
    const restricted = await athleteNames(page);
    expect(restricted).toContain('Dario Menditto');
    await f.getByText(`Showing ${restricted.length} of ${total} athletes`).waitFor();
    expect(restricted.length).toBeLessThan(total);
    // Each row kept carries a restriction chip.
    const chips = await rowHeaders(page).evaluateAll((ths) =>
      ths.map((th) => th.querySelectorAll('[title], .bg-caution-100').length),
    );
    expect(chips.every((n) => n > 0)).toBe(true);
    await f.getByLabel('Restriction').selectOption({ label: 'Any' });

    await f.getByLabel('Needs a look only').check();
    // Every row kept has a pick with its own badge (a warning or a break) in the weeks still to plan.
    const badged = await rowHeaders(page).evaluateAll((ths) =>
      ths.map((th) => th.parentElement!.querySelectorAll('[data-pick-status]').length),
    );
    expect(badged.every((n) => n > 0)).toBe(true);
    await f.getByLabel('Needs a look only').uncheck();
    await expect.poll(() => athleteNames(page)).toEqual(all);
  });

  it('jumps to an athlete: the row is scrolled to and its name has the focus', async () => {
    const page = b.page;
    const all = await athleteNames(page);
    const last = all[all.length - 1]!;
    await jumpTo(page, last);
  });

  it('while a squat card is carried only the slots that take a squat are rated; the rest stay quiet', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/board`);
    await page.getByRole('table').waitFor();
    await library(page).getByLabel('Lift', { exact: true }).selectOption({ label: 'Squat' });
    const first = (await library(page).getByRole('button').first().getAttribute('aria-label'))!;
    const card = await showOnly(page, first);
    const a = (await card.boundingBox())!;
    await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
    await page.mouse.down();
    await page.mouse.move(a.x + a.width / 2 - 30, a.y + a.height / 2, { steps: 5 });
    // Held over the library, away from every cell (a cell right under the card says why it would not fit).
    await page.mouse.move(a.x + a.width / 2, a.y - 60, { steps: 5 });
    await expect.poll(() => page.locator('[data-rating]').count()).toBeGreaterThan(0);
    const rated = await page
      .locator('[data-rating]')
      .evaluateAll((els) => els.map((e) => `${e.getAttribute('aria-label')}=${e.getAttribute('data-rating')}`));
    // Lower max effort takes squats and deadlifts; Upper takes the bench: no upper cell is rated.
    expect(rated.filter((r) => r.includes('Upper max effort'))).toEqual([]);
    expect(rated.filter((r) => r.endsWith('=wrongLift'))).toEqual([]);
    await page.keyboard.press('Escape');
    await page.mouse.up();
    await library(page).getByLabel('Lift', { exact: true }).selectOption({ label: 'Any' });
  });

  it('compact rows fit more athletes on screen, and the choice is remembered after a reload', async () => {
    const page = b.page;
    const before = await athleteNames(page);
    const tall = (await rowHeaders(page).first().boundingBox())!.height;
    await filters(page).getByLabel('Compact rows').check();
    await expect.poll(async () => (await rowHeaders(page).first().boundingBox())!.height).toBeLessThan(tall / 1.5);
    expect((await athleteNames(page)).length).toBeGreaterThanOrEqual(before.length);
    await page.reload();
    await page.getByRole('table').waitFor();
    await expect(filters(page).getByLabel('Compact rows').isChecked()).resolves.toBe(true);
    expect((await rowHeaders(page).first().boundingBox())!.height).toBeLessThan(tall / 1.5);
    expect(await axeViolations(page)).toEqual([]);
    await filters(page).getByLabel('Compact rows').uncheck();
  });

  it('names each bar of the joint strip under it', async () => {
    const labels = b.page.locator('[data-joint-labels]').first();
    await labels.waitFor();
    const names = await labels.locator('span').allTextContents();
    expect(names.length).toBeGreaterThan(1);
    expect(names.every((n) => ['Shd', 'Elb', 'Wst', 'Back', 'Hip', 'Knee'].includes(n))).toBe(true);
    // A bar and its name line up: as many names as the picture's label lists joints.
    const said = (await b.page.locator('[role="img"][aria-label^="Joint load"]').first().getAttribute('aria-label'))!;
    expect(said.split(',').length).toBe(names.length);
  });

  it('raised no console errors', () => {
    expect(b.problems).toEqual([]);
  });
});
