// The Rules page in Chromium: the head coach changes a rule, sees the sentence beside it follow, saves,
// and finds it after a reload. The demo's rules are put back afterwards.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, signInAs, type Browser } from './support/browser';

let b: Browser;
let original: { rules: unknown; equipment: string[] } | null = null;

beforeAll(async () => {
  b = await openBrowser();
  await signInAs(b, 'coach@rackturn.test');
  const res = await b.page.request.get(`${b.baseUrl}/api/rules`);
  original = await res.json();
});
afterAll(async () => {
  if (original) {
    // Back to the demo's rules, whatever version the test left behind.
    const now = await (await b.page.request.get(`${b.baseUrl}/api/rules`)).json();
    await b.page.request.put(`${b.baseUrl}/api/rules`, {
      data: { rules: original.rules, equipment: original.equipment, version: now.version },
      headers: { Origin: b.baseUrl },
    });
  }
  await b?.close();
});

describe('Rules', () => {
  it('saves a changed rule and shows it after reload', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/rules`);
    const field = page.getByLabel('Same family again after (weeks)');
    const before = Number(await field.inputValue());
    const next = before === 3 ? 4 : 3;
    await field.fill(String(next));
    // The sentence beside the field follows the value as it is typed.
    await page.getByText(`never fall within ${next} weeks in a row`).waitFor();

    await page.getByLabel('Add equipment').fill('sled');
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    await page.getByRole('button', { name: 'Save rules' }).click();
    await page.getByText('The rules are saved.').waitFor();

    await page.reload();
    await expect(page.getByLabel('Same family again after (weeks)').inputValue()).resolves.toBe(String(next));
    await expect(
      page.getByRole('list', { name: 'Equipment the gym has' }).getByText('sled', { exact: true }).count(),
    ).resolves.toBe(1);
  });

  it('saves the accessory block length and finds it after reload; a window shorter than a block is refused', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/rules`);
    const block = page.getByLabel('Accessories change every (weeks)');
    const before = Number(await block.inputValue());
    const next = before === 4 ? 2 : 4;
    await block.fill(String(next));
    await page.getByText(`The same accessories for ${next} weeks, then the next ones.`).waitFor();
    const repeat = page.getByLabel('Same accessory again after (weeks)');
    await repeat.fill('1');
    await page.getByRole('button', { name: 'Save rules' }).click();
    await page.getByText(`At least one block (${next} weeks)`).first().waitFor();
    await repeat.fill('6');
    await page.getByLabel('Back-off sets after the top set').fill('3');
    await page.getByRole('button', { name: 'Save rules' }).click();
    await page.getByText('The rules are saved.').waitFor();
    await page.reload();
    await expect(page.getByLabel('Accessories change every (weeks)').inputValue()).resolves.toBe(String(next));
    await expect(page.getByLabel('Back-off sets after the top set').inputValue()).resolves.toBe('3');
  });

  it('marks an invalid value on its field and saves nothing', async () => {
    const page = b.page;
    await page.goto(`${b.baseUrl}/rules`);
    await page.getByLabel('Same variant again after (weeks)').fill('0');
    await page.getByRole('button', { name: 'Save rules' }).click();
    await page.getByText('At least 1 week').waitFor();
    await page.reload();
    await expect(page.getByLabel('Same variant again after (weeks)').inputValue()).resolves.not.toBe('0');
  });

  it('is not offered to a coach', async () => {
    const other = await b.context.newPage();
    await signInAs(b, 'coach2@rackturn.test', undefined, other);
    await other.goto(`${b.baseUrl}/rules`);
    await other.waitForURL(/\/board$/);
    await other.close();
    // Signing in on another page switched this context's session: sign back in as head coach.
    await signInAs(b, 'coach@rackturn.test');
  });

  it('raised no console errors', () => {
    expect(b.problems).toEqual([]);
  });
});
