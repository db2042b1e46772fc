// SQL of the training week: the athlete-week row the coach edits and the athlete's session logs. Team-scoped.
import { and, eq, gte, lte } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athleteWeeks, athletes, sessionLogs } from '../../db/schema';
import type { SessionWork } from '../../../shared/schemas';

export async function athleteInTeam(db: Queryable, teamId: number, athleteId: number): Promise<boolean> {
  const [row] = await db
    .select({ id: athletes.id })
    .from(athletes)
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return Boolean(row);
}

export async function findAthleteWeek(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [row] = await db
    .select()
    .from(athleteWeeks)
    .where(and(eq(athleteWeeks.teamId, teamId), eq(athleteWeeks.athleteId, athleteId), eq(athleteWeeks.week, week)))
    .limit(1);
  return row ?? null;
}

type WeekValues = { deload: boolean; trainingMaxPct: number; work: Record<string, SessionWork>; updatedBy: number };

export async function insertAthleteWeek(
  db: Queryable,
  key: { teamId: number; athleteId: number; week: string },
  values: WeekValues,
) {
  await db.insert(athleteWeeks).values({ ...key, ...values });
}

export async function updateAthleteWeek(
  db: Queryable,
  key: { teamId: number; athleteId: number; week: string },
  version: number,
  values: WeekValues,
): Promise<boolean> {
  const [res] = await db
    .update(athleteWeeks)
    .set({ ...values, version: version + 1 })
    .where(
      and(
        eq(athleteWeeks.teamId, key.teamId),
        eq(athleteWeeks.athleteId, key.athleteId),
        eq(athleteWeeks.week, key.week),
        eq(athleteWeeks.version, version),
      ),
    );
  return res.affectedRows > 0;
}

export async function sessionLogsOf(db: Queryable, teamId: number, athleteId: number, week: string) {
  return db
    .select()
    .from(sessionLogs)
    .where(and(eq(sessionLogs.teamId, teamId), eq(sessionLogs.athleteId, athleteId), eq(sessionLogs.week, week)));
}

type LogKey = { teamId: number; athleteId: number; week: string; sessionId: string };
type LogValues = { speedSetsDone: number; accessorySetsDone: number[]; backOffDone: boolean[]; done: boolean };

export async function insertSessionLog(db: Queryable, key: LogKey, values: LogValues) {
  await db.insert(sessionLogs).values({ ...key, ...values });
}

export async function updateSessionLog(db: Queryable, key: LogKey, version: number, values: LogValues) {
  const [res] = await db
    .update(sessionLogs)
    .set({ ...values, version: version + 1 })
    .where(
      and(
        eq(sessionLogs.teamId, key.teamId),
        eq(sessionLogs.athleteId, key.athleteId),
        eq(sessionLogs.week, key.week),
        eq(sessionLogs.sessionId, key.sessionId),
        eq(sessionLogs.version, version),
      ),
    );
  return res.affectedRows > 0;
}

/** The athlete's stored weeks from `from` to `to` (inclusive): the accessories the rotation looks back on. */
export async function athleteWeeksBetween(db: Queryable, teamId: number, athleteId: number, from: string, to: string) {
  return db
    .select({ week: athleteWeeks.week, work: athleteWeeks.work })
    .from(athleteWeeks)
    .where(
      and(
        eq(athleteWeeks.teamId, teamId),
        eq(athleteWeeks.athleteId, athleteId),
        gte(athleteWeeks.week, from),
        lte(athleteWeeks.week, to),
      ),
    );
}
