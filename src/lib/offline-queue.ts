// Writes kept on the phone while it has no signal: each in IndexedDB (idb-keyval) with the idempotency
// key it will be sent with, sent in order once the browser is online again. The key makes a resend of a
// write that did reach the server (its answer lost) come back as the first answer, never a second row.
// A refusal (4xx) stays in the list with its reason until the athlete discards it; a network failure or a
// server error leaves the entry waiting for the next try. Entries belong to one athlete and are sent only
// while that athlete is signed in.
import { useSyncExternalStore } from 'react';
import { createStore, del, entries, set } from 'idb-keyval';
import { ApiError, api } from './api-client';

export interface QueuedWrite {
  /** Also the Idempotency-Key the write is sent with. */
  id: string;
  /** Whose write it is (the athlete's id): sent only while they are signed in. */
  owner: number;
  method: 'POST' | 'PUT';
  /** API path, without /api. */
  path: string;
  body: unknown;
  /** What the athlete logged, in words, for the list. */
  label: string;
  queuedAt: string;
  state: 'waiting' | 'refused';
  /** Why the server refused it. */
  error?: string;
}

/** How long a first try may take before the write is kept for later. */
const SEND_TIMEOUT_MS = 15_000;

export type SendOutcome<T> = { sent: true; answer: T } | { sent: false; queued: QueuedWrite };

const store = typeof indexedDB === 'undefined' ? null : createStore('rackturn-offline', 'writes');
let items: QueuedWrite[] = [];
let loaded: Promise<void> | null = null;
const listeners = new Set<() => void>();

function publish(next: QueuedWrite[]) {
  items = [...next].sort((a, b) => a.queuedAt.localeCompare(b.queuedAt));
  for (const l of listeners) l();
}

function load(): Promise<void> {
  loaded ??= store
    ? entries<string, QueuedWrite>(store).then((all) => publish(all.map(([, v]) => v)))
    : Promise.resolve();
  return loaded;
}

async function save(write: QueuedWrite) {
  if (store) await set(write.id, write, store);
  publish([...items.filter((w) => w.id !== write.id), write]);
}

async function remove(id: string) {
  if (store) await del(id, store);
  publish(items.filter((w) => w.id !== id));
}

const offline = () => typeof navigator !== 'undefined' && navigator.onLine === false;

/**
 * Sends a write at once when the browser is online, else (or when the network fails on the way) keeps it
 * for later. Refusals of the first try are thrown as usual, for the form to show.
 */
export async function sendOrQueue<T>(write: Omit<QueuedWrite, 'id' | 'queuedAt' | 'state'>): Promise<SendOutcome<T>> {
  const queued: QueuedWrite = {
    ...write,
    id: crypto.randomUUID(),
    queuedAt: new Date().toISOString(),
    state: 'waiting',
  };
  if (!offline()) {
    try {
      // A request the lost signal leaves hanging is given up after a while and kept: its key makes a
      // later resend safe even if this one did reach the server.
      const answer = await api<T>(write.path, {
        method: write.method,
        body: write.body,
        idempotencyKey: queued.id,
        signal: AbortSignal.timeout(SEND_TIMEOUT_MS),
      });
      return { sent: true, answer };
    } catch (err) {
      if (!(err instanceof ApiError && err.status === 0)) throw err;
    }
  }
  await load();
  const kept = await supersede(queued);
  await save(kept);
  return { sent: false, queued: kept };
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * A PUT sets one resource, so a later PUT to the same path takes the place of one still waiting: its fields
 * win, fields it leaves out are taken from the earlier one (so two partial writes made without signal, read
 * from the same version, both land). It keeps the earlier one's place in the list but gets its own key,
 * since the server answers a key reused with another body as an error.
 */
async function supersede(write: QueuedWrite): Promise<QueuedWrite> {
  if (write.method !== 'PUT') return write;
  const earlier = items.find(
    (w) => w.owner === write.owner && w.method === 'PUT' && w.path === write.path && w.state === 'waiting',
  );
  if (!earlier) return write;
  await remove(earlier.id);
  const body = isRecord(earlier.body) && isRecord(write.body) ? { ...earlier.body, ...write.body } : write.body;
  return { ...write, body, queuedAt: earlier.queuedAt };
}

let flushing: Promise<number> | null = null;

/** Sends the owner's waiting writes in order; the number sent. One run at a time. */
export function flushQueue(owner: number): Promise<number> {
  flushing ??= (async () => {
    await load();
    let sent = 0;
    for (const write of items.filter((w) => w.owner === owner && w.state === 'waiting')) {
      if (offline()) break;
      try {
        await api(write.path, {
          method: write.method,
          body: write.body,
          idempotencyKey: write.id,
          signal: AbortSignal.timeout(SEND_TIMEOUT_MS),
        });
        await remove(write.id);
        sent++;
      } catch (err) {
        // No connection, a server error, or the same write still being handled: try again later.
        if (
          !(err instanceof ApiError) ||
          err.status === 0 ||
          err.status >= 500 ||
          (err.status === 409 && err.code === 'request_in_progress')
        )
          break;
        const fields = Object.values(err.fields).flat();
        await save({ ...write, state: 'refused', error: [err.message, ...fields].join(' ') });
      }
    }
    return sent;
  })().finally(() => {
    flushing = null;
  });
  return flushing;
}

/** The owner's kept writes, oldest first, as they are now. */
export async function queuedWritesOf(owner: number): Promise<QueuedWrite[]> {
  await load();
  return items.filter((w) => w.owner === owner);
}

/** Drops a write the athlete chose not to send. */
export function discardQueued(id: string): Promise<void> {
  return remove(id);
}

function subscribe(onChange: () => void) {
  listeners.add(onChange);
  void load();
  return () => listeners.delete(onChange);
}

/** The owner's kept writes, oldest first, kept current. */
export function useQueuedWrites(owner: number): QueuedWrite[] {
  const all = useSyncExternalStore(
    subscribe,
    () => items,
    () => items,
  );
  return all.filter((w) => w.owner === owner);
}
