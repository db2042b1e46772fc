// Answers of the athlete's week kept per app instance, each beside the fingerprint of the rows it was
// read from (weekFingerprint). Every request reads the fingerprint again, in one query, and reuses the
// kept answer only when it is unchanged: a write by any instance, to anything the page shows, is seen on
// the very next request. Keyed by team, athlete, week, unit and day, so no answer reaches another caller.
import type { Database } from '../../db/client';

/** Answers kept per instance at most; the least recently used go first. */
const MAX_ANSWERS = 5_000;

interface Kept {
  fingerprint: string;
  body: string;
}

const caches = new WeakMap<Database, Map<string, Kept>>();

function cacheOf(database: Database): Map<string, Kept> {
  let cache = caches.get(database);
  if (!cache) caches.set(database, (cache = new Map()));
  return cache;
}

/**
 * The kept JSON for `key` when it was built from rows with this fingerprint; otherwise builds it (reading
 * only after the fingerprint was read, so a write in between shows as a changed fingerprint next time).
 */
export async function keptAnswer(
  database: Database,
  key: string,
  fingerprint: string,
  build: () => Promise<unknown>,
): Promise<string> {
  const cache = cacheOf(database);
  const kept = cache.get(key);
  if (kept && kept.fingerprint === fingerprint) {
    // Most recently used last, so the oldest is the first to go.
    cache.delete(key);
    cache.set(key, kept);
    return kept.body;
  }
  const body = JSON.stringify(await build());
  cache.delete(key);
  cache.set(key, { fingerprint, body });
  if (cache.size > MAX_ANSWERS) cache.delete(cache.keys().next().value!);
  return body;
}
