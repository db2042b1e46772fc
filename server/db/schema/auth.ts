// Teams (the tenant), user accounts, their role in a team, invitations and password-reset tokens.
import { sql } from 'drizzle-orm';
import {
  boolean,
  char,
  datetime,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { roleSchema, unitSchema } from '../../../shared/schemas/common';
import { createdAt, enumValues, id, ref, updatedAt } from './columns';

export const teams = mysqlTable('teams', {
  id: id(),
  name: varchar('name', { length: 120 }).notNull(),
  unit: mysqlEnum('unit', enumValues(unitSchema.options)).notNull().default('kg'),
  currency: char('currency', { length: 3 }).notNull().default('EUR'),
  createdAt: createdAt(),
});

/** The owning team; a team's rows go with it. */
export const teamRef = () =>
  ref('team_id')
    .notNull()
    .references(() => teams.id, { onDelete: 'cascade' });

export const users = mysqlTable(
  'users',
  {
    id: id(),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    passwordHash: varchar('password_hash', { length: 100 }).notNull(),
    unit: mysqlEnum('unit', enumValues(unitSchema.options)).notNull().default('kg'),
    weeklyEmail: boolean('weekly_email').notNull().default(true),
    passwordChangedAt: datetime('password_changed_at', { mode: 'date', fsp: 3 }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('users_email_uq').on(t.email)],
);

export const memberships = mysqlTable(
  'memberships',
  {
    id: id(),
    teamId: teamRef(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', enumValues(roleSchema.options)).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('memberships_team_user_uq').on(t.teamId, t.userId), index('memberships_user_idx').on(t.userId)],
);

export const invitations = mysqlTable(
  'invitations',
  {
    id: id(),
    teamId: teamRef(),
    email: varchar('email', { length: 254 }).notNull(),
    role: mysqlEnum('role', enumValues(roleSchema.options)).notNull(),
    athleteId: ref('athlete_id'),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    acceptedAt: datetime('accepted_at', { mode: 'date', fsp: 3 }),
    revokedAt: datetime('revoked_at', { mode: 'date', fsp: 3 }),
    invitedBy: ref('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    /**
     * The address while the invitation is open (neither accepted nor revoked), else NULL. A unique index
     * ignores NULLs, so (team, open address) makes "one open invitation per team and address" a fact.
     */
    openEmail: varchar('open_email', { length: 254 }).generatedAlwaysAs(
      sql`(case when \`accepted_at\` is null and \`revoked_at\` is null then \`email\` end)`,
      { mode: 'stored' },
    ),
  },
  (t) => [
    uniqueIndex('invitations_token_uq').on(t.tokenHash),
    index('invitations_team_email_idx').on(t.teamId, t.email),
    uniqueIndex('invitations_team_open_email_uq').on(t.teamId, t.openEmail),
  ],
);

export const passwordResets = mysqlTable(
  'password_resets',
  {
    id: id(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    usedAt: datetime('used_at', { mode: 'date', fsp: 3 }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('password_resets_token_uq').on(t.tokenHash), index('password_resets_user_idx').on(t.userId)],
);

/**
 * Signed-in sessions. The browser holds a random id; only its keyed hash is stored, so a copy of this
 * table signs nobody in. Deleting a row ends that session on every instance (after their short cache).
 */
export const sessions = mysqlTable(
  'sessions',
  {
    id: id(),
    idHash: char('id_hash', { length: 64 }).notNull(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    teamId: teamRef(),
    /** The role the session was granted; a different role in the membership ends the session. */
    role: mysqlEnum('role', enumValues(roleSchema.options)).notNull(),
    userAgent: varchar('user_agent', { length: 255 }),
    createdAt: createdAt(),
    lastSeenAt: datetime('last_seen_at', { mode: 'date', fsp: 3 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
  },
  (t) => [
    uniqueIndex('sessions_id_hash_uq').on(t.idHash),
    index('sessions_user_idx').on(t.userId),
    index('sessions_expires_idx').on(t.expiresAt),
  ],
);

/**
 * Failed sign-ins per key (account and address together, or address alone; hashed, so the table holds
 * no addresses) and until when that key is held back. In MariaDB so every instance counts together.
 */
export const signInLimits = mysqlTable(
  'sign_in_limits',
  {
    keyHash: char('key_hash', { length: 64 }).primaryKey(),
    failures: int('failures', { unsigned: true }).notNull().default(0),
    lastFailureAt: datetime('last_failure_at', { mode: 'date', fsp: 3 }).notNull(),
    blockedUntil: datetime('blocked_until', { mode: 'date', fsp: 3 }),
  },
  (t) => [index('sign_in_limits_last_failure_idx').on(t.lastFailureAt)],
);

/**
 * Request counters of the rate-limited routes (password reset, accepting an invitation) per hashed key, with
 * the end of their window. In MariaDB so every instance counts together.
 */
export const rateLimitHits = mysqlTable(
  'rate_limit_hits',
  {
    keyHash: char('key_hash', { length: 64 }).primaryKey(),
    hits: int('hits', { unsigned: true }).notNull().default(0),
    resetAt: datetime('reset_at', { mode: 'date', fsp: 3 }).notNull(),
  },
  (t) => [index('rate_limit_hits_reset_idx').on(t.resetAt)],
);
