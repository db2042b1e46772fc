// Planning facts in Chromium: a dated emphasis restriction added and edited on the Athlete page (with the
// form's field errors and the weeks it covers), and a rest week marked and unmarked on the Board. Each
// test puts the demo back as it was.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addWeeks, mondayOf, weekOfDate } from '../../shared/engine/weeks';
import { openBrowser, signInAs, type Browser } from './support/browser';

const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);
const day = (week: string, offset = 0) =>
  new Date(mondayOf(week).getTime() + offset * 86_400_000).toISOString().slice(0, 10);

let b: Browser;
beforeAll(async () => {
  b = await openBrowser({ width: 1500, height: 2400 });
  await signInAs(b, 'coach2@rackturn.test');
});
afterAll(async () => {
  await b?.close();
});

describe('planning facts on the Athlete page and the Board', () => {
  it('adds a dated emphasis restriction, refuses one that restricts nothing, edits it and removes it', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/roster`);
    await page
      .getByRole('table', { name: 'Athletes of the team' })
      .getByRole('link', { name: 'Lucia Ferrante' })
      .click();
    await page.waitForURL(/\/athletes\/\d+$/);
    const panel = page.getByRole('region', { name: 'Restrictions' });
    await panel.getByRole('button', { name: 'Add restriction' }).click();
    const form = panel.getByRole('form', { name: 'New restriction' });

    // Nothing restricted: the form says which field to fix and saves nothing.
    await form.getByLabel('Joint').selectOption('');
    await form.getByLabel('Highest stress allowed').selectOption('');
    await form.getByRole('button', { name: 'Add restriction' }).click();
    await form.getByText('Restrict a joint, an emphasis or a family').waitFor();

    await form.getByRole('checkbox', { name: 'Lockout' }).check();
    await form.getByLabel('From').fill(day(wk(3), 2));
    await form.getByLabel('To (optional)').fill(day(wk(6), 3));
    await form.getByText(`Applies to weeks ${wk(3)} to ${wk(6)}.`).waitFor();
    await form.getByLabel('Note').fill('Sore forearm: no heavy lockout work for a month');
    await form.getByRole('button', { name: 'Add restriction' }).click();
    await panel.getByText('No lockout work').waitFor();
    await panel.getByText(`Weeks ${wk(3)} to ${wk(6)}`).waitFor();

    // Edit: a week later, and mid-range work out too; an end before the start is refused first.
    await panel.getByRole('button', { name: 'Edit lockout restriction' }).click();
    const edit = panel.getByRole('form', { name: 'Edit restriction' });
    await edit.getByLabel('To (optional)').fill(day(wk(2)));
    await edit.getByRole('button', { name: 'Save restriction' }).click();
    await edit.getByText('The end cannot be before the start').waitFor();
    await edit.getByLabel('To (optional)').fill(day(wk(7), 3));
    await edit.getByRole('checkbox', { name: 'Mid-range' }).check();
    await edit.getByRole('button', { name: 'Save restriction' }).click();
    await panel.getByText('No lockout or mid-range work').waitFor();
    await panel.getByText(`Weeks ${wk(3)} to ${wk(7)}`).waitFor();

    await page.reload();
    await panel.getByText(`Weeks ${wk(3)} to ${wk(7)}`).waitFor();
    await panel.getByRole('button', { name: 'Remove lockout and mid-range restriction' }).click();
    await panel.getByRole('button', { name: 'Confirm remove' }).click();
    await expect.poll(() => panel.getByText('No lockout or mid-range work').count()).toBe(0);
  });

  it('marks an athlete’s week as a rest week on the Board, keeps it after reload, and undoes it', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/board`);
    await page.getByRole('table').waitFor();
    const week = wk(1);
    await page.getByRole('button', { name: `Finn Castellane · ${week}: make it a rest week` }).click();
    const undo = page.getByRole('button', { name: `Finn Castellane · ${week}: back to a training week` });
    await undo.waitFor();
    await expect(page.locator(`[data-rest-week="${week}"]`).first().textContent()).resolves.toContain('Rest week');

    await page.reload();
    await undo.waitFor();
    await undo.click();
    await page.getByRole('button', { name: `Finn Castellane · ${week}: make it a rest week` }).waitFor();
  });
});
