// The phone's queue of writes made without signal (kept in memory here: IndexedDB is a browser's), with the
// network stubbed: a write the network drops waits; the server's own errors leave it waiting; a refusal
// keeps it with the reason until discarded and is never sent again; every try carries the same key.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { discardQueued, flushQueue, queuedWritesOf, sendOrQueue } from '../../../src/lib/offline-queue';

const ATHLETE = 41;
const calls: { key: string | null; body: string }[] = [];

function answer(status: number, body: unknown) {
  return vi.fn(async (_url: string, init: RequestInit) => {
    calls.push({ key: new Headers(init.headers).get('Idempotency-Key'), body: String(init.body) });
    return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
  });
}

afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllGlobals();
  calls.length = 0;
});

async function queueOne(label: string) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => {
      throw new TypeError('Failed to fetch');
    }),
  );
  const out = await sendOrQueue({ owner: ATHLETE, method: 'POST', path: '/bodyweights', body: { kg: 82.4 }, label });
  expect(out.sent).toBe(false);
  if (out.sent) throw new Error('unreachable');
  return out.queued;
}

describe('the offline queue', () => {
  it('keeps a write the network drops, and sends it once with its key when the server takes it', async () => {
    const queued = await queueOne('Bodyweight 82.4 kg');
    expect(queued.state).toBe('waiting');

    // The server's own trouble (5xx) leaves it waiting for the next try.
    vi.stubGlobal('fetch', answer(503, { error: { code: 'unavailable', message: 'Try again soon.' } }));
    await expect(flushQueue(ATHLETE)).resolves.toBe(0);

    vi.stubGlobal('fetch', answer(201, { id: 9 }));
    await expect(flushQueue(ATHLETE)).resolves.toBe(1);
    // Nothing is left to send.
    await expect(flushQueue(ATHLETE)).resolves.toBe(0);
    expect(calls.map((c) => c.key)).toEqual([queued.id, queued.id]);
    expect(JSON.parse(calls[1]!.body)).toEqual({ kg: 82.4 });
  });

  it('keeps a refused write with the reason, never sends it again, and drops it when discarded', async () => {
    const queued = await queueOne('Bodyweight 8.24 kg');
    const refusal = answer(422, {
      error: {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        fields: { kg: ['Enter a bodyweight from 30 to 250 kg'] },
      },
    });
    vi.stubGlobal('fetch', refusal);
    await expect(flushQueue(ATHLETE)).resolves.toBe(0);
    await expect(flushQueue(ATHLETE)).resolves.toBe(0);
    expect(refusal).toHaveBeenCalledTimes(1);

    // A write of another athlete signed in later on the same phone is not theirs to send.
    await expect(flushQueue(ATHLETE + 1)).resolves.toBe(0);

    const kept = await queuedWritesOf(ATHLETE);
    expect(kept).toEqual([
      expect.objectContaining({
        id: queued.id,
        state: 'refused',
        error: 'Some fields need attention. Enter a bodyweight from 30 to 250 kg',
      }),
    ]);
    await discardQueued(queued.id);
    await expect(queuedWritesOf(ATHLETE)).resolves.toEqual([]);
  });

  it('a later PUT to the same path takes the place of a waiting one, its fields over the earlier ones', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    const path = '/my-week/sessions/lower-me';
    // A second between writes, so their order in the list is the order they were made.
    vi.useFakeTimers({ toFake: ['Date'] });
    let clock = Date.parse('2026-12-03T09:00:00Z');
    const tick = () => vi.setSystemTime((clock += 1000));
    const put = (body: unknown, label: string) => {
      tick();
      return sendOrQueue({ owner: ATHLETE, method: 'PUT', path, body, label });
    };
    const first = await put({ week: '2026-W49', version: 0, speedSetsDone: 6 }, 'Speed sets');
    const other = await put({ week: '2026-W49', version: 0, backOffDone: [true] }, 'Back-off set 1');
    tick();
    await sendOrQueue({ owner: ATHLETE, method: 'PUT', path: '/my-week/sessions/upper-me', body: {}, label: 'x' });
    vi.useRealTimers();
    const second = await put({ week: '2026-W49', version: 0, backOffDone: [true, true] }, 'Back-off sets');
    if (first.sent || other.sent || second.sent) throw new Error('unreachable');
    const kept = await queuedWritesOf(ATHLETE);
    expect(kept.map((w) => w.path)).toEqual([path, '/my-week/sessions/upper-me']);
    expect(kept[0]).toMatchObject({
      id: second.queued.id,
      queuedAt: first.queued.queuedAt,
      body: { week: '2026-W49', version: 0, speedSetsDone: 6, backOffDone: [true, true] },
      label: 'Back-off sets',
    });
    // Sent once, with the merged body and its own key.
    vi.stubGlobal('fetch', answer(200, {}));
    await expect(flushQueue(ATHLETE)).resolves.toBe(2);
    expect(calls[0]).toEqual({ key: second.queued.id, body: JSON.stringify(kept[0]!.body) });
  });
});
