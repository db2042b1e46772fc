// Messages end to end: the athlete asks a question from My week on a phone, a coach sees it among the
// notices and answers from the board cell's details with a link to that cell, the athlete reads the
// answer, and the link opens the cell on the Board. Each screen on the way has no axe-core violations.
// Then live updates: the athlete's open My week shows the coach's next reply, and a pick the coach swaps on
// the published week, without a reload.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import mysql from 'mysql2/promise';
import { request } from 'playwright-core';
import { weekOfDate } from '../../shared/engine/weeks';
import { axeViolations } from './support/axe';
import { DEMO_PASSWORD, openBrowser, signInAs, type Browser } from './support/browser';

const thisWeek = weekOfDate(new Date());
let athlete: Browser;
let coach: Browser;
let db: mysql.Connection;
let noorId: number;
let slotId: string;
const question = `Elbow is cranky today (${Date.now().toString(36)}): can I swap the press for something kinder?`;
const answer = 'Yes: take the board press in this slot instead, and stop if it hurts.';

beforeAll(async () => {
  db = await mysql.createConnection({ uri: inject('e2eDatabaseUrl') });
  const [[noor]] = (await db.query("SELECT id FROM athletes WHERE name = 'Noor Halvorsen'")) as unknown as [
    { id: number }[],
  ];
  noorId = noor!.id;
  const [[entry]] = (await db.query(
    'SELECT slot_id AS slotId FROM plan_entries WHERE athlete_id = ? AND week = ? ORDER BY slot_id LIMIT 1',
    [noorId, thisWeek],
  )) as unknown as [{ slotId: string }[]];
  slotId = entry!.slotId;
  athlete = await openBrowser({ width: 375, height: 812 });
  coach = await openBrowser();
});
afterAll(async () => {
  await athlete?.close();
  await coach?.close();
  await db?.end();
});

describe('messages between an athlete and the coaches', () => {
  it('the athlete asks from My week on a phone', async () => {
    await signInAs(athlete, 'athlete@rackturn.test');
    await athlete.page.waitForURL(/\/my-week$/);
    const thread = athlete.page.getByRole('region', { name: /^Messages/ });
    const box = thread.getByLabel('Message to your coaches');
    // An empty message is refused on the spot, with the reason beside the field.
    await thread.getByRole('button', { name: 'Send' }).click();
    await thread.getByText('Write a message').waitFor();
    await box.fill(question);
    await thread.getByRole('button', { name: 'Send' }).click();
    await thread.getByRole('listitem').filter({ hasText: question }).waitFor();
    await expect(box.inputValue()).resolves.toBe('');
    expect(await athlete.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
    expect(await axeViolations(athlete.page)).toEqual([]);
  });

  it("a coach answers from the board cell's details, linking the cell", async () => {
    await signInAs(coach, 'coach@rackturn.test');
    // The question is a notice in the top bar: a button with the unread count in its name, a list.
    const bell = coach.page.getByRole('button', { name: /^Notices [1-9]\d* unread$/ });
    await bell.click();
    const notice = coach.page.getByRole('list', { name: 'Notices' }).getByRole('link', { name: /Elbow is cranky/ });
    await notice.waitFor();
    expect((await axeViolations(coach.page)).join('\n')).toBe('');
    await coach.page.keyboard.press('Escape');
    await expect(bell.evaluate((el) => el === document.activeElement)).resolves.toBe(true);
    await coach.page.goto(`${coach.baseUrl}/board?athlete=${noorId}&week=${thisWeek}&slot=${slotId}`);
    const dialog = coach.page.getByRole('dialog');
    const thread = dialog.getByRole('region', { name: /^Messages this week/ });
    await thread.getByRole('listitem').filter({ hasText: question }).waitFor();
    expect(await thread.getByRole('checkbox', { name: /^Link this cell/ }).isChecked()).toBe(true);
    await thread.getByLabel('Reply').fill(answer);
    await thread.getByRole('button', { name: 'Send' }).click();
    // Newest first on the coach's side: the answer sits above the question.
    await thread.getByRole('listitem').filter({ hasText: answer }).waitFor();
    const texts = await thread.getByRole('listitem').allTextContents();
    expect(texts.findIndex((t) => t.includes(answer))).toBeLessThan(texts.findIndex((t) => t.includes(question)));
    expect(await axeViolations(coach.page)).toEqual([]);
  });

  it('the athlete reads the answer, with the linked slot one tap away', async () => {
    await athlete.page.reload();
    const thread = athlete.page.getByRole('region', { name: /^Messages/ });
    const reply = thread.getByRole('listitem').filter({ hasText: answer });
    await reply.waitFor();
    await expect(reply.getByRole('link', { name: new RegExp(`in ${thisWeek}$`) }).isVisible()).resolves.toBe(true);
    expect(await axeViolations(athlete.page)).toEqual([]);
  });

  it("the link in the athlete's page thread opens the cell on the Board", async () => {
    await coach.page.goto(`${coach.baseUrl}/athletes/${noorId}`);
    const thread = coach.page.getByRole('region', { name: /^Messages/ });
    const reply = thread.getByRole('listitem').filter({ hasText: answer });
    await reply.getByRole('link', { name: /on the Board$/ }).click();
    await coach.page.waitForURL(/\/board\?/);
    await coach.page
      .getByRole('dialog')
      .getByRole('region', { name: /^Messages this week/ })
      .waitFor();
    expect(await axeViolations(coach.page)).toEqual([]);
    expect(athlete.problems).toEqual([]);
    expect(coach.problems).toEqual([]);
  });

  it("the athlete's open My week shows a coach's reply without a reload", async () => {
    const page = athlete.page;
    await page.goto(`${athlete.baseUrl}/my-week`);
    const thread = page.getByRole('region', { name: /^Messages/ });
    await thread.getByRole('listitem').first().waitFor();
    // A mark on the window: a reload would wipe it.
    await page.evaluate(() => ((window as unknown as { liveMark: number }).liveMark = 1));

    const api = await request.newContext({ baseURL: athlete.baseUrl, extraHTTPHeaders: { Origin: athlete.baseUrl } });
    try {
      expect(
        (await api.post('/api/auth/login', { data: { email: 'coach@rackturn.test', password: DEMO_PASSWORD } })).ok(),
      ).toBe(true);
      const later = 'Live: add two back-off singles after the top set.';
      const sent = await api.post(`/api/messages/threads/${noorId}/${thisWeek}`, { data: { body: later } });
      expect(sent.status()).toBe(201);
      await thread.getByRole('listitem').filter({ hasText: later }).waitFor({ timeout: 15_000 });

      expect(await page.evaluate(() => (window as unknown as { liveMark?: number }).liveMark)).toBe(1);
    } finally {
      await api.dispose();
    }
    expect(athlete.problems).toEqual([]);
  });

  it("the athlete's open My week shows a pick the coach swaps, without a reload", async () => {
    const page = athlete.page;
    await page.goto(`${athlete.baseUrl}/my-week`);
    const [[cell]] = (await db.query(
      `SELECT pe.version, pe.variant_id AS variantId, pe.source, pe.pinned, v.name FROM plan_entries pe
         JOIN variants v ON v.id = pe.variant_id WHERE pe.athlete_id = ? AND pe.week = ? AND pe.slot_id = ?`,
      [noorId, thisWeek, slotId],
    )) as unknown as [{ version: number; variantId: number; source: string; pinned: number; name: string }[]];
    const main = page.getByRole('main');
    await main.getByText(cell!.name, { exact: true }).first().waitFor();
    await page.evaluate(() => ((window as unknown as { liveMark: number }).liveMark = 2));

    const api = await request.newContext({ baseURL: athlete.baseUrl, extraHTTPHeaders: { Origin: athlete.baseUrl } });
    let version = cell!.version;
    try {
      expect(
        (await api.post('/api/auth/login', { data: { email: 'coach@rackturn.test', password: DEMO_PASSWORD } })).ok(),
      ).toBe(true);
      // A variant the server says fits this cell (the demo's history moves with the date).
      const fits = (await (await api.get(`/api/plans/${noorId}/${thisWeek}/${slotId}/alternatives`)).json()) as {
        items: { variantId: number; name: string; status: string; current: boolean }[];
      };
      const swap = fits.items.find((i) => i.status !== 'break' && !i.current);
      expect(swap).toBeDefined();
      const saved = await api.put(`/api/plans/${noorId}/${thisWeek}/${slotId}`, {
        data: { variantId: swap!.variantId, version, reason: 'Elbow: a kinder press this week' },
      });
      expect(saved.status(), await saved.text()).toBe(200);
      version += 1;
      await main.getByText(swap!.name, { exact: true }).first().waitFor({ timeout: 15_000 });
      await expect(main.getByText(cell!.name, { exact: true }).count()).resolves.toBe(0);
      expect(await page.evaluate(() => (window as unknown as { liveMark?: number }).liveMark)).toBe(2);
    } finally {
      // The week goes back as it was, for the tests after this one.
      const back = await api.put(`/api/plans/${noorId}/${thisWeek}/${slotId}`, {
        data: { variantId: cell!.variantId, version, source: cell!.source, pinned: Boolean(cell!.pinned) },
      });
      await api.dispose();
      expect(back.status()).toBe(200);
    }
    expect(athlete.problems).toEqual([]);
  });
});
