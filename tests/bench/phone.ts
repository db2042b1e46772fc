// Phone benchmark: the demo athlete opens My week in Debian's Chromium as on a phone (signed in, cold cache,
// 150 ms latency, 1.6 Mbit/s down, CPU slowed 4× through the DevTools protocol); the time from navigation
// to this week's first pick in the page and on screen (painted), with the bytes and requests it took.
// Median of five fresh profiles.
import { mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { chromium } from 'playwright-core';
import { signIn, type SpeedStack } from './speed-stack';

const RUNS = 5;
const PROFILE = { latencyMs: 150, downKbit: 1600, upKbit: 750, cpuSlowdown: 4, width: 375, height: 740 };

interface Run {
  /** When the pick's heading was in the page. */
  pickMs: number;
  /** When it was painted (null when the browser did not report it). */
  pickPaintMs: number | null;
  bytes: number;
  requests: number;
  /** When the week's data request started, ms after navigation. */
  myWeekRequestMs: number | null;
}

async function openOnce(stack: SpeedStack, cookie: string, pickName: string): Promise<Run> {
  const profile = mkdtempSync(join(tmpdir(), 'rackturn-phone-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: PROFILE.width, height: PROFILE.height },
    isMobile: true,
    hasTouch: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run'],
  });
  try {
    const host = new URL(stack.origin).hostname;
    await context.addCookies(
      cookie.split('; ').map((c) => {
        const eq = c.indexOf('=');
        return { name: c.slice(0, eq), value: c.slice(eq + 1), domain: host, path: '/' };
      }),
    );
    const page = context.pages()[0] ?? (await context.newPage());
    // Watches for the pick's heading from the first byte of the document, in page time.
    // A plain string: functions handed to the page must not carry the bundler's name helpers.
    // The heading in the page is not yet the heading on screen (the style sheet holds the first paint back):
    // the element timing of the heading says when it was painted (Chromium's Element Timing API).
    await page.addInitScript(`(() => {
      const name = ${JSON.stringify(pickName)};
      new PerformanceObserver((list) => {
        for (const e of list.getEntries())
          if (e.identifier === 'pick' && window.__pickPaintAt === undefined) window.__pickPaintAt = e.renderTime || e.loadTime;
      }).observe({ type: 'element', buffered: true });
      new MutationObserver(() => {
        if (window.__pickAt !== undefined) return;
        const h = [...document.querySelectorAll('h2')].find((h) => h.textContent === name);
        if (!h) return;
        window.__pickAt = performance.now();
        h.setAttribute('elementtiming', 'pick');
      }).observe(document, { childList: true, subtree: true, characterData: true });
    })()`);
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.clearBrowserCache');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: PROFILE.latencyMs,
      downloadThroughput: (PROFILE.downKbit * 1000) / 8,
      uploadThroughput: (PROFILE.upKbit * 1000) / 8,
    });
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: PROFILE.cpuSlowdown });
    let bytes = 0;
    let requests = 0;
    let startWall: number | null = null;
    let myWeekWall: number | null = null;
    const timeline: string[] = [];
    const urls = new Map<string, string>();
    cdp.on('Network.requestWillBeSent', (e) => {
      urls.set(e.requestId, e.request.url);
      if (process.env.BENCH_PHONE_TIMELINE)
        timeline.push(`${Math.round((e.timestamp - (startWall ?? e.timestamp)) * 1000)} start ${e.request.url}`);
      requests += 1;
      startWall ??= e.timestamp;
      if (myWeekWall === null && e.request.url.includes('/api/my-week')) myWeekWall = e.timestamp;
    });
    cdp.on('Network.loadingFinished', (e) => {
      bytes += e.encodedDataLength;
      if (process.env.BENCH_PHONE_TIMELINE)
        timeline.push(
          `${Math.round((e.timestamp - (startWall ?? e.timestamp)) * 1000)} done ${urls.get(e.requestId)} ${e.encodedDataLength}`,
        );
    });
    await page.goto(`${stack.origin}/my-week`, { waitUntil: 'commit' });
    const handle = await page
      .waitForFunction(() => (window as unknown as { __pickAt?: number }).__pickAt, null, {
        timeout: 60_000,
        polling: 500,
      })
      .catch(async (err: unknown) => {
        const headings = await page.locator('h1, h2').allTextContents();
        throw new Error(`no pick "${pickName}" on ${page.url()} (headings: ${headings.join(' | ')})`, { cause: err });
      });
    const pickMs = Number(await handle.jsonValue());
    const painted = await page
      .waitForFunction(() => (window as unknown as { __pickPaintAt?: number }).__pickPaintAt, null, {
        timeout: 15_000,
        polling: 100,
      })
      .then(async (h) => Number(await h.jsonValue()))
      .catch(() => null);
    await page.waitForLoadState('networkidle');
    if (process.env.BENCH_PHONE_TIMELINE)
      console.error(
        [...timeline, `${Math.round(pickMs)} pick`, `${Math.round(painted ?? NaN)} pick painted`].join('\n'),
      );
    return {
      pickMs: Math.round(pickMs),
      pickPaintMs: painted === null ? null : Math.round(painted),
      bytes,
      requests,
      myWeekRequestMs: myWeekWall !== null && startWall !== null ? Math.round((myWeekWall - startWall) * 1000) : null,
    };
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
  }
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1]!;
};

export async function runPhoneBench(stack: SpeedStack) {
  const cookie = await signIn(stack.origin, 'athlete@rackturn.test', 'rackturn-demo');
  const week = (await (await fetch(`${stack.origin}/api/my-week`, { headers: { cookie } })).json()) as {
    picks: { variant: { name: string } }[];
  };
  const pickName = week.picks[0]?.variant.name;
  if (!pickName) throw new Error('the demo athlete has no pick this week');
  await openOnce(stack, cookie, pickName); // warms the server, not the browser: every run has a fresh profile
  const runs: Run[] = [];
  for (let i = 0; i < RUNS; i++) runs.push(await openOnce(stack, cookie, pickName));
  return {
    profile: PROFILE,
    runs: RUNS,
    pickMs: { median: median(runs.map((r) => r.pickMs)), all: runs.map((r) => r.pickMs) },
    pickPaintMs: {
      median: median(runs.map((r) => r.pickPaintMs ?? Number.NaN)),
      all: runs.map((r) => r.pickPaintMs),
    },
    myWeekRequestMs: median(runs.map((r) => r.myWeekRequestMs ?? Number.NaN)),
    bytes: median(runs.map((r) => r.bytes)),
    requests: median(runs.map((r) => r.requests)),
    budgets: { pickMs: 2000, pickPaintMs: 2000 },
  };
}
