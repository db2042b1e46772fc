// What athletes report: top sets, bodyweights, connective-tissue work and next-day check-ins,
// and the videos of top sets with the coaches' comments.
import {
  bigint,
  char,
  date,
  decimal,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  text,
  tinyint,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { tissueKindSchema } from '../../../shared/schemas/training';
import { createdAt, enumValues, id, ref, updatedAt, version } from './columns';
import { teamRef, users } from './auth';
import { athleteRef } from './roster';
import { variants } from './library';
import { planEntries } from './plans';

export const videos = mysqlTable(
  'videos',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    storageKey: varchar('storage_key', { length: 200 }).notNull(),
    contentType: varchar('content_type', { length: 60 }).notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number', unsigned: true }).notNull(),
    originalName: varchar('original_name', { length: 255 }),
    uploadedBy: ref('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('videos_storage_key_uq').on(t.storageKey), index('videos_athlete_idx').on(t.athleteId)],
);

export const videoComments = mysqlTable(
  'video_comments',
  {
    id: id(),
    teamId: teamRef(),
    videoId: ref('video_id')
      .notNull()
      .references(() => videos.id, { onDelete: 'cascade' }),
    authorId: ref('author_id').references(() => users.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('video_comments_video_idx').on(t.videoId)],
);

export const topSets = mysqlTable(
  'top_sets',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    planEntryId: ref('plan_entry_id').references(() => planEntries.id, { onDelete: 'set null' }),
    variantId: ref('variant_id')
      .notNull()
      .references(() => variants.id),
    week: char('week', { length: 8 }).notNull(),
    performedOn: date('performed_on', { mode: 'string' }).notNull(),
    weightKg: decimal('weight_kg', { precision: 6, scale: 2, mode: 'number' }).notNull(),
    reps: tinyint('reps', { unsigned: true }).notNull(),
    rpe: decimal('rpe', { precision: 3, scale: 1, mode: 'number' }),
    e1rmKg: decimal('e1rm_kg', { precision: 6, scale: 2, mode: 'number' }).notNull(),
    note: varchar('note', { length: 500 }),
    videoId: ref('video_id').references(() => videos.id, { onDelete: 'set null' }),
    createdBy: ref('created_by').references(() => users.id, { onDelete: 'set null' }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('top_sets_athlete_variant_idx').on(t.athleteId, t.variantId),
    index('top_sets_entry_idx').on(t.planEntryId),
  ],
);

export const bodyweights = mysqlTable(
  'bodyweights',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    measuredOn: date('measured_on', { mode: 'string' }).notNull(),
    weightKg: decimal('weight_kg', { precision: 5, scale: 2, mode: 'number' }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('bodyweights_athlete_day_uq').on(t.athleteId, t.measuredOn)],
);

export const tissuePrescriptions = mysqlTable(
  'tissue_prescriptions',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    items: json('items').$type<unknown[]>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('tissue_prescriptions_athlete_week_uq').on(t.athleteId, t.week)],
);

export const tissueCheckins = mysqlTable(
  'tissue_checkins',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    kind: mysqlEnum('kind', enumValues(tissueKindSchema.options)).notNull(),
    soreness: tinyint('soreness', { unsigned: true }).notNull(),
    painJoints: json('pain_joints').$type<string[]>().notNull(),
    note: varchar('note', { length: 500 }),
    createdAt: createdAt(),
  },
  (t) => [index('tissue_checkins_athlete_week_idx').on(t.athleteId, t.week)],
);
