// SQL for live events: written by any instance, read by every instance in id order.
import { asc, gt, lt, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { liveEvents } from '../../db/schema';

export type LiveTopic = 'plan' | 'messages' | 'notices';

export async function insertEvent(
  db: Queryable,
  row: { teamId: number; athleteId: number | null; topic: LiveTopic; weeks: string },
) {
  await db.insert(liveEvents).values(row);
}

export async function eventsAfter(db: Queryable, lastId: number, limit: number) {
  return db.select().from(liveEvents).where(gt(liveEvents.id, lastId)).orderBy(asc(liveEvents.id)).limit(limit);
}

export async function lastEventId(db: Queryable): Promise<number> {
  const [row] = await db
    .select({ id: sql<number>`COALESCE(MAX(${liveEvents.id}), 0)`.mapWith(Number) })
    .from(liveEvents);
  return row?.id ?? 0;
}

export async function pruneEventsBefore(db: Queryable, before: Date) {
  await db.delete(liveEvents).where(lt(liveEvents.createdAt, before));
}
