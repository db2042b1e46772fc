// Live updates: a change is written to the live_events table (in the writer's transaction), and each app
// instance polls that table by id and passes new rows to its own open streams, scoped to the team and,
// for athletes, to their own athlete. Works the same with one instance or several behind a balancer.
import type { Response } from 'express';
import type { LiveEvent } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import type { AuthContext } from '../../middleware/auth';
import { eventsAfter, insertEvent, lastEventId, pruneEventsBefore, type LiveTopic } from './events.repository';

/** How often an instance with open streams looks for new rows. */
export const POLL_MS = 400;
/** A comment line now and then keeps proxies from closing a quiet stream. */
const HEARTBEAT_MS = 25_000;
/** Rows older than this are of no use to anyone (a reconnecting page reloads what it shows). */
const KEEP_MS = 10 * 60_000;

/** Records a change for the live streams, inside the caller's transaction. */
export async function publishChange(
  db: Queryable,
  e: { teamId: number; athleteId: number | null; topic: LiveTopic; weeks?: string[] },
) {
  const weeks = [...new Set(e.weeks ?? [])].sort().join(',').slice(0, 200);
  await insertEvent(db, { teamId: e.teamId, athleteId: e.athleteId, topic: e.topic, weeks });
}

interface Subscriber {
  auth: AuthContext;
  res: Response;
}

/** Athletes see changes about themselves; coaches every change of their team. */
function sees(auth: AuthContext, row: { teamId: number; athleteId: number | null }): boolean {
  if (row.teamId !== auth.teamId) return false;
  if (auth.role === 'athlete') return row.athleteId !== null && row.athleteId === auth.athleteId;
  return true;
}

export class LiveHub {
  private subscribers = new Set<Subscriber>();
  private lastId: number | null = null;
  private timer: NodeJS.Timeout | null = null;
  private heartbeat: NodeJS.Timeout | null = null;
  private polling = false;
  private stopped = false;
  private lastPrune = 0;

  constructor(private readonly ctx: Pick<AppContext, 'database' | 'logger'>) {}

  /** Opens a stream for the caller; it ends when the client goes or the hub stops. */
  async subscribe(auth: AuthContext, res: Response): Promise<void> {
    if (this.lastId === null) this.lastId = await lastEventId(this.ctx.database.db);
    res.status(200);
    res.setHeader('Content-Type', 'text/event-stream; charset=utf-8');
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Accel-Buffering', 'no');
    res.flushHeaders();
    // The browser waits this long before it reconnects by itself.
    res.write('retry: 3000\n: open\n\n');
    if (this.stopped) {
      res.end();
      return;
    }
    const sub = { auth, res };
    this.subscribers.add(sub);
    res.on('close', () => {
      this.subscribers.delete(sub);
      if (this.subscribers.size === 0) this.pause();
    });
    this.start();
  }

  private start() {
    if (this.timer || this.stopped) return;
    this.timer = setInterval(() => void this.poll(), POLL_MS);
    this.timer.unref();
    this.heartbeat = setInterval(() => {
      for (const s of this.subscribers) s.res.write(': still here\n\n');
    }, HEARTBEAT_MS);
    this.heartbeat.unref();
  }

  private pause() {
    if (this.timer) clearInterval(this.timer);
    if (this.heartbeat) clearInterval(this.heartbeat);
    this.timer = null;
    this.heartbeat = null;
  }

  /** Reads rows past the last one seen and sends each to the subscribers allowed to see it. */
  async poll(): Promise<void> {
    if (this.polling || this.stopped) return;
    this.polling = true;
    try {
      const db = this.ctx.database.db;
      for (let round = 0; round < 10; round++) {
        const rows = await eventsAfter(db, this.lastId ?? 0, 200);
        for (const row of rows) {
          this.lastId = row.id;
          const event: LiveEvent = {
            id: row.id,
            topic: row.topic,
            athleteId: row.athleteId,
            weeks: row.weeks ? row.weeks.split(',') : [],
          };
          const line = `id: ${row.id}\nevent: change\ndata: ${JSON.stringify(event)}\n\n`;
          for (const s of this.subscribers) if (sees(s.auth, row)) s.res.write(line);
        }
        if (rows.length < 200) break;
      }
      if (Date.now() - this.lastPrune > 60_000) {
        this.lastPrune = Date.now();
        await pruneEventsBefore(db, new Date(Date.now() - KEEP_MS));
      }
    } catch (err) {
      this.ctx.logger.warn({ err, module: 'events' }, 'live events poll failed');
    } finally {
      this.polling = false;
    }
  }

  /** Ends every stream and the polling, so the process (or a test run) can close. */
  stop() {
    this.stopped = true;
    this.pause();
    for (const s of this.subscribers) s.res.end();
    this.subscribers.clear();
  }
}

const hubs = new WeakMap<object, LiveHub>();

/** The instance's hub (one per app context). */
export function hubFor(ctx: Pick<AppContext, 'database' | 'logger'>): LiveHub {
  let hub = hubs.get(ctx);
  if (!hub) {
    hub = new LiveHub(ctx);
    hubs.set(ctx, hub);
  }
  return hub;
}

export function stopLiveEvents(ctx: Pick<AppContext, 'database' | 'logger'>) {
  hubs.get(ctx)?.stop();
}
