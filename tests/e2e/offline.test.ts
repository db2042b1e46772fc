// My week without signal, on a phone (375 × 812): the service worker keeps the app and the athlete's
// current and next week; offline, My week opens from that copy with an "Offline — last updated" line, a
// top set logged then waits on the phone (kept across a reload) and is sent once when the phone is back
// online, and the coach sees it exactly once; back-off sets ticked offline wait as one write and are sent
// too. Signing out empties the offline copy of the week.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import mysql from 'mysql2/promise';
import { request } from 'playwright-core';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { axeViolations } from './support/axe';
import { DEMO_PASSWORD, openBrowser, signInAs, type Browser } from './support/browser';

const thisWeek = weekOfDate(new Date());
const note = `Logged in the basement ${Date.now()}`;
let b: Browser;
let db: mysql.Connection;
let noorId: number;
let pickName: string;

beforeAll(async () => {
  db = await mysql.createConnection({ uri: inject('e2eDatabaseUrl') });
  const [[noor]] = (await db.query("SELECT id FROM athletes WHERE name = 'Noor Halvorsen'")) as unknown as [
    { id: number }[],
  ];
  noorId = noor!.id;
  const [[pick]] = (await db.query(
    `SELECT v.name FROM plan_entries p JOIN variants v ON v.id = p.variant_id
      WHERE p.athlete_id = ? AND p.week = ? ORDER BY p.slot_id LIMIT 1`,
    [noorId, thisWeek],
  )) as unknown as [{ name: string }[]];
  pickName = pick!.name;
  b = await openBrowser({ width: 375, height: 812 });
});
afterAll(async () => {
  await b?.context.setOffline(false);
  await b?.close();
  await db?.end();
});

/** The coach's view of Noor's top sets carrying this test's note, through the API. */
async function coachSeesLogged(): Promise<{ id: number; weightKg: number; reps: number }[]> {
  const coach = await request.newContext({ baseURL: b.baseUrl });
  try {
    await coach.post('/api/auth/login', { data: { email: 'coach@rackturn.test', password: DEMO_PASSWORD } });
    const res = await coach.get(`/api/top-sets?athleteId=${noorId}&limit=50`);
    expect(res.ok()).toBe(true);
    const body = (await res.json()) as { items: { id: number; weightKg: number; reps: number; note: string | null }[] };
    return body.items.filter((s) => s.note === note);
  } finally {
    await coach.dispose();
  }
}

describe('My week without signal', () => {
  it('keeps the app and this and next week on the phone once the service worker runs', async () => {
    await signInAs(b, 'athlete@rackturn.test');
    await b.page.waitForURL(/\/my-week$/);
    await b.page.getByRole('heading', { name: pickName, exact: true }).waitFor();
    // The worker registers after the page has loaded, takes the page over, and keeps the app's files.
    await b.page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
    // Read again through the worker: the week (and next week, read ahead by the page) is kept.
    await b.page.reload();
    await b.page.getByRole('heading', { name: pickName, exact: true }).waitFor();
    await expect
      .poll(
        () =>
          b.page.evaluate(async () => {
            const cache = await caches.open('rackturn-my-week');
            return (await cache.keys()).map((r) => new URL(r.url).pathname + new URL(r.url).search).sort();
          }),
        { timeout: 15_000 },
      )
      .toEqual(['/api/auth/me', '/api/my-week', `/api/my-week?week=${addWeeks(thisWeek, 1)}`]);
    // Installable: the page names a manifest with the app's name and icons.
    const manifest = await b.page.evaluate(async () => {
      const href = document.querySelector('link[rel="manifest"]')?.getAttribute('href');
      return href ? ((await (await fetch(href)).json()) as { name: string; icons: { sizes: string }[] }) : null;
    });
    expect(manifest?.name).toBe('Rackturn');
    expect(manifest?.icons.map((i) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']));
  });

  it('opens My week offline from the phone’s copy, with when it was last updated', async () => {
    await b.context.setOffline(true);
    await b.page.reload();
    await b.page.getByRole('heading', { name: pickName, exact: true }).waitFor();
    const line = b.page.getByTestId('offline-line');
    await expect(line.textContent()).resolves.toMatch(/^Offline — last updated \w{3} \d{1,2} \w{3}, \d{2}:\d{2}$/);
    expect(await axeViolations(b.page)).toEqual([]);
    // Next week was kept too.
    await b.page.getByRole('link', { name: 'Next week →' }).click();
    await b.page.waitForURL(new RegExp(`week=${addWeeks(thisWeek, 1)}$`));
    // The page's subtitle names the week shown.
    await b.page.getByText(new RegExp(`^${addWeeks(thisWeek, 1)} · `)).waitFor();
    await expect(b.page.getByTestId('offline-line').isVisible()).resolves.toBe(true);
    await b.page.getByRole('link', { name: 'This week' }).click();
    await b.page.getByRole('heading', { name: pickName, exact: true }).waitFor();
  });

  it('keeps a top set logged offline, across a reload, and sends it once when back online', async () => {
    const card = b.page.locator('section', { has: b.page.getByRole('heading', { name: pickName, exact: true }) });
    await card.getByRole('button', { name: 'Open the log form' }).click();
    const form = card.getByRole('form', { name: `Log top set: ${pickName}` });
    await form.getByLabel('Weight (kg)').fill('61');
    await form.getByLabel('Reps').fill('3');
    await form.getByLabel('Note (optional)').fill(note);
    await form.getByRole('button', { name: 'Log top set' }).click();
    await card.getByText(/No signal: the top set is kept on this phone/).waitFor();
    const waiting = b.page.getByRole('region', { name: 'Waiting to send' });
    await expect(waiting.getByText(`Top set: ${pickName}, 3 × 61 kg`).isVisible()).resolves.toBe(true);
    await expect(waiting.getByText(/^Waiting to send · logged/).isVisible()).resolves.toBe(true);
    expect(await axeViolations(b.page)).toEqual([]);
    await b.page.screenshot({ path: '.tmp/e2e-my-week-offline-375.png', fullPage: true });
    expect(await coachSeesLogged()).toEqual([]);

    // Still there after a reload without signal: it lives in the phone's storage.
    await b.page.reload();
    await waiting.getByText(`Top set: ${pickName}, 3 × 61 kg`).waitFor();

    await b.context.setOffline(false);
    await waiting.waitFor({ state: 'detached', timeout: 20_000 });
    await expect(b.page.getByTestId('offline-line').count()).resolves.toBe(0);
    const seen = await coachSeesLogged();
    expect(seen).toHaveLength(1);
    expect(seen[0]).toMatchObject({ weightKg: 61, reps: 3 });

    // Going offline and back again, and reloading, sends nothing more.
    await b.context.setOffline(true);
    await b.context.setOffline(false);
    await b.page.reload();
    await b.page.getByRole('heading', { name: pickName, exact: true }).waitFor();
    expect(await coachSeesLogged()).toHaveLength(1);
    expect(b.problems.filter((p) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource/.test(p))).toEqual([]);
  });

  it('keeps back-off ticks made offline as one waiting write and sends them when back online', async () => {
    const card = b.page.locator('section', { has: b.page.getByRole('heading', { name: pickName, exact: true }) });
    const ticks = card.getByRole('group', { name: 'Back-off sets' }).getByRole('checkbox');
    expect(await ticks.count()).toBe(2);
    const before = [await ticks.nth(0).isChecked(), await ticks.nth(1).isChecked()];
    const after = before.map((v) => !v);
    await b.context.setOffline(true);
    await ticks.nth(0).setChecked(after[0]!);
    await card.getByText(/^No signal: kept on this phone/).waitFor();
    await ticks.nth(1).setChecked(after[1]!);
    // Two ticks made without signal wait as one write, the later over the earlier.
    const waiting = b.page.getByRole('region', { name: 'Waiting to send' });
    const label = `Back-off sets: ${pickName}, ${after.filter(Boolean).length} of 2 done`;
    await waiting.getByText(label).waitFor();
    await expect(waiting.getByText(/^Back-off sets: /).count()).resolves.toBe(1);
    expect(await axeViolations(b.page)).toEqual([]);

    await b.context.setOffline(false);
    await waiting.waitFor({ state: 'detached', timeout: 20_000 });
    const coach = await request.newContext({ baseURL: b.baseUrl });
    try {
      await coach.post('/api/auth/login', { data: { email: 'coach@rackturn.test', password: DEMO_PASSWORD } });
      const week = (await (await coach.get(`/api/athletes/${noorId}/weeks/${thisWeek}`)).json()) as {
        logs: { sessionId: string; backOffDone: boolean[] }[];
      };
      expect(week.logs.find((l) => l.sessionId === 'lower-me')?.backOffDone).toEqual(after);
    } finally {
      await coach.dispose();
    }
  });

  it('empties the offline copy of the week when the athlete signs out', async () => {
    await b.page
      .getByRole('button', { name: /sign out/i })
      .first()
      .click();
    await b.page.waitForURL(/\/sign-in/);
    await expect
      .poll(() => b.page.evaluate(async () => (await (await caches.open('rackturn-my-week')).keys()).length))
      .toBe(0);
  });
});
