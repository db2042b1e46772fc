/// <reference types="vite-plugin-pwa/client" />
// Registers the service worker the build generates (vite-plugin-pwa): after the page has loaded, so it
// never competes with the first screen. A new build's worker takes over at once and the page reloads
// into the new version, so an old app shell is never kept.
import { registerSW } from 'virtual:pwa-register';

export function registerServiceWorker(): void {
  if (!('serviceWorker' in navigator)) return;
  registerSW({ immediate: false });
}
