// The Roster and Athlete pages in Chromium: from the roster to an athlete, a restriction added, kept
// after reload and shown on the roster, then removed again so the demo stays as it was.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, signInAs, type Browser } from './support/browser';

let b: Browser;
beforeAll(async () => {
  b = await openBrowser();
  await signInAs(b, 'coach2@rackturn.test');
});
afterAll(async () => {
  await b?.close();
});

describe('Roster and Athlete', () => {
  it('adds a restriction on an athlete’s page, keeps it after reload, and removes it', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/roster`);
    const table = page.getByRole('table', { name: 'Athletes of the team' });
    // The demo's restricted athletes show their restriction on the roster.
    await expect(table.getByRole('row').filter({ hasText: 'Dario Menditto' }).textContent()).resolves.toContain(
      'Elbow: light load only (≤ 1)',
    );
    await table.getByRole('link', { name: 'Priya Ramaswell' }).click();
    await page.waitForURL(/\/athletes\/\d+$/);
    // The page heading, not the review section's "Review: …" heading that loads beside it.
    await page.getByRole('heading', { level: 1, name: 'Priya Ramaswell', exact: true }).waitFor();

    const panel = page.getByRole('region', { name: 'Restrictions' });
    await panel.getByRole('button', { name: 'Add restriction' }).click();
    const form = panel.getByRole('form', { name: 'New restriction' });
    await form.getByLabel('Joint').selectOption('knee');
    await form.getByLabel('Highest stress allowed').selectOption('1');
    await form.getByLabel('Note').fill('Patellar tendon grumpy after the last block');
    await form.getByRole('button', { name: 'Add restriction' }).click();
    await panel.getByText('Knee: light load only (≤ 1)').waitFor();

    await page.reload();
    await panel.getByText('Knee: light load only (≤ 1)').waitFor();
    await expect(panel.getByText('In force').count()).resolves.toBe(1);
    await page.goto(`${b.baseUrl}/roster`);
    await expect(table.getByRole('row').filter({ hasText: 'Priya Ramaswell' }).textContent()).resolves.toContain(
      'Knee: light load only (≤ 1)',
    );

    await table.getByRole('link', { name: 'Priya Ramaswell' }).click();
    await panel.getByRole('button', { name: 'Remove knee restriction' }).click();
    await panel.getByRole('button', { name: 'Confirm remove' }).click();
    await panel.getByText('None: the board may load every joint').waitFor();
  });

  it('shows the athlete’s history of picks and results', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/roster`);
    await page.getByRole('link', { name: 'Jonas Eberle' }).click();
    const history = page.getByRole('region', { name: 'History of picks and results' });
    await history.getByRole('table').waitFor();
    // Twelve weeks of demo history, two slots a week, and this week planned.
    await expect.poll(() => history.getByRole('row').count()).toBeGreaterThan(20);
  });

  it('raised no console errors', () => {
    expect(b.problems).toEqual([]);
  });
});
