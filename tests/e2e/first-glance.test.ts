// The first glance of My week on a phone (375 × 812): the page the server sends a signed-in athlete already
// shows this week's picks before the app's code has run, with the same words in the same places as the app
// draws them when it takes over; and the app then shows the week without asking the server for it again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, openBrowser, type Browser } from './support/browser';

let b: Browser;

beforeAll(async () => {
  b = await openBrowser({ width: 375, height: 812 });
  // Signed in by the API, not the sign-in page: that page would start the app (and its service worker)
  // before the visit this test is about, which must reach the server as a phone's first visit does.
  const res = await b.context.request.post(`${b.baseUrl}/api/auth/login`, {
    data: { email: 'athlete@rackturn.test', password: DEMO_PASSWORD },
    headers: { origin: b.baseUrl },
  });
  expect(res.status()).toBe(200);
});
afterAll(async () => {
  await b?.close();
});

interface Drawn {
  texts: string[];
  /** Where the first pick's heading stands on the page. */
  firstPick: { x: number; y: number; width: number; height: number } | null;
}

/** The page's title line and each pick's slot, name and scheme, as a reader sees them. */
function drawn(page: Page): Promise<Drawn> {
  return page.evaluate(() => {
    const text = (el: Element | null | undefined) => el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
    const main = document.querySelector('main');
    const picks = [...(main?.querySelectorAll('section[aria-labelledby^="pick-"]') ?? [])].map((s) => {
      const header = s.querySelector('header');
      return [...(header?.children ?? [])].map(text).join(' | ');
    });
    const h1 = main?.querySelector('h1');
    const box = main?.querySelector('section[aria-labelledby^="pick-"] h2')?.getBoundingClientRect();
    return {
      texts: [text(h1), text(h1?.nextElementSibling), text(main?.querySelector('nav[aria-label="Weeks"]')), ...picks],
      firstPick: box ? { x: box.x, y: box.y, width: box.width, height: box.height } : null,
    };
  });
}

describe('the first glance of My week', () => {
  it('draws the picks before the app runs, as the app then draws them, in the same place', async () => {
    // First with the app's code held back: what the phone shows from the page alone.
    const glancePage = await b.context.newPage();
    await glancePage.route(/\/assets\/.*\.js$|\/early\.js$/, (route) => route.abort());
    const stylesheets: string[] = [];
    glancePage.on('request', (r) => {
      if (r.resourceType() === 'stylesheet') stylesheets.push(r.url());
    });
    await glancePage.goto(`${b.baseUrl}/my-week`);
    await glancePage.locator('[data-first-glance] main section h2').first().waitFor();
    const glance = await drawn(glancePage);
    // The styles came inside the page (allowed by their hash in the page's policy): no stylesheet to wait for,
    // and they apply (the app's typeface on the pick's name).
    expect(stylesheets).toEqual([]);
    expect(
      await glancePage.evaluate(() => getComputedStyle(document.querySelector('main section h2')!).fontFamily),
    ).toMatch(/Barlow/);
    await glancePage.close();
    expect(glance.texts.length).toBeGreaterThan(3);
    expect(glance.firstPick).not.toBeNull();

    // Then as it runs: the app replaces the glance with its own page.
    const requests: string[] = [];
    b.page.on('request', (r) => requests.push(new URL(r.url()).pathname + new URL(r.url()).search));
    const stream = b.page.waitForRequest((r) => new URL(r.url()).pathname === '/api/events');
    await b.page.goto(`${b.baseUrl}/my-week`);
    await b.page.waitForFunction(
      () => !document.querySelector('[data-first-glance]') && document.querySelector('main section h2'),
    );
    await b.page.getByRole('heading', { name: 'This week’s sessions' }).waitFor();
    const app = await drawn(b.page);
    expect(app.texts).toEqual(glance.texts);
    expect(app.firstPick).toEqual(glance.firstPick);
    // The app took the week from the page: it asked for neither who is signed in nor this week. (Once the
    // live stream opens it asks for the week again, as after any first read: what changed meanwhile.)
    await stream;
    const beforeStream = requests.slice(0, requests.indexOf('/api/events'));
    expect(beforeStream).toContain(`/my-week`);
    expect(beforeStream.filter((p) => p === '/api/my-week' || p === '/api/auth/me')).toEqual([]);
    expect(await b.page.locator('#rackturn-first-glance').count()).toBe(0);
    expect(b.problems).toEqual([]);
  });
});
