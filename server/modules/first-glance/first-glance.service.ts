// The first glance of My week: the app's page for a signed-in athlete's home, carrying the week the page is
// about to ask for (as data the client puts in its cache before its first render, so it asks nothing twice)
// and a plain drawing of this week's picks, shown before the app's code has run.
import escapeHtml from 'escape-html';
import { isIsoWeek } from '../../../shared/engine/weeks';
import type { MyWeek } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { SessionAuth } from '../../lib/session';
import { meOf } from '../auth/auth.service';
import { myWeekJson } from '../my-week/my-week.service';
import { firstGlanceMarkup } from './first-glance.markup';

/** The id of the data's script element, read by the client (src/lib/first-glance.ts). */
export const FIRST_GLANCE_DATA_ID = 'rackturn-first-glance';
/** A meta tag in the page's head saying the data is in the page (public/early.js then asks for nothing). */
export const FIRST_GLANCE_META = 'rackturn-first-glance';

const ROOT = '<div id="root"></div>';
const EARLY_SCRIPT = '<script src="/early.js"';
const CODE_META = /<meta name="rackturn-my-week-code" content="([^"]*)"/;

/**
 * JSON made safe inside a script element: `<`, `>` and `&` can then never close the element or open a
 * comment, and U+2028/U+2029 never end a line in older readers; JSON.parse reads the escapes back.
 */
export function scriptSafeJson(json: string): string {
  return json.replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** The week an address asks for, as the app's page reads it: `/my-week?week=…` (an ISO week) or this week (null). */
export function requestedWeek(path: string, query: Record<string, unknown>): string | null {
  const week = query.week;
  return path !== '/' && typeof week === 'string' && isIsoWeek(week) ? week : null;
}

/**
 * The page with the first glance for this athlete, or null when the page cannot carry one (no roster entry,
 * a page template without the places it needs). Throws what reading the week throws.
 */
export async function firstGlancePage(
  ctx: Pick<AppContext, 'database'>,
  auth: SessionAuth,
  template: string,
  requested: string | null,
  now = new Date(),
): Promise<string | null> {
  if (auth.role !== 'athlete' || auth.athleteId === null) return null;
  if (!template.includes(ROOT) || !template.includes(EARLY_SCRIPT)) return null;
  const who = { teamId: auth.teamId, athleteId: auth.athleteId, unit: auth.unit };
  const text = await myWeekJson(ctx, who, requested ?? undefined, now);
  const week = JSON.parse(text) as MyWeek;
  const me = meOf(auth);
  // The week's text goes in as the API sends it: the client reads the same answer it would have fetched.
  const data = `{"at":${JSON.stringify(now.toISOString())},"week":${JSON.stringify(requested)},"me":${JSON.stringify(me)},"myWeek":${text}}`;
  // The page's own code, named by the build, fetched from the first moment instead of once early.js runs.
  const code = CODE_META.exec(template)?.[1]?.split(' ').filter(Boolean) ?? [];
  const preloads = code.map((href) => `<link rel="modulepreload" crossorigin href="${escapeHtml(href)}" />\n    `);
  return template
    .replace(
      EARLY_SCRIPT,
      () => `<meta name="${FIRST_GLANCE_META}" content="" />\n    ${preloads.join('')}${EARLY_SCRIPT}`,
    )
    .replace(
      ROOT,
      () =>
        `<div id="root">${firstGlanceMarkup(me, week, requested)}</div>\n` +
        `    <script type="application/json" id="${FIRST_GLANCE_DATA_ID}">${scriptSafeJson(data)}</script>`,
    );
}
