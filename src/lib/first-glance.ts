// The first glance the server drew into the page (a signed-in athlete's visit home): the data it drew from,
// read once from its non-executable script element, so the first render needs no request of its own.
import type { Me, MyWeek } from '../../shared/schemas';

/** What the server put in the page: when it read the data, the week asked for (null: this week), who, the week. */
export interface FirstGlance {
  at: string;
  week: string | null;
  me: Me;
  myWeek: MyWeek;
}

/** Must match the server's element id. */
const DATA_ID = 'rackturn-first-glance';

/** The page's first glance data, taken out of the page (null without one, or when it cannot be read). */
export function takeFirstGlance(doc: Document = document): FirstGlance | null {
  const el = doc.getElementById(DATA_ID);
  if (!el) return null;
  el.remove();
  try {
    const data = JSON.parse(el.textContent ?? '') as FirstGlance;
    return typeof data.at === 'string' && data.me && data.myWeek ? data : null;
  } catch {
    return null;
  }
}
