// The service worker's cache of the signed-in athlete's answers (who is signed in, My week), named here
// for the build's worker config and for the page, which empties it when someone signs out.
export const MY_WEEK_CACHE = 'rackturn-my-week';

/** Forgets the previous user's cached answers (nothing to do where the browser has no Cache Storage). */
export async function clearOfflineCache(): Promise<void> {
  if (typeof caches === 'undefined') return;
  await caches.delete(MY_WEEK_CACHE);
}
