// Teams (the tenant), user accounts, their role in a team, invitations and password-reset tokens.
import { boolean, char, datetime, index, mysqlEnum, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id, ref, updatedAt } from './columns';

export const roles = ['head_coach', 'coach', 'athlete'] as const;

export const teams = mysqlTable('teams', {
  id: id(),
  name: varchar('name', { length: 120 }).notNull(),
  unit: mysqlEnum('unit', ['kg', 'lb']).notNull().default('kg'),
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
    unit: mysqlEnum('unit', ['kg', 'lb']).notNull().default('kg'),
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
    role: mysqlEnum('role', roles).notNull(),
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
    role: mysqlEnum('role', roles).notNull(),
    athleteId: ref('athlete_id'),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    acceptedAt: datetime('accepted_at', { mode: 'date', fsp: 3 }),
    revokedAt: datetime('revoked_at', { mode: 'date', fsp: 3 }),
    invitedBy: ref('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('invitations_token_uq').on(t.tokenHash),
    index('invitations_team_email_idx').on(t.teamId, t.email),
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
