// The board: one plan entry per athlete × ISO week × max-effort slot, its append-only change history,
// and which weeks a coach has published to the athletes.
import {
  boolean,
  char,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  text,
  timestamp,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { planSourceSchema } from '../../../shared/schemas/plans';
import { createdAt, enumValues, id, ref, updatedAt, version } from './columns';
import { teamRef, users } from './auth';
import { athleteRef } from './roster';
import { variants } from './library';

export const planEntries = mysqlTable(
  'plan_entries',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    slotId: varchar('slot_id', { length: 32 }).notNull(),
    variantId: ref('variant_id').references(() => variants.id),
    source: mysqlEnum('source', enumValues(planSourceSchema.options)).notNull(),
    pinned: boolean('pinned').notNull().default(false),
    reason: text('reason'),
    reasons: json('reasons').$type<string[]>().notNull(),
    version: version(),
    updatedBy: ref('updated_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('plan_entries_cell_uq').on(t.athleteId, t.week, t.slotId),
    index('plan_entries_team_week_idx').on(t.teamId, t.week),
    index('plan_entries_variant_idx').on(t.variantId),
  ],
);

export const planEntryHistory = mysqlTable(
  'plan_entry_history',
  {
    id: id(),
    teamId: teamRef(),
    planEntryId: ref('plan_entry_id')
      .notNull()
      .references(() => planEntries.id, { onDelete: 'cascade' }),
    athleteId: ref('athlete_id').notNull(),
    week: char('week', { length: 8 }).notNull(),
    slotId: varchar('slot_id', { length: 32 }).notNull(),
    oldVariantId: ref('old_variant_id'),
    newVariantId: ref('new_variant_id'),
    source: mysqlEnum('source', enumValues(planSourceSchema.options)).notNull(),
    pinned: boolean('pinned').notNull(),
    reason: text('reason'),
    version: int('version', { unsigned: true }).notNull(),
    changedBy: ref('changed_by').references(() => users.id, { onDelete: 'set null' }),
    changedAt: createdAt(),
  },
  (t) => [index('plan_entry_history_entry_idx').on(t.planEntryId)],
);

export const weekPublications = mysqlTable(
  'week_publications',
  {
    id: id(),
    teamId: teamRef(),
    week: char('week', { length: 8 }).notNull(),
    publishedBy: ref('published_by').references(() => users.id, { onDelete: 'set null' }),
    publishedAt: createdAt(),
  },
  (t) => [uniqueIndex('week_publications_team_week_uq').on(t.teamId, t.week)],
);

/** What an athlete was last sent for a week: one line per slot, to name what changed in an update. */
export interface PublishedPick {
  slotId: string;
  variantId: number;
  variantName: string;
}

/**
 * A week of one athlete moves from draft to published: without a row here the week is a draft the athlete
 * does not see. `picks` is what the athlete was sent last, `version` counts publications (updates).
 */
export const athleteWeekPublications = mysqlTable(
  'athlete_week_publications',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    picks: json('picks').$type<PublishedPick[]>().notNull(),
    version: version(),
    publishedBy: ref('published_by').references(() => users.id, { onDelete: 'set null' }),
    publishedAt: timestamp('published_at', { mode: 'date', fsp: 3 })
      .notNull()
      .defaultNow()
      .$onUpdate(() => new Date()),
  },
  (t) => [uniqueIndex('athlete_week_publications_athlete_week_uq').on(t.athleteId, t.week)],
);
