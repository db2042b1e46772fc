// Runs axe-core (the npm package, pinned) inside the page and returns its violations as short lines,
// so a test can expect none on every page, dialogs and drags included.
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';

const require = createRequire(import.meta.url);
const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

interface AxeResult {
  violations: {
    id: string;
    impact: string | null;
    help: string;
    nodes: { target: unknown[]; failureSummary?: string }[];
  }[];
}

/** The WCAG 2.x A and AA rules, and best practices; each violation as "rule: help (n nodes) first-target". */
export async function axeViolations(page: Page, selector?: string): Promise<string[]> {
  // Colour contrast is judged on settled colours: a button still fading between its busy and ready
  // colours (transition-colors, 150 ms) would otherwise be read half-way. Endless animations
  // (a spinner) are not waited for; nothing is waited for longer than 2 s.
  await page.evaluate(() =>
    Promise.race([
      Promise.all(
        document
          .getAnimations()
          .filter((a) => Number.isFinite(Number(a.effect?.getComputedTiming().endTime)))
          .map((a) => a.finished.catch(() => undefined)),
      ),
      new Promise((resolve) => setTimeout(resolve, 2_000)),
    ]),
  );
  const loaded = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe !== 'undefined');
  // Evaluated through the debugging protocol, so the app's Content-Security-Policy does not stand in the way.
  if (!loaded) await page.evaluate(AXE_SOURCE);
  const result = await page.evaluate(async (context) => {
    const axe = (window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<unknown> } }).axe;
    return axe.run(context ?? document, {
      runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice'] },
      resultTypes: ['violations'],
    });
  }, selector ?? null);
  return (result as AxeResult).violations.map(
    (v) => `${v.id}: ${v.help} (${v.nodes.length}) ${JSON.stringify(v.nodes[0]?.target ?? [])}`,
  );
}
