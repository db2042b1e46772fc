// Messages between an athlete and the team's coaches, one thread per athlete and week, with what each
// reader has read.
import { char, index, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id, ref, updatedAt } from './columns';
import { teamRef, users } from './auth';
import { athleteRef } from './roster';

export const messages = mysqlTable(
  'messages',
  {
    id: id(),
    teamId: teamRef(),
    /** The thread: this athlete's week. */
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    authorId: ref('author_id').references(() => users.id, { onDelete: 'set null' }),
    authorRole: mysqlEnum('author_role', ['athlete', 'coach']).notNull(),
    body: text('body').notNull(),
    /** A cell of the thread's athlete a coach points to (week and slot); both or neither. */
    linkWeek: char('link_week', { length: 8 }),
    linkSlotId: varchar('link_slot_id', { length: 32 }),
    createdAt: createdAt(),
  },
  (t) => [index('messages_thread_idx').on(t.teamId, t.athleteId, t.week, t.id)],
);

/** How far one reader has read one thread: the newest message id they have seen. */
export const messageReads = mysqlTable(
  'message_reads',
  {
    id: id(),
    teamId: teamRef(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    lastReadId: ref('last_read_id').notNull(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('message_reads_reader_thread_uq').on(t.userId, t.athleteId, t.week)],
);
