// Meet day: every attempt as judged (one row per athlete, lift and attempt number, with the idempotency
// key of the mark that created it) and each athlete's usual jumps between attempts.
import {
  boolean,
  decimal,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  tinyint,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { attemptResultSchema, meetLiftSchema } from '../../../shared/schemas/meet-day';
import { createdAt, enumValues, id, ref, updatedAt, version } from './columns';
import { teamRef, users } from './auth';
import { athletes, meetEntries, meets } from './roster';

export const meetAttempts = mysqlTable(
  'meet_attempts',
  {
    id: id(),
    teamId: teamRef(),
    meetId: ref('meet_id')
      .notNull()
      .references(() => meets.id, { onDelete: 'cascade' }),
    entryId: ref('entry_id')
      .notNull()
      .references(() => meetEntries.id, { onDelete: 'cascade' }),
    lift: mysqlEnum('lift', enumValues(meetLiftSchema.options)).notNull(),
    attemptNo: tinyint('attempt_no', { unsigned: true }).notNull(),
    weightKg: decimal('weight_kg', { precision: 6, scale: 2, mode: 'number' }).notNull(),
    record: boolean('record').notNull().default(false),
    result: mysqlEnum('result', enumValues(attemptResultSchema.options)).notNull(),
    /** Chosen by the client for each mark; a replay with the same key returns the same row. */
    idempotencyKey: varchar('idempotency_key', { length: 64 }).notNull(),
    markedBy: ref('marked_by').references(() => users.id, { onDelete: 'set null' }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('meet_attempts_slot_uq').on(t.entryId, t.lift, t.attemptNo),
    uniqueIndex('meet_attempts_key_uq').on(t.teamId, t.idempotencyKey),
    index('meet_attempts_meet_idx').on(t.meetId),
  ],
);

export interface AttemptJumps {
  squat: [number, number];
  bench: [number, number];
  deadlift: [number, number];
}

export const attemptJumps = mysqlTable('attempt_jumps', {
  athleteId: ref('athlete_id')
    .primaryKey()
    .references(() => athletes.id, { onDelete: 'cascade' }),
  teamId: teamRef(),
  jumps: json('jumps').$type<AttemptJumps>().notNull(),
  version: version(),
  updatedAt: updatedAt(),
});
