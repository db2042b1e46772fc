// Board helpers shared by the end-to-end tests: cells and the library by their names, and a mouse drag
// the way dnd-kit needs it.
import { expect } from 'vitest';
import type { Locator, Page } from 'playwright-core';

export const cell = (page: Page, athlete: string, week: string, slot: string) =>
  page.getByRole('group', { name: `${athlete} · ${week} · ${slot}`, exact: true });
export const library = (page: Page) => page.getByRole('complementary', { name: 'Library' });

export async function athleteNames(page: Page): Promise<string[]> {
  return page.locator('tbody th[scope="row"] > span:first-child').allTextContents();
}

/** Library cards for one lift, by name. */
export async function libraryNames(page: Page, lift: 'Squat' | 'Bench' | 'Deadlift'): Promise<string[]> {
  await library(page).getByLabel('Lift', { exact: true }).selectOption({ label: lift });
  // The drawer draws its cards a frame after the board: read them once they are there, not before.
  await library(page).getByRole('button', { name: /./ }).first().waitFor();
  const names = await library(page)
    .getByRole('button')
    .evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
  await library(page).getByLabel('Lift', { exact: true }).selectOption({ label: 'Any' });
  return names;
}

/**
 * Library cards of one lift that the server rates clean or warning for a cell (its "What fits here" list),
 * best first. The demo's history moves with today's date, so which cards fit a cell changes from day to
 * day: tests that need a drop that saves without a reason ask, rather than trying cards in library order.
 */
export async function fittingCards(page: Page, target: Locator, lift: 'Squat' | 'Bench' | 'Deadlift') {
  const ofLift = await libraryNames(page, lift);
  const [athleteId, week, slotId] = (await target.getAttribute('data-cell'))!.split('|');
  const fits = await page.evaluate(async (url) => {
    const res = await fetch(url, { credentials: 'same-origin' });
    return (await res.json()) as { items: { name: string; status: string; current: boolean }[] };
  }, `/api/plans/${athleteId}/${week}/${slotId}/alternatives`);
  const names = fits.items
    .filter((i) => i.status !== 'break' && !i.current && ofLift.includes(i.name))
    .map((i) => i.name);
  expect(names.length).toBeGreaterThan(0);
  return names;
}

export async function showOnly(page: Page, name: string): Promise<Locator> {
  await library(page).getByLabel('Search', { exact: true }).fill(name);
  const card = library(page).getByRole('button', { name, exact: true });
  await card.waitFor();
  return card;
}

/**
 * Drags with the mouse as dnd-kit needs it: press, a 10 px move in 5 steps past the activation distance,
 * 15 steps to the target, then release. Returns the rating the target showed just before the drop.
 * Also checks, just before the release, that the board has stopped scrolling under the pointer.
 */
export async function mouseDrag(page: Page, source: Locator, target: Locator, drop = true): Promise<string | null> {
  // The target goes to the middle of the board, not to its edge: held near the edge, the board scrolls by
  // itself (as a coach would want), and the cell under the pointer on release would no longer be the target.
  await target.evaluate((el) => el.scrollIntoView({ block: 'center', inline: 'center' }));
  const a = (await source.boundingBox())!;
  const t = (await target.boundingBox())!;
  await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
  await page.mouse.down();
  await page.mouse.move(a.x + a.width / 2 + 10, a.y + a.height / 2, { steps: 5 });
  await page.mouse.move(t.x + t.width / 2, t.y + t.height / 2, { steps: 15 });
  // The board may scroll under the pointer near its edge: aim again until the target is the one under it.
  for (let i = 0; i < 20 && (await target.getAttribute('data-over')) !== 'true'; i++) {
    const now = (await target.boundingBox())!;
    await page.mouse.move(now.x + now.width / 2, now.y + now.height / 2, { steps: 2 });
    await page.waitForTimeout(100);
  }
  await expect.poll(() => target.getAttribute('data-over'), { timeout: 5_000 }).toBe('true');
  await expect.poll(() => target.getAttribute('data-rating'), { timeout: 5_000 }).not.toBeNull();
  const rating = await target.getAttribute('data-rating');
  await expect.poll(() => target.getAttribute('data-over'), { timeout: 5_000 }).toBe('true');
  if (!drop) await page.keyboard.press('Escape');
  await page.mouse.up();
  return rating;
}

/**
 * Moves a keyboard drag to the cell named `label`, one arrow key at a time, steering by what dnd-kit's
 * live region announces after each key. Returns the last announcement.
 */
export async function keyboardTo(page: Page, label: string, athletes: string[]): Promise<string> {
  const slots = ['Lower max effort', 'Upper max effort'];
  const [athlete, week, slot] = label.split(' · ');
  const want = { athlete: athlete!, week: week!, slot: slot! };
  const pos = (c: { athlete: string; slot: string }) =>
    athletes.indexOf(c.athlete) * slots.length + slots.indexOf(c.slot);
  let said = await announced(page);
  let key = 'ArrowLeft';
  for (let i = 0; i < 80; i++) {
    await page.keyboard.press(key);
    let next = said;
    for (let wait = 0; wait < 20 && next === said; wait++) {
      await page.waitForTimeout(50);
      next = await announced(page);
    }
    said = next;
    const at = parse(said);
    if (!at) continue; // no announcement yet: press again
    if (at.week === want.week && at.athlete === want.athlete && at.slot === want.slot) return said;
    if (at.week !== want.week) key = at.week > want.week ? 'ArrowLeft' : 'ArrowRight';
    else key = pos(at) > pos(want) ? 'ArrowUp' : 'ArrowDown';
  }
  throw new Error(`could not reach ${label}; last heard: ${said}`);
}

function parse(text: string): { athlete: string; week: string; slot: string } | null {
  const m = /^(.+?) · (\d{4}-W\d{2}) · (.+?): /.exec(text);
  return m ? { athlete: m[1]!, week: m[2]!, slot: m[3]! } : null;
}

export async function announced(page: Page): Promise<string> {
  return page.evaluate(() => document.querySelector('[id^="DndLiveRegion"]')?.textContent ?? '');
}

/** Jumps to an athlete with the board's "Jump to athlete" list; their name must have the focus, in view. */
export async function jumpTo(page: Page, name: string): Promise<void> {
  await page
    .getByRole('search', { name: 'Athletes on the board' })
    .getByLabel('Jump to athlete')
    .selectOption({ label: name });
  await expect
    .poll(() => page.evaluate(() => document.activeElement?.closest('th')?.querySelector('span')?.textContent))
    .toBe(name);
  const box = await page.evaluate(() => {
    const r = document.activeElement!.getBoundingClientRect();
    return { top: r.top, bottom: r.bottom, height: window.innerHeight };
  });
  expect(box.top).toBeGreaterThanOrEqual(0);
  expect(box.bottom).toBeLessThanOrEqual(box.height);
}
