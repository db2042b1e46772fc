// Debian's Chromium through playwright-core, one fresh profile per test file.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inject } from 'vitest';

export const DEMO_PASSWORD = 'rackturn-demo';

export interface Browser {
  context: BrowserContext;
  page: Page;
  baseUrl: string;
  /** Console errors and CSP violations seen so far. */
  problems: string[];
  close(): Promise<void>;
}

export async function openBrowser(opts: { width?: number; height?: number } = {}): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'rackturn-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: opts.width ?? 1400, height: opts.height ?? 900 },
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const problems: string[] = [];
  page.on('console', (m) => {
    // A failed request's message does not say which one: its location does.
    if (m.type() === 'error') problems.push(m.location().url ? `${m.text()} (${m.location().url})` : m.text());
  });
  page.on('pageerror', (e) => problems.push(e.message));
  return {
    context,
    page,
    baseUrl: inject('baseUrl'),
    problems,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function signInAs(
  b: Browser,
  email: string,
  password = DEMO_PASSWORD,
  page: Page = b.page,
): Promise<void> {
  await page.goto(`${b.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}
