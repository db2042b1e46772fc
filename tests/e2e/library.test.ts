// The Library page in Chromium: adding a variant through the form and finding it by search, and a
// CSV import with one bad row that shows the row's problem and imports nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { LIBRARY_CSV_COLUMNS } from '../../shared/schemas';
import { openBrowser, signInAs, type Browser } from './support/browser';

let b: Browser;
const tag = Date.now().toString(36);
const dir = mkdtempSync(join(tmpdir(), 'rackturn-csv-'));

beforeAll(async () => {
  b = await openBrowser();
  await signInAs(b, 'coach2@rackturn.test');
});
afterAll(async () => {
  await b?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('Library', () => {
  it('adds a variant through the form, with field errors first, and finds it by search', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/library`);
    await page.getByRole('button', { name: 'Add variant' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a variant' });
    // Saving an empty form shows the schema's messages under the fields.
    await dialog.getByRole('button', { name: 'Add variant' }).click();
    await expect(dialog.getByText('Give the variant a name').isVisible()).resolves.toBe(true);
    await expect(dialog.getByText('Name the family it belongs to').isVisible()).resolves.toBe(true);

    const name = `Spoto press, 2-count ${tag}`;
    await dialog.getByLabel('Name').fill(name);
    await dialog.getByLabel('Lift').selectOption('bench');
    await dialog.getByLabel('Family').fill('spoto press');
    await dialog.getByLabel('Emphasis').selectOption('midRange');
    await dialog.getByLabel('Risk').selectOption('2');
    await dialog.getByLabel('Specificity').fill('0.85');
    await dialog.getByLabel('Shoulder').selectOption('2');
    await dialog.getByLabel('Elbow').selectOption('1');
    await dialog.getByRole('radio', { name: 'Triple' }).check();
    await dialog.getByLabel('Notes').fill('Stop an inch above the chest, hold for two.');
    await dialog.getByRole('button', { name: 'Add variant' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `${name} was added.` })
      .waitFor();

    await page.getByLabel('Search').fill('spoto');
    await page.waitForURL(/q=spoto/);
    const rows = page.getByRole('table', { name: 'Variants of the library' }).getByRole('row');
    await rows.filter({ hasText: name }).waitFor();
    // Header row and the new variant only, once the filtered list has come (the new variant shows in the
    // unfiltered one too, so the wait above passes before it).
    await expect.poll(() => rows.count(), { timeout: 10_000 }).toBe(2);
    const row = rows.filter({ hasText: name });
    await expect(row.textContent()).resolves.toMatch(/Bench.*spoto press.*2 · moderate.*0\.85/);
    await expect(row.getByText('Shoulder 2, elbow 1').count()).resolves.toBe(1);

    // The search survives a reload: it lives in the URL.
    await page.reload();
    await rows.filter({ hasText: name }).waitFor();
    await expect(page.getByLabel('Search').inputValue()).resolves.toBe('spoto');
  });

  it('previews a CSV, refuses it for one bad row with that row’s problem, and imports nothing', async () => {
    const page = b.page;
    const mark = `csv${tag}`;
    const good = `Cambered bar good morning ${mark}`;
    const other = `Deficit pull 4 cm ${mark}`;
    const csv = [
      LIBRARY_CSV_COLUMNS.join(','),
      `${good},squat,good morning,cambered,cambered bar,midRange,0,0,0,3,2,0,3,0.2,five,,no`,
      `Bad row ${mark},deadlift,deficit pull,straight,deficit platform,sideways,0,0,0,2,2,1,2,0.7,single,,no`,
      `${other},deadlift,deficit pull,straight,deficit platform,bottom,0,0,0,2,2,1,2,0.7,single,,no`,
    ].join('\n');
    const file = join(dir, 'library.csv');
    writeFileSync(file, csv);

    await page.goto(`${b.baseUrl}/library`);
    await page.getByRole('button', { name: 'Import CSV' }).click();
    const dialog = page.getByRole('dialog', { name: 'Import variants from CSV' });
    await dialog.getByLabel('CSV file').setInputFiles(file);
    await dialog.getByText('3 rows read: 2 ready, 1 with problems.').waitFor();
    await dialog.getByRole('button', { name: 'Import 3 rows' }).click();

    const refusal = dialog.getByRole('alert').filter({ hasText: 'Nothing was imported' });
    await refusal.waitFor();
    await expect(refusal.textContent()).resolves.toContain('Nothing was imported: 1 row needs fixing.');
    const bad = dialog.getByRole('row').filter({ hasText: `Bad row ${mark}` });
    await expect(bad.textContent()).resolves.toContain('emphasis: Use bottom, mid-range or lockout');
    await expect(bad.getByText('3', { exact: true }).count()).resolves.toBe(1);
    await dialog.getByRole('button', { name: 'Cancel' }).click();

    // Neither good row arrived.
    await page.getByLabel('Search').fill(mark);
    await page.waitForURL(new RegExp(`q=${mark}`));
    await page.getByText(/No variants$/).waitFor();
    const table = page.getByRole('table', { name: 'Variants of the library' });
    await expect(table.getByText(good).count()).resolves.toBe(0);
    await expect(table.getByText(other).count()).resolves.toBe(0);
  });

  it('raised no console errors', () => {
    // The refused import answers 422, which the browser logs as a failed request.
    expect(b.problems.filter((p) => !p.includes('422'))).toEqual([]);
  });
});
