// Athletes of a team, their injury restrictions, team rules, meets and who competes in them.
import {
  date,
  datetime,
  decimal,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  smallint,
  text,
  tinyint,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { EQUIPMENT } from '../../../shared/calc/meet';
import { jointSchema } from '../../../shared/schemas/rules';
import { divisionSchema, sexSchema } from '../../../shared/schemas/roster';
import { createdAt, enumValues, id, ref, updatedAt, version } from './columns';
import { teamRef, teams, users } from './auth';

export const athletes = mysqlTable(
  'athletes',
  {
    id: id(),
    teamId: teamRef(),
    userId: ref('user_id').references(() => users.id, { onDelete: 'set null' }),
    name: varchar('name', { length: 120 }).notNull(),
    sex: mysqlEnum('sex', enumValues(sexSchema.options)).notNull(),
    birthYear: smallint('birth_year', { unsigned: true }),
    division: mysqlEnum('division', enumValues(divisionSchema.options)).notNull().default('open'),
    /** The heaviest risk tier (1–3) the engine may pick for this athlete; null: no ceiling. */
    maxRisk: tinyint('max_risk', { unsigned: true }),
    equipment: json('equipment').$type<string[]>().notNull(),
    ruleOverrides: json('rule_overrides').$type<Record<string, unknown>>().notNull(),
    notes: text('notes'),
    archivedAt: datetime('archived_at', { mode: 'date', fsp: 3 }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('athletes_team_idx').on(t.teamId), uniqueIndex('athletes_team_user_uq').on(t.teamId, t.userId)],
);

/** The athlete a row belongs to; it goes with the athlete. */
export const athleteRef = () =>
  ref('athlete_id')
    .notNull()
    .references(() => athletes.id, { onDelete: 'cascade' });

export const restrictions = mysqlTable(
  'restrictions',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    /** A joint and its stress cap, or null when the restriction is by emphasis or family only. */
    joint: mysqlEnum('joint', enumValues(jointSchema.options)),
    maxStress: tinyint('max_stress', { unsigned: true }),
    /** Emphases no pick may have while the restriction is in force. */
    emphasis: json('emphasis').$type<('bottom' | 'midRange' | 'lockout')[]>().notNull().default([]),
    /** Families no pick may belong to while the restriction is in force. */
    families: json('families').$type<string[]>().notNull().default([]),
    fromDate: date('from_date', { mode: 'string' }).notNull(),
    toDate: date('to_date', { mode: 'string' }),
    note: varchar('note', { length: 500 }),
    createdBy: ref('created_by').references(() => users.id, { onDelete: 'set null' }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('restrictions_athlete_idx').on(t.athleteId)],
);

/** Rest or deload weeks: the athlete gets no max-effort pick in that ISO week. */
export const restWeeks = mysqlTable(
  'rest_weeks',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: varchar('week', { length: 8 }).notNull(),
    createdBy: ref('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('rest_weeks_athlete_week_uq').on(t.athleteId, t.week), index('rest_weeks_team_idx').on(t.teamId)],
);

/** One row per team: rotation windows, joint budgets, taper rules, slots, gym equipment and the plan seed. */
export const teamRules = mysqlTable('team_rules', {
  teamId: ref('team_id')
    .primaryKey()
    .references(() => teams.id, { onDelete: 'cascade' }),
  rules: json('rules').$type<Record<string, unknown>>().notNull(),
  equipment: json('equipment').$type<string[]>().notNull(),
  seed: varchar('seed', { length: 64 }).notNull(),
  version: version(),
  updatedBy: ref('updated_by').references(() => users.id, { onDelete: 'set null' }),
  updatedAt: updatedAt(),
});

export const meets = mysqlTable(
  'meets',
  {
    id: id(),
    teamId: teamRef(),
    name: varchar('name', { length: 160 }).notNull(),
    date: date('date', { mode: 'string' }).notNull(),
    location: varchar('location', { length: 160 }),
    federation: varchar('federation', { length: 120 }),
    notes: text('notes'),
    /** Classic or equipped: picks the points coefficients on meet day. */
    equipment: mysqlEnum('equipment', enumValues(EQUIPMENT)).notNull().default('classic'),
    /** When the meet's results were written into the athletes' histories (once only). */
    resultsSavedAt: datetime('results_saved_at', { mode: 'date', fsp: 3 }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('meets_team_date_idx').on(t.teamId, t.date)],
);

export interface AttemptPlan {
  squat?: number[];
  bench?: number[];
  deadlift?: number[];
}

export const meetEntries = mysqlTable(
  'meet_entries',
  {
    id: id(),
    teamId: teamRef(),
    meetId: ref('meet_id')
      .notNull()
      .references(() => meets.id, { onDelete: 'cascade' }),
    athleteId: athleteRef(),
    weightClass: varchar('weight_class', { length: 8 }),
    division: mysqlEnum('division', enumValues(divisionSchema.options)).notNull().default('open'),
    attempts: json('attempts').$type<AttemptPlan>().notNull(),
    /** Bodyweight at the weigh-in, checked against the class limit. */
    weighInKg: decimal('weigh_in_kg', { precision: 5, scale: 2, mode: 'number' }),
    flight: varchar('flight', { length: 2 }).notNull().default('A'),
    /** Lot number: breaks ties in the lifting order. */
    lot: smallint('lot', { unsigned: true }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('meet_entries_meet_athlete_uq').on(t.meetId, t.athleteId),
    index('meet_entries_athlete_idx').on(t.athleteId),
  ],
);
