/// <reference types="vite-plugin-pwa/client" />
// Registers the service worker the build generates (vite-plugin-pwa). The worker's first install fetches
// every file of the app, which on a slow phone link would compete with the first screen: so it waits for
// the page's load, then (on My week, the page a phone opens most) for the picks to be on screen, then for
// an idle moment. A new build's worker takes over at once and the page reloads into the new version, so an
// old app shell is never kept.
import { registerSW } from 'virtual:pwa-register';

let showFirstScreen: () => void = () => undefined;
const firstScreen = new Promise<void>((resolve) => (showFirstScreen = resolve));

/** Called by a page once what the user came for is on screen. */
export function firstScreenShown(): void {
  showFirstScreen();
}

const pageLoaded = () =>
  new Promise<void>((resolve) => {
    if (document.readyState === 'complete') resolve();
    else window.addEventListener('load', () => resolve(), { once: true });
  });

const idle = () =>
  new Promise<void>((resolve) => {
    if ('requestIdleCallback' in window) window.requestIdleCallback(() => resolve(), { timeout: 2000 });
    else setTimeout(resolve, 200);
  });

// A page that never reports (an error, a week without picks) still gets its worker after this long.
const FIRST_SCREEN_WAIT_MS = 8000;

export function registerServiceWorker(): void {
  if (!('serviceWorker' in navigator)) return;
  void pageLoaded()
    // Read after the load: the home page (/) has sent an athlete on to My week by then.
    .then(() =>
      location.pathname === '/my-week'
        ? Promise.race([firstScreen, new Promise<void>((r) => setTimeout(r, FIRST_SCREEN_WAIT_MS))])
        : undefined,
    )
    .then(idle)
    .then(() => registerSW({ immediate: true }));
}
