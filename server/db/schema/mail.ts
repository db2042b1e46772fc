// Outgoing e-mail waits in an outbox and is sent with retries, so an SMTP outage delays mail but loses none.
import { datetime, index, int, json, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id, ref } from './columns';
import { teams } from './auth';

export const outbox = mysqlTable(
  'outbox',
  {
    id: id(),
    teamId: ref('team_id').references(() => teams.id, { onDelete: 'cascade' }),
    kind: varchar('kind', { length: 40 }).notNull(),
    dedupeKey: varchar('dedupe_key', { length: 191 }).notNull(),
    toEmail: varchar('to_email', { length: 254 }).notNull(),
    subject: varchar('subject', { length: 200 }).notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body').notNull(),
    /** Extra headers for this message (List-Unsubscribe and the like). */
    headers: json('headers').$type<Record<string, string>>(),
    attempts: int('attempts', { unsigned: true }).notNull().default(0),
    nextAttemptAt: datetime('next_attempt_at', { mode: 'date', fsp: 3 }).notNull(),
    sentAt: datetime('sent_at', { mode: 'date', fsp: 3 }),
    lastError: varchar('last_error', { length: 500 }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('outbox_dedupe_uq').on(t.dedupeKey), index('outbox_due_idx').on(t.sentAt, t.nextAttemptAt)],
);
