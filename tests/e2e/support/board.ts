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
  const names = await library(page)
    .getByRole('button')
    .evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
  await library(page).getByLabel('Lift', { exact: true }).selectOption({ label: 'Any' });
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
 */
export async function mouseDrag(page: Page, source: Locator, target: Locator, drop = true): Promise<string | null> {
  await target.scrollIntoViewIfNeeded();
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
  if (!drop) await page.keyboard.press('Escape');
  await page.mouse.up();
  return rating;
}
