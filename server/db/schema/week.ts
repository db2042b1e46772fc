// The whole training week per athlete: the coach's speed and accessory work with the deload mark and
// training-max share (one row per athlete-week), and what the athlete logged of each session.
import { boolean, char, index, json, mysqlTable, tinyint, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import type { SessionWork } from '../../../shared/schemas/week';
import { id, ref, updatedAt, version } from './columns';
import { teamRef, users } from './auth';
import { athleteRef } from './roster';

export const athleteWeeks = mysqlTable(
  'athlete_weeks',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    deload: boolean('deload').notNull().default(false),
    trainingMaxPct: tinyint('training_max_pct', { unsigned: true }).notNull(),
    work: json('work').$type<Record<string, SessionWork>>().notNull(),
    version: version(),
    updatedBy: ref('updated_by').references(() => users.id, { onDelete: 'set null' }),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('athlete_weeks_athlete_week_uq').on(t.athleteId, t.week),
    index('athlete_weeks_team_week_idx').on(t.teamId, t.week),
  ],
);

export const sessionLogs = mysqlTable(
  'session_logs',
  {
    id: id(),
    teamId: teamRef(),
    athleteId: athleteRef(),
    week: char('week', { length: 8 }).notNull(),
    sessionId: varchar('session_id', { length: 32 }).notNull(),
    speedSetsDone: tinyint('speed_sets_done', { unsigned: true }).notNull().default(0),
    accessorySetsDone: json('accessory_sets_done').$type<number[]>().notNull(),
    /** Each back-off set after the max-effort top set, ticked done or not. */
    backOffDone: json('back_off_done').$type<boolean[]>().notNull().default([]),
    done: boolean('done').notNull().default(false),
    version: version(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('session_logs_athlete_week_session_uq').on(t.athleteId, t.week, t.sessionId)],
);
