// The team's exercise library: max-effort variants with their joint stress, risk and specificity.
import {
  datetime,
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
import { emphasisSchema } from '../../../shared/schemas/library';
import { liftSchema } from '../../../shared/schemas/rules';
import { schemeSchema } from '../../../shared/schemas/training';
import { createdAt, enumValues, id, updatedAt, version } from './columns';
import { teamRef } from './auth';

export type StressMap = Partial<Record<'shoulder' | 'elbow' | 'wrist' | 'lowerBack' | 'hip' | 'knee', number>>;

export const variants = mysqlTable(
  'variants',
  {
    id: id(),
    teamId: teamRef(),
    name: varchar('name', { length: 120 }).notNull(),
    lift: mysqlEnum('lift', enumValues(liftSchema.options)).notNull(),
    family: varchar('family', { length: 60 }).notNull(),
    bar: varchar('bar', { length: 40 }).notNull(),
    equipment: json('equipment').$type<string[]>().notNull(),
    emphasis: mysqlEnum('emphasis', enumValues(emphasisSchema.options)).notNull(),
    stress: json('stress').$type<StressMap>().notNull(),
    risk: tinyint('risk', { unsigned: true }).notNull(),
    specificity: decimal('specificity', { precision: 3, scale: 2, mode: 'number' }).notNull(),
    scheme: mysqlEnum('scheme', enumValues(schemeSchema.options)).notNull().default('single'),
    notes: text('notes'),
    /** Only for the last N weeks before an athlete's meet (openers, meet rehearsals); null: any week. */
    meetPhaseWeeks: tinyint('meet_phase_weeks', { unsigned: true }),
    archivedAt: datetime('archived_at', { mode: 'date', fsp: 3 }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('variants_team_name_uq').on(t.teamId, t.name),
    index('variants_team_lift_idx').on(t.teamId, t.lift),
  ],
);

/** Accessory exercises (upper back, lats, triceps…) the week's sessions are filled from, per team. */
export const accessories = mysqlTable(
  'accessories',
  {
    id: id(),
    teamId: teamRef(),
    name: varchar('name', { length: 60 }).notNull(),
    category: varchar('category', { length: 20 }).notNull(),
    stress: json('stress').$type<StressMap>().notNull(),
    sets: tinyint('sets', { unsigned: true }).notNull(),
    reps: tinyint('reps', { unsigned: true }).notNull(),
    loadKg: decimal('load_kg', { precision: 5, scale: 1, mode: 'number' }),
    rpe: decimal('rpe', { precision: 3, scale: 1, mode: 'number' }),
    notes: text('notes'),
    archivedAt: datetime('archived_at', { mode: 'date', fsp: 3 }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('accessories_team_name_uq').on(t.teamId, t.name),
    index('accessories_team_category_idx').on(t.teamId, t.category),
  ],
);
