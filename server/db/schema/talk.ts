// Messages between an athlete and the team's coaches, one thread per athlete and week, with what each
// reader has read; notices for coaches, and each coach's choice of a daily e-mail summary of them.
import {
  boolean,
  char,
  date,
  datetime,
  index,
  mysqlEnum,
  mysqlTable,
  text,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { NOTICE_KINDS } from '../../../shared/schemas/notices';
import { createdAt, enumValues, id, ref, updatedAt } from './columns';
import { teamRef, users } from './auth';
import { athleteRef, athletes } from './roster';

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

/** One notice for one coach: something an athlete did that a coach should look at. */
export const notices = mysqlTable(
  'notices',
  {
    id: id(),
    teamId: teamRef(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: mysqlEnum('kind', enumValues(NOTICE_KINDS)).notNull(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    text: varchar('text', { length: 300 }).notNull(),
    /** Where in the app the notice leads. */
    path: varchar('path', { length: 200 }).notNull(),
    /** What the notice is about, so that the same event never makes two notices for one coach. */
    dedupeKey: varchar('dedupe_key', { length: 120 }).notNull(),
    readAt: datetime('read_at', { mode: 'date', fsp: 3 }),
    /** When it went out in a daily e-mail summary. */
    digestedAt: datetime('digested_at', { mode: 'date', fsp: 3 }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('notices_user_dedupe_uq').on(t.userId, t.dedupeKey),
    index('notices_user_idx').on(t.userId, t.readAt, t.id),
  ],
);

/** A coach's notice settings; no row means the defaults (the daily e-mail on). */
export const noticeSettings = mysqlTable(
  'notice_settings',
  {
    id: id(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    dailyEmail: boolean('daily_email').notNull().default(true),
    /** The last day (UTC) a summary was queued for this coach. */
    lastDigestOn: date('last_digest_on', { mode: 'string' }),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('notice_settings_user_uq').on(t.userId)],
);

/**
 * Changes that open pages should show at once, written by whichever app instance made them; every
 * instance reads new rows by id and passes them on to its own subscribers. Old rows are pruned.
 */
export const liveEvents = mysqlTable(
  'live_events',
  {
    id: id(),
    teamId: teamRef(),
    /** The athlete the change is about (that athlete and the coaches see it); null: for coaches only. */
    athleteId: ref('athlete_id').references(() => athletes.id, { onDelete: 'cascade' }),
    topic: mysqlEnum('topic', ['plan', 'messages', 'notices']).notNull(),
    /** The weeks the change touches. */
    weeks: varchar('weeks', { length: 200 }).notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('live_events_created_idx').on(t.createdAt)],
);
