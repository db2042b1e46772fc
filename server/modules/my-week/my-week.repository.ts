// SQL for the athlete's week: whether the coach has published it, and the fingerprint of every row the
// answer reads (for the answer cache). The week's picks come from the plans module.
import { and, eq, getTableColumns, getTableName } from 'drizzle-orm';
import type { MySqlTable } from 'drizzle-orm/mysql-core';
import type { Pool, RowDataPacket } from 'mysql2/promise';
import type { Queryable } from '../../db/client';
import {
  athletes,
  athleteWeekPublications,
  athleteWeeks,
  bodyweights,
  meetEntries,
  meets,
  planEntries,
  restWeeks,
  restrictions,
  sessionLogs,
  teamRules,
  tissueCheckins,
  tissuePrescriptions,
  topSets,
  users,
  variants,
} from '../../db/schema';

/** Whether the coach has published this athlete's week (without it the week is a draft). */
export async function isWeekPublished(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [row] = await db
    .select({ id: athleteWeekPublications.id })
    .from(athleteWeekPublications)
    .where(
      and(
        eq(athleteWeekPublications.teamId, teamId),
        eq(athleteWeekPublications.athleteId, athleteId),
        eq(athleteWeekPublications.week, week),
      ),
    )
    .limit(1);
  return !!row;
}

/** What a fingerprint part's placeholders stand for, in order. */
type Param = 'team' | 'athlete' | 'week' | 'since';

interface FingerprintPart {
  table: MySqlTable;
  /** FROM … WHERE … naming the table `t`: the rows covered. */
  rows: string;
  params: Param[];
}

/** The athlete's own rows of a table, by team and athlete (and week). */
const own = (table: MySqlTable, byWeek = false): FingerprintPart => ({
  table,
  rows: `FROM \`${getTableName(table)}\` t WHERE t.team_id = ? AND t.athlete_id = ?${byWeek ? ' AND t.week = ?' : ''}`,
  params: byWeek ? ['team', 'athlete', 'week'] : ['team', 'athlete'],
});

/**
 * Every row the athlete's week is read from, per table: what an answer kept between requests depends on.
 * The rows are a superset of what the page reads. A query added to the page must read only rows listed
 * here: the answers test holds the tables the page reads to this list.
 */
const FINGERPRINT_PARTS: FingerprintPart[] = [
  { table: athletes, rows: 'FROM athletes t WHERE t.team_id = ? AND t.id = ?', params: ['team', 'athlete'] },
  {
    table: users,
    rows: 'FROM athletes a JOIN users t ON t.id = a.user_id WHERE a.team_id = ? AND a.id = ?',
    params: ['team', 'athlete'],
  },
  { table: teamRules, rows: 'FROM team_rules t WHERE t.team_id = ?', params: ['team'] },
  own(planEntries, true),
  // The team's library: a superset of the week's picks and the variants with the athlete's top sets, read
  // without a join (an edit anywhere in the library is rare and only rebuilds the answer once).
  { table: variants, rows: 'FROM variants t WHERE t.team_id = ?', params: ['team'] },
  own(topSets),
  own(tissuePrescriptions),
  own(tissueCheckins),
  // The athlete's restrictions keep restricted joints out of the week's tissue work.
  own(restrictions),
  own(meetEntries),
  {
    table: meets,
    rows: 'FROM meet_entries e JOIN meets t ON t.id = e.meet_id WHERE e.team_id = ? AND e.athlete_id = ? AND t.team_id = ?',
    params: ['team', 'athlete', 'team'],
  },
  {
    // The page shows the readings since a day derived from today, which is part of the answer's key.
    table: bodyweights,
    rows: 'FROM bodyweights t WHERE t.team_id = ? AND t.athlete_id = ? AND t.measured_on >= ?',
    params: ['team', 'athlete', 'since'],
  },
  own(athleteWeekPublications, true),
  // The week's sessions: the coach's training week of the athlete and what the athlete logged of it.
  own(athleteWeeks, true),
  own(sessionLogs, true),
  // A rest week has no back-off sets.
  own(restWeeks, true),
];

/** The tables the fingerprint covers (for the test that holds the page to them). */
export const FINGERPRINT_TABLES: readonly string[] = FINGERPRINT_PARTS.map((p) => getTableName(p.table));

/**
 * One part: the row count and sums that change with any insert, update or delete of the rows. A table
 * with optimistic-lock versions and a write stamp (every update bumps one, the schema's update hook sets
 * the other) is summed over id, version and stamp; any other table over a 60-bit slice of each row's MD5
 * of all its columns (taken from the schema, so a column added later is covered too).
 */
function partSql({ table, rows }: FingerprintPart): string {
  const names = Object.values(getTableColumns(table)).map((c) => c.name);
  const stamp = ['updated_at', 'published_at'].find((c) => names.includes(c));
  if (stamp && names.includes('version')) {
    const id = names.includes('id') ? 't.id' : '0';
    return `(SELECT CONCAT_WS('.', COUNT(*), SUM(${id}), SUM(t.version), SUM(UNIX_TIMESTAMP(t.${stamp}))) ${rows})`;
  }
  const row = `JSON_ARRAY(${names.map((c) => `t.\`${c}\``).join(', ')})`;
  return `(SELECT CONCAT(COUNT(*), '.', COALESCE(SUM(CAST(CONV(LEFT(MD5(${row}), 15), 16, 10) AS UNSIGNED)), 0)) ${rows})`;
}

const FINGERPRINT_SQL = `SELECT CONCAT_WS('|', ${FINGERPRINT_PARTS.map(partSql).join(', ')}) AS fp`;

/**
 * One query whose answer changes whenever anything the athlete's week is read from changes, by any app
 * instance: equal fingerprints mean the same rows. `since` is the first day of the bodyweights shown.
 */
export async function weekFingerprint(
  pool: Pick<Pool, 'execute'>,
  who: { teamId: number; athleteId: number },
  week: string,
  since: string,
): Promise<string> {
  const values = { team: who.teamId, athlete: who.athleteId, week, since };
  const params = FINGERPRINT_PARTS.flatMap((p) => p.params.map((name) => values[name]));
  // A prepared statement (kept per connection by mysql2): the server parses and plans the long query once.
  const [rows] = await pool.execute<(RowDataPacket & { fp: string | null })[]>(FINGERPRINT_SQL, params);
  return rows[0]!.fp ?? '';
}
