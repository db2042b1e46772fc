// Requests the server has already answered: an athlete's phone that sends a write again (it lost the
// answer, or its offline queue retries) names the same idempotency key and gets the first answer back.
import { sql } from 'drizzle-orm';
import { char, datetime, index, mediumtext, mysqlTable, primaryKey, smallint, varchar } from 'drizzle-orm/mysql-core';
import { users } from './auth';
import { ref } from './columns';

/**
 * One row per (caller, key). The primary key is what makes two copies of one request arriving at once
 * safe: only one insert wins, the other waits for its answer. `status` is null while the first copy is
 * still being handled. Rows are kept about two days, then swept.
 */
export const idempotencyKeys = mysqlTable(
  'idempotency_keys',
  {
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    idemKey: char('idem_key', { length: 36 }).notNull(),
    /** Method and path, e.g. `PUT /api/bodyweights/2026-12-01`. */
    route: varchar('route', { length: 255 }).notNull(),
    /** sha256 of route and canonical body: the same key with another request is refused. */
    fingerprint: char('fingerprint', { length: 64 }).notNull(),
    status: smallint('status', { unsigned: true }),
    response: mediumtext('response'),
    /** When the copy now handling it took the key (a claim left by a crashed instance goes stale). */
    claimedAt: datetime('claimed_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`UTC_TIMESTAMP(3)`),
    createdAt: datetime('created_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`UTC_TIMESTAMP(3)`),
  },
  (t) => [primaryKey({ columns: [t.userId, t.idemKey] }), index('idempotency_keys_created_idx').on(t.createdAt)],
);
