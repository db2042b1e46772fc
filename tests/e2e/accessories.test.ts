// The Accessories page in Chromium: adding an accessory through the form (field errors first), archiving it,
// and the week editor filling a session's accessories from the rotation; every step passes axe-core.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import mysql from 'mysql2/promise';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { ACCESSORY_CSV_COLUMNS } from '../../shared/schemas';
import { axeViolations } from './support/axe';
import { openBrowser, signInAs, type Browser } from './support/browser';

const tag = Date.now().toString(36);
let b: Browser;
let db: mysql.Connection;
let athleteId: number;

beforeAll(async () => {
  db = await mysql.createConnection({ uri: inject('e2eDatabaseUrl') });
  const [[row]] = (await db.query("SELECT id FROM athletes WHERE name = 'Noor Halvorsen'")) as unknown as [
    { id: number }[],
  ];
  athleteId = row!.id;
  b = await openBrowser({ width: 1280, height: 900 });
  await signInAs(b, 'coach2@rackturn.test');
});
afterAll(async () => {
  await b?.close();
  await db?.end();
});

describe('Accessories', () => {
  it('adds an accessory through the form, with field errors first, and archives it', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/accessories`);
    await page.getByRole('heading', { name: 'Hamstrings' }).waitFor();
    expect(await axeViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Add accessory' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add an accessory' });
    await dialog.getByLabel('Sets').fill('0');
    await dialog.getByRole('button', { name: 'Add accessory' }).click();
    await dialog.getByText('Name the exercise').waitFor();
    await dialog.getByText('At least 1 set').waitFor();
    expect(await axeViolations(page, '[role=dialog], dialog')).toEqual([]);

    const name = `Banded hamstring curl ${tag}`;
    await dialog.getByLabel('Name').fill(name);
    await dialog.getByLabel('Category').selectOption('hamstrings');
    await dialog.getByLabel('Sets').fill('3');
    await dialog.getByLabel('Reps').fill('20');
    await dialog.getByLabel('Knee').selectOption('1');
    await dialog.getByRole('button', { name: 'Add accessory' }).click();
    await page.getByText(`${name} was added.`).waitFor();
    const item = page.getByRole('listitem').filter({ hasText: name });
    await expect(item.textContent()).resolves.toMatch(/3 × 20 · Knee 1/);

    await page.getByRole('button', { name: `Archive ${name}` }).click();
    await page.getByText(`${name} was archived.`).waitFor();
    await expect.poll(() => page.getByRole('listitem').filter({ hasText: name }).count()).toBe(0);
    await page.getByLabel('Show archived').click();
    await page.getByRole('button', { name: `Bring back ${name}` }).waitFor();
  });

  it('previews a CSV import, refuses a file with a bad row, and imports a good one', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/accessories`);
    await page.getByRole('button', { name: 'Import CSV' }).click();
    const dialog = page.getByRole('dialog', { name: 'Import accessories from CSV' });
    const header = ACCESSORY_CSV_COLUMNS.join(',');
    const name = `Nordic curl ${tag}`;
    const bad = `${header}\n${name},hamstrings,0,5,,,0,0,0,0,0,2,,no\n`;
    await dialog
      .getByLabel('CSV file')
      .setInputFiles({ name: 'a.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    await dialog.getByText('Row 2, sets: At least 1 set').waitFor();
    expect(await dialog.getByRole('button', { name: 'Import' }).isDisabled()).toBe(true);
    expect(await axeViolations(page, 'dialog')).toEqual([]);
    const good = bad.replace(',0,5,', ',3,5,');
    await dialog
      .getByLabel('CSV file')
      .setInputFiles({ name: 'a.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
    await dialog.getByText('1 row ready to import.').waitFor();
    await dialog.getByRole('button', { name: 'Import' }).click();
    await page.getByText('Imported: 1 added, 0 updated, 0 unchanged.').waitFor();
    await page.getByRole('listitem').filter({ hasText: name }).waitFor();
  });

  it('fills a week’s accessories from the rotation and saves them', async () => {
    const page = b.page;
    const week = addWeeks(weekOfDate(new Date()), 3);
    await page.goto(`${b.baseUrl}/athletes/${athleteId}/weeks/${week}`);
    const form = page.getByRole('form', { name: `Training week ${week}` });
    await form.getByRole('button', { name: 'Fill accessories from the rotation' }).click();
    await form.getByText(/Accessories filled from the library/).waitFor();
    const lower = form.locator('section', { has: page.getByRole('heading', { name: /^Lower max effort/ }) });
    const picked = lower.getByLabel('Exercise', { exact: true });
    await expect.poll(() => picked.count()).toBeGreaterThan(0);
    const chosen = await picked.first().evaluate((s) => (s as HTMLSelectElement).selectedOptions[0]?.textContent ?? '');
    expect(chosen).not.toBe('Typed by hand');
    expect(await axeViolations(page)).toEqual([]);
    await form.getByRole('button', { name: 'Save the week' }).click();
    await form.getByText('Week saved.').waitFor();
    const [[row]] = (await db.query('SELECT work FROM athlete_weeks WHERE athlete_id = ? AND week = ?', [
      athleteId,
      week,
    ])) as unknown as [
      { work: string | Record<string, { accessories: { accessoryId: number | null; name: string }[] }> }[],
    ];
    const work = typeof row!.work === 'string' ? JSON.parse(row!.work) : row!.work;
    const first = work['lower-me'].accessories[0];
    expect(first.accessoryId).toEqual(expect.any(Number));
    expect(first.name).toBe(chosen.replace(' (archived)', ''));
  });
});
