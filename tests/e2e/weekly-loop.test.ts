// The weekly loop in Chromium, as a new head coach would run it: fill next week, go through "Needs a
// look" fixing each cell through "What fits here", two overrides (one that needs a reason), publish with
// the check first. The actions are counted; the athlete sees nothing of next week before publishing and
// the published picks after it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { axeViolations } from './support/axe';
import { cell } from './support/board';
import { openBrowser, signInAs, type Browser } from './support/browser';

const next = addWeeks(weekOfDate(new Date()), 1);
const UPPER = 'Upper max effort';
const LOWER = 'Lower max effort';

let coach: Browser;
let athlete: Browser;
beforeAll(async () => {
  coach = await openBrowser({ width: 1440, height: 900 });
  await signInAs(coach, 'coach@rackturn.test');
  await coach.page.waitForURL(/\/board$/);
  athlete = await openBrowser({ width: 375, height: 812 });
  await signInAs(athlete, 'athlete@rackturn.test');
  await athlete.page.waitForURL(/\/my-week$/);
});
afterAll(async () => {
  await coach?.close();
  await athlete?.close();
});

async function athleteSeesNext(page: Page) {
  await page.goto(`${athlete.baseUrl}/my-week?week=${next}`);
  await page.getByRole('heading', { name: 'My week' }).waitFor();
}

const needsALook = (page: Page) => page.getByRole('region', { name: /^Needs a look/ });

describe('the weekly loop', () => {
  it('fill, review, fix, two overrides and publish in at most 10 actions, no break left unexplained', async () => {
    const page = coach.page;
    let actions = 0;
    await page.getByRole('table').waitFor();

    // Before: next week is a draft the athlete cannot see.
    await athleteSeesNext(athlete.page);
    await athlete.page.getByText('Your coach is still planning this week.').waitFor();

    // 1. Fill next week: "Needs a look" leads the report.
    const ran = page.waitForResponse((r) => r.url().endsWith('/api/plans/generate'));
    await page.getByRole('button', { name: 'Fill next week', exact: true }).click();
    actions++;
    expect((await ran).status()).toBe(200);
    const look = needsALook(page);
    await look.waitFor();
    await expect(
      athleteSeesNext(athlete.page).then(() =>
        athlete.page.getByText('Your coach is still planning this week.').isVisible(),
      ),
    ).resolves.toBe(true);

    // 2. Two overrides on the first athlete's row (on screen as the board opens), both through "What fits here": a pick that breaks the
    //    elbow restriction, kept with the reason written beside the list; and another clean variant.
    const isSave = (r: { url(): string; request(): { method(): string } }) =>
      r.url().includes('/api/plans/') && r.request().method() === 'PUT';
    const elbow = cell(page, 'Dario Menditto', next, UPPER);
    await elbow.getByRole('button').click();
    actions++;
    let details = page.getByRole('dialog');
    await details.getByLabel(/Reason to keep a pick that breaks a rule/).fill('Banded, 60 %, cleared with the physio');
    actions++;
    const kept = page.waitForResponse(isSave);
    await details.getByRole('button', { name: 'Use Bench press with bands', exact: true }).click();
    actions++;
    expect((await kept).status()).toBeLessThan(300);
    await expect
      .poll(() => elbow.getByRole('button').getAttribute('aria-description'))
      .toMatch(/Coach pick, pinned: Banded, 60 %.*Breaks a rule/);

    await cell(page, 'Dario Menditto', next, LOWER).getByRole('button').click();
    actions++;
    details = page.getByRole('dialog');
    const swapped = page.waitForResponse(isSave);
    await details.locator('[data-alternative="clean"]').nth(1).getByRole('button', { name: /^Use / }).click();
    actions++;
    expect((await swapped).status()).toBeLessThan(300);

    // 3. Each cell in the list: its link opens the cell's details on "What fits here"; one click applies
    //    the best clean variant.
    const seen = new Set<string>();
    for (let round = 0; round < 12; round++) {
      const links = look.locator('a[data-look]:not([data-explained])');
      const keys = await links.evaluateAll((els) => els.map((e) => e.getAttribute('data-look')!));
      if (round === 0) console.log(`Needs a look after the fill: ${keys.length}`, await look.textContent());
      const key = keys.find((k) => !seen.has(k));
      if (!key) break;
      seen.add(key);
      await look.locator(`a[data-look="${key}"]`).click();
      actions++;
      const details = page.getByRole('dialog');
      await details.getByRole('heading', { name: 'What fits here' }).waitFor();
      // The card has the focus behind the dialog: the link took the coach to the cell.
      // The best clean variant in one click. When none is clean the panel says so and why; a caution that
      // no variant avoids (every bench variant brings a joint near its budget) is kept as it is.
      const clean = details.locator('[data-alternative="clean"]').first();
      if ((await clean.count()) === 0) {
        await expect(details.getByRole('note').textContent()).resolves.toMatch(/Nothing clean fits here/);
        await details.getByRole('button', { name: 'Close', exact: true }).first().click();
        actions++;
        continue;
      }
      const saved = page.waitForResponse((r) => r.url().includes('/api/plans/') && r.request().method() === 'PUT');
      await clean.getByRole('button', { name: /^Use / }).click();
      actions++;
      expect((await saved).status()).toBeLessThan(300);
      await expect.poll(() => look.locator(`a[data-look="${key}"]`).count()).toBe(0);
    }

    // No rule break is left without a reason.
    await expect(look.locator('a[data-status="break"]:not([data-explained])').count()).resolves.toBe(0);

    // 4. Publish: the check first, then publish.
    await page.getByRole('button', { name: /^Publish (week|changes)$/ }).click();
    actions++;
    const dialog = page.getByRole('dialog', { name: `Publish ${next}` });
    await dialog.getByRole('region', { name: 'E-mails to send' }).waitFor();
    await expect(dialog.getByRole('region', { name: 'Rule breaks without a reason' }).textContent()).resolves.toMatch(
      /: 0$/,
    );
    expect(await axeViolations(page)).toEqual([]);
    await page.screenshot({ path: '.tmp/e2e-loop-publish-check.png' });
    const published = page.waitForResponse((r) => r.url().endsWith(`/api/weeks/${next}/publish`) && r.status() < 300);
    await dialog.getByRole('button', { name: /^Publish( anyway)?$/ }).click();
    actions++;
    await published;
    await dialog.getByRole('status').waitFor();

    console.log(`weekly loop story: ${actions} actions, ${seen.size} cells in Needs a look`);
    expect(actions).toBeLessThanOrEqual(10);

    // After: the athlete sees next week's published picks.
    await athleteSeesNext(athlete.page);
    await expect(athlete.page.getByText('Your coach is still planning this week.').count()).resolves.toBe(0);
    const picks = await athlete.page.getByRole('heading', { level: 2 }).allTextContents();
    expect(picks.length).toBeGreaterThan(0);
    await athlete.page.screenshot({ path: '.tmp/e2e-loop-athlete-after.png', fullPage: true });
  });

  it('on a phone the board is read-only with the library hidden: no drag, a pick opens its details', async () => {
    const phone = await openBrowser({ width: 390, height: 844 });
    try {
      await signInAs(phone, 'coach@rackturn.test');
      await phone.page.getByRole('table').waitFor();
      await expect(phone.page.getByRole('complementary', { name: 'Library' }).count()).resolves.toBe(0);
      await expect(phone.page.getByRole('button', { name: 'Show library' }).count()).resolves.toBe(0);
      await expect(phone.page.getByRole('button', { name: 'Fill next week' }).count()).resolves.toBe(0);
      await phone.page.getByText('On a phone the board is read-only').waitFor();
      // Nothing can be picked up or dropped on.
      await expect(phone.page.locator('[aria-roledescription="movable pick"], [data-drop-id]').count()).resolves.toBe(
        0,
      );
      // A pick this week opens its details, with nothing to apply from there.
      const pick = phone.page.locator(`[data-cell*="|${weekOfDate(new Date())}|"] button`).first();
      await pick.click();
      const details = phone.page.getByRole('dialog');
      await details.waitFor();
      await expect(details.getByRole('button', { name: /^Use / }).count()).resolves.toBe(0);
      expect(await axeViolations(phone.page)).toEqual([]);
      await details.getByRole('button', { name: 'Close' }).first().click();
      await phone.page.screenshot({ path: '.tmp/e2e-loop-board-390.png' });
    } finally {
      await phone.close();
    }
  });
});
