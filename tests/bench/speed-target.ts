// The process the speed benchmarks load: the real app on APP_PORT and, on BARE_PORT, the bare Express +
// mysql2 baseline the app is compared with (same database, same data, one indexed query per answer).
// Runs apart from the load generator so the two never share an event loop. Started by speed-stack.ts;
// add --cpu-prof to the node arguments there (BENCH_CPU_PROF=1) to profile the app under load.
import { createServer } from 'node:http';
import express from 'express';
import mysql from 'mysql2/promise';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/config/env';
import { createDatabase } from '../../server/db/client';
import { createLogger } from '../../server/lib/logger';
import { SessionKeys } from '../../server/lib/session';
import { createServices, stopServices } from '../../server/services';

const appPort = Number(process.env.APP_PORT);
const barePort = Number(process.env.BARE_PORT);
const origin = `http://127.0.0.1:${appPort}`;

const env = loadEnv({
  ...process.env,
  NODE_ENV: 'test',
  SESSION_SECRET: 'speed-bench-secret-speed-bench-secret-0000',
  APP_ORIGIN: origin,
  LOG_LEVEL: 'silent',
  MAIL_SEND_INTERVAL_MS: '0',
  LOGIN_LIMIT_PER_IP: '100000',
  LOGIN_LIMIT_PER_ACCOUNT: '100000',
});
const database = createDatabase(env.DATABASE_URL);
const logger = createLogger('silent');
const services = createServices(env, logger);
const app = createApp({ env, database, logger, sessions: new SessionKeys(env.SESSION_SECRET), services });

/** The baseline: what a hand-written endpoint with no framework of ours costs for the same rows. */
const pool = mysql.createPool({ uri: env.DATABASE_URL, timezone: 'Z', connectionLimit: 10, dateStrings: ['DATE'] });
const bare = express();
bare.get('/my-week', async (req, res) => {
  // The athlete's picks of the week, through the unique (athlete, week, slot) index.
  const [rows] = await pool.query(
    `SELECT pe.id AS planEntryId, pe.slot_id AS slotId, v.id, v.name, v.lift, v.family, v.bar, v.specificity,
            v.scheme, v.notes
       FROM plan_entries pe JOIN variants v ON v.id = pe.variant_id
      WHERE pe.athlete_id = ? AND pe.week = ? AND pe.team_id = ?
      ORDER BY pe.slot_id`,
    [Number(req.query.athleteId), String(req.query.week), Number(req.query.teamId)],
  );
  res.json({ picks: rows });
});
bare.get('/board', async (req, res) => {
  // The same plan rows the board reads: every entry of the team's athletes.
  const [rows] = await pool.query(`SELECT * FROM plan_entries WHERE team_id = ? ORDER BY athlete_id, week, slot_id`, [
    Number(req.query.teamId),
  ]);
  res.json({ entries: rows });
});

// CPU time this process has used, so the bench can charge each load run its own CPU per request: a figure
// that holds on a busy machine, where requests per second mostly measure the neighbours.
bare.get('/__cpu', (_req, res) => {
  const { user, system } = process.cpuUsage();
  res.json({ ms: (user + system) / 1000 });
});

const servers = [createServer(app), createServer(bare)];
await Promise.all([
  new Promise<void>((r) => servers[0]!.listen(appPort, '127.0.0.1', r)),
  new Promise<void>((r) => servers[1]!.listen(barePort, '127.0.0.1', r)),
]);
process.stdout.write('ready\n');

async function stop() {
  await Promise.all(servers.map((s) => new Promise((r) => s.close(r))));
  await stopServices(services);
  await Promise.all([database.close(), pool.end()]);
  // process.exit() after the close, so a --cpu-prof profile is written.
  process.exit(0);
}
process.on('SIGTERM', () => void stop());
process.on('SIGINT', () => void stop());
