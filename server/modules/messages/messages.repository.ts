// SQL for message threads and read marks. Every query is scoped to the team.
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, messageReads, messages, users } from '../../db/schema';

export type AuthorRole = 'athlete' | 'coach';

export async function findThreadAthlete(db: Queryable, teamId: number, athleteId: number) {
  const [row] = await db
    .select({ id: athletes.id, name: athletes.name, userId: athletes.userId })
    .from(athletes)
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return row ?? null;
}

const messageColumns = {
  id: messages.id,
  athleteId: messages.athleteId,
  week: messages.week,
  authorId: messages.authorId,
  authorRole: messages.authorRole,
  authorName: users.name,
  body: messages.body,
  linkWeek: messages.linkWeek,
  linkSlotId: messages.linkSlotId,
  createdAt: messages.createdAt,
};
export type MessageRow = {
  id: number;
  athleteId: number;
  week: string;
  authorId: number | null;
  authorRole: AuthorRole;
  authorName: string | null;
  body: string;
  linkWeek: string | null;
  linkSlotId: string | null;
  createdAt: Date;
};

/** One thread's messages, oldest first. */
export async function listThreadMessages(
  db: Queryable,
  teamId: number,
  athleteId: number,
  week: string,
): Promise<MessageRow[]> {
  return db
    .select(messageColumns)
    .from(messages)
    .leftJoin(users, eq(users.id, messages.authorId))
    .where(and(eq(messages.teamId, teamId), eq(messages.athleteId, athleteId), eq(messages.week, week)))
    .orderBy(asc(messages.id));
}

export async function messagesByIds(db: Queryable, teamId: number, ids: number[]): Promise<MessageRow[]> {
  if (ids.length === 0) return [];
  return db
    .select(messageColumns)
    .from(messages)
    .leftJoin(users, eq(users.id, messages.authorId))
    .where(and(eq(messages.teamId, teamId), inArray(messages.id, ids)));
}

export async function insertMessage(
  db: Queryable,
  row: {
    teamId: number;
    athleteId: number;
    week: string;
    authorId: number;
    authorRole: AuthorRole;
    body: string;
    linkWeek: string | null;
    linkSlotId: string | null;
  },
): Promise<number> {
  const [res] = await db.insert(messages).values(row).$returningId();
  return res!.id;
}

export async function findLastRead(db: Queryable, userId: number, athleteId: number, week: string): Promise<number> {
  const [row] = await db
    .select({ lastReadId: messageReads.lastReadId })
    .from(messageReads)
    .where(and(eq(messageReads.userId, userId), eq(messageReads.athleteId, athleteId), eq(messageReads.week, week)))
    .limit(1);
  return row?.lastReadId ?? 0;
}

/** Moves a reader's mark forward to `lastReadId` (never back: two tabs may mark in either order). */
export async function markReadUpTo(
  db: Queryable,
  row: { teamId: number; userId: number; athleteId: number; week: string; lastReadId: number },
) {
  await db
    .insert(messageReads)
    .values(row)
    .onDuplicateKeyUpdate({ set: { lastReadId: sql`GREATEST(${messageReads.lastReadId}, VALUES(last_read_id))` } });
}

/**
 * A reader's threads, the one with the newest message first: last message id, how many messages and how
 * many from `fromRole` the reader has not read. `athleteId` narrows to one athlete's threads.
 */
export async function listThreadSummaries(
  db: Queryable,
  q: { teamId: number; userId: number; athleteId: number | null; fromRole: AuthorRole; limit: number; offset: number },
) {
  const scope = and(
    eq(messages.teamId, q.teamId),
    q.athleteId === null ? undefined : eq(messages.athleteId, q.athleteId),
  );
  const unread = sql<number>`SUM(CASE WHEN ${messages.authorRole} = ${q.fromRole} AND ${messages.id} > COALESCE(${messageReads.lastReadId}, 0) THEN 1 ELSE 0 END)`;
  const rows = await db
    .select({
      athleteId: messages.athleteId,
      athleteName: athletes.name,
      week: messages.week,
      lastId: sql<number>`MAX(${messages.id})`.mapWith(Number),
      count: sql<number>`COUNT(*)`.mapWith(Number),
      unread: unread.mapWith(Number),
    })
    .from(messages)
    .innerJoin(athletes, and(eq(athletes.id, messages.athleteId), eq(athletes.teamId, q.teamId)))
    .leftJoin(
      messageReads,
      and(
        eq(messageReads.userId, q.userId),
        eq(messageReads.athleteId, messages.athleteId),
        eq(messageReads.week, messages.week),
      ),
    )
    .where(scope)
    .groupBy(messages.athleteId, athletes.name, messages.week, messageReads.lastReadId)
    .orderBy(desc(sql`MAX(${messages.id})`))
    .limit(q.limit)
    .offset(q.offset);
  const [total] = await db
    .select({ n: sql<number>`COUNT(DISTINCT ${messages.athleteId}, ${messages.week})`.mapWith(Number) })
    .from(messages)
    .where(scope);
  return { rows, total: total?.n ?? 0 };
}
