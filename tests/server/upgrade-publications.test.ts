// Upgrading a database that published weeks before publication was kept per athlete: the data migration records
// each athlete of a published week as sent their picks, so no week an athlete could see goes back to draft.
import { afterAll, describe, expect, it } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mysql from 'mysql2/promise';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import { createDatabase } from '../../server/db/client';
import { migrationsFolder, runMigrations } from '../../server/db/migrate';
import { testDatabaseUrl } from '../support/integration-setup';

const NAME = `rackturn_upgrade_${process.pid}`;
const BACKFILL = '0013_athlete_publications_from_team_weeks';
const dirs: string[] = [];

afterAll(async () => {
  const conn = await mysql.createConnection({ uri: testDatabaseUrl('') });
  await conn.query(`DROP DATABASE IF EXISTS \`${NAME}\``);
  await conn.end();
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

/** The committed migrations up to (not including) `tag`, as a folder the migrator can read. */
function migrationsBefore(tag: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'migrations-'));
  dirs.push(dir);
  cpSync(migrationsFolder, dir, { recursive: true });
  const journalPath = join(dir, 'meta', '_journal.json');
  const journal = JSON.parse(readFileSync(journalPath, 'utf8')) as { entries: { tag: string }[] };
  const at = journal.entries.findIndex((e) => e.tag === tag);
  expect(at).toBeGreaterThan(0);
  journal.entries = journal.entries.slice(0, at);
  writeFileSync(journalPath, JSON.stringify(journal));
  return dir;
}

describe('upgrading to per-athlete publication', () => {
  it('keeps every week published before the upgrade published, with its picks', async () => {
    const admin = await mysql.createConnection({ uri: testDatabaseUrl('') });
    await admin.query(`DROP DATABASE IF EXISTS \`${NAME}\``);
    await admin.query(`CREATE DATABASE \`${NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await admin.end();
    const database = createDatabase(testDatabaseUrl(NAME), { connectionLimit: 2 });
    try {
      await migrate(database.db, { migrationsFolder: migrationsBefore(BACKFILL) });
      const q = (sql: string, params: unknown[] = []) => database.pool.query(sql, params);
      await q(`INSERT INTO teams (id, name) VALUES (1, 'Upgrade Club')`);
      await q(
        `INSERT INTO athletes (id, team_id, name, sex, equipment, rule_overrides) VALUES (1, 1, 'Published Athlete', 'F', '[]', '{}'), (2, 1, 'Empty Athlete', 'M', '[]', '{}')`,
      );
      await q(
        `INSERT INTO variants (id, team_id, name, lift, family, bar, equipment, emphasis, stress, risk, specificity)
         VALUES (1, 1, 'Box squat', 'squat', 'box squat', 'straight', '[]', 'bottom', '{}', 1, 0.7),
                (2, 1, 'Floor press', 'bench', 'floor press', 'straight', '[]', 'lockout', '{}', 1, 0.6)`,
      );
      await q(
        `INSERT INTO plan_entries (team_id, athlete_id, week, slot_id, variant_id, source, reasons)
         VALUES (1, 1, '2026-W10', 'lower', 1, 'engine', '[]'), (1, 1, '2026-W10', 'upper', 2, 'engine', '[]'),
                (1, 1, '2026-W11', 'lower', 1, 'engine', '[]')`,
      );
      // W10 was published; W11 was still a draft.
      await q(`INSERT INTO week_publications (team_id, week) VALUES (1, '2026-W10')`);

      await runMigrations(database.db);

      const [rows] = (await q(
        `SELECT athlete_id AS athleteId, week, picks FROM athlete_week_publications ORDER BY athlete_id, week`,
      )) as unknown as [{ athleteId: number; week: string; picks: string | unknown[] }[]];
      expect(rows.map((r) => [Number(r.athleteId), r.week])).toEqual([[1, '2026-W10']]);
      const picks = typeof rows[0]!.picks === 'string' ? JSON.parse(rows[0]!.picks) : rows[0]!.picks;
      expect(
        (picks as { slotId: string; variantId: number; variantName: string }[]).sort((a, b) =>
          a.slotId.localeCompare(b.slotId),
        ),
      ).toEqual([
        { slotId: 'lower', variantId: 1, variantName: 'Box squat' },
        { slotId: 'upper', variantId: 2, variantName: 'Floor press' },
      ]);
    } finally {
      await database.close();
    }
  });
});
