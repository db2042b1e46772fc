// Threads between an athlete and the team's coaches: who may read and write which thread, read marks
// per reader, and the one-click cell link only coaches may attach.
import type { ListResponse, Message, MessageThread, SendMessageInput, ThreadSummary } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { AuthContext } from '../../middleware/auth';
import { inTransaction } from '../../db/transaction';
import { NotFoundError, ValidationError } from '../../lib/errors';
import { noticeMessage } from '../notices/notices.service';
import { publishChange } from '../events/events.service';
import {
  findLastRead,
  findThreadAthlete,
  insertMessage,
  listThreadMessages,
  listThreadSummaries,
  markReadUpTo,
  messagesByIds,
  type AuthorRole,
  type MessageRow,
} from './messages.repository';

type Ctx = Pick<AppContext, 'database'>;

const sideOf = (auth: AuthContext): AuthorRole => (auth.role === 'athlete' ? 'athlete' : 'coach');
const otherSide = (auth: AuthContext): AuthorRole => (auth.role === 'athlete' ? 'coach' : 'athlete');

/** The thread's athlete, if the caller may see it: athletes only their own, coaches any of their team. */
async function threadAthlete(ctx: Ctx, auth: AuthContext, athleteId: number) {
  if (auth.role === 'athlete' && auth.athleteId !== athleteId) throw new NotFoundError('That thread');
  const athlete = await findThreadAthlete(ctx.database.db, auth.teamId, athleteId);
  if (!athlete) throw new NotFoundError('That thread');
  return athlete;
}

function toMessage(row: MessageRow, auth: AuthContext): Message {
  return {
    id: row.id,
    athleteId: row.athleteId,
    week: row.week,
    authorRole: row.authorRole,
    authorName: row.authorName,
    mine: row.authorId === auth.userId,
    body: row.body,
    link: row.linkWeek && row.linkSlotId ? { week: row.linkWeek, slotId: row.linkSlotId } : null,
    createdAt: row.createdAt.toISOString(),
  };
}

export async function readThread(ctx: Ctx, auth: AuthContext, athleteId: number, week: string): Promise<MessageThread> {
  const athlete = await threadAthlete(ctx, auth, athleteId);
  const db = ctx.database.db;
  const [rows, lastRead] = await Promise.all([
    listThreadMessages(db, auth.teamId, athleteId, week),
    findLastRead(db, auth.userId, athleteId, week),
  ]);
  const other = otherSide(auth);
  return {
    athleteId,
    athleteName: athlete.name,
    week,
    items: rows.map((r) => toMessage(r, auth)),
    unread: rows.filter((r) => r.authorRole === other && r.id > lastRead).length,
  };
}

/** Stores a message; the sender has read the thread up to it. Returns the message as stored. */
export async function sendMessage(
  ctx: Ctx,
  auth: AuthContext,
  athleteId: number,
  week: string,
  input: { body: string; link?: SendMessageInput['link'] },
): Promise<{ message: Message; athleteName: string }> {
  const athlete = await threadAthlete(ctx, auth, athleteId);
  if (input.link && auth.role === 'athlete') {
    throw new ValidationError('Some fields need attention.', { link: ['Only coaches can link a board cell'] });
  }
  const db = ctx.database.db;
  const id = await inTransaction(db, async (tx) => {
    const id = await insertMessage(tx, {
      teamId: auth.teamId,
      athleteId,
      week,
      authorId: auth.userId,
      authorRole: sideOf(auth),
      body: input.body,
      linkWeek: input.link?.week ?? null,
      linkSlotId: input.link?.slotId ?? null,
    });
    await markReadUpTo(tx, { teamId: auth.teamId, userId: auth.userId, athleteId, week, lastReadId: id });
    await publishChange(tx, { teamId: auth.teamId, athleteId, topic: 'messages', weeks: [week] });
    if (auth.role === 'athlete') {
      await noticeMessage(tx, { teamId: auth.teamId, athleteId, week, messageId: id, body: input.body });
    }
    return id;
  });
  const [row] = await messagesByIds(db, auth.teamId, [id]);
  return { message: toMessage(row!, auth), athleteName: athlete.name };
}

/** Marks the whole thread as read by the caller. */
export async function markThreadRead(ctx: Ctx, auth: AuthContext, athleteId: number, week: string) {
  await threadAthlete(ctx, auth, athleteId);
  const db = ctx.database.db;
  const rows = await listThreadMessages(db, auth.teamId, athleteId, week);
  const last = rows.at(-1)?.id;
  if (last) await markReadUpTo(db, { teamId: auth.teamId, userId: auth.userId, athleteId, week, lastReadId: last });
  return { unread: 0 };
}

/** The caller's threads, newest activity first: an athlete's own, a coach's team's (or one athlete's). */
export async function listThreads(
  ctx: Ctx,
  auth: AuthContext,
  q: { limit: number; offset: number; athleteId?: number },
): Promise<ListResponse<ThreadSummary>> {
  let athleteId: number | null = q.athleteId ?? null;
  if (auth.role === 'athlete') {
    if (athleteId !== null && athleteId !== auth.athleteId) throw new NotFoundError('That athlete');
    athleteId = auth.athleteId ?? -1;
  } else if (athleteId !== null && !(await findThreadAthlete(ctx.database.db, auth.teamId, athleteId))) {
    throw new NotFoundError('That athlete');
  }
  const db = ctx.database.db;
  const { rows, total } = await listThreadSummaries(db, {
    teamId: auth.teamId,
    userId: auth.userId,
    athleteId,
    fromRole: otherSide(auth),
    limit: q.limit,
    offset: q.offset,
  });
  const last = new Map(
    (
      await messagesByIds(
        db,
        auth.teamId,
        rows.map((r) => r.lastId),
      )
    ).map((m) => [m.id, m]),
  );
  return {
    items: rows.map((r) => ({
      athleteId: r.athleteId,
      athleteName: r.athleteName,
      week: r.week,
      lastMessage: toMessage(last.get(r.lastId)!, auth),
      count: r.count,
      unread: r.unread,
    })),
    total,
  };
}
