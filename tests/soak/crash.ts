// MariaDB killed with SIGKILL and started again under a write load. Every write the app acknowledged
// (201) before, during or after the crash must be there afterwards: the bar is 0 lost.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { inArray } from 'drizzle-orm';
import request from 'supertest';
import mysql from 'mysql2/promise';
import { createApp } from '../../server/app';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { variants } from '../../server/db/schema';
import { loadEnv } from '../../server/config/env';
import { createLogger } from '../../server/lib/logger';
import { SessionKeys } from '../../server/lib/session';
import { createServices, stopServices } from '../../server/services';
import { startMariaDb } from '../../scripts/lib.mjs';
import { createTeam } from '../support/factories';

export interface CrashOptions {
  /** The MariaDB instance's folder name under .data/ and its port (its own, apart from any other). */
  name: string;
  port: number;
  /** Write load before the kill, and after the restart once writes go through again. */
  beforeMs: number;
  afterMs: number;
  workers: number;
  password: string;
  env: NodeJS.ProcessEnv;
}

export interface CrashReport {
  acknowledged: number;
  lost: number;
  refusedWhileDown: Record<string, number>;
  downForMs: number;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const DB = 'rackturn_crash';

export async function crashUnderLoad(opts: CrashOptions): Promise<CrashReport> {
  let instance = await startMariaDb({ name: opts.name, port: opts.port, databases: [DB] });
  // A clean database for each run.
  const admin = await mysql.createConnection({ uri: instance.urlFor(DB) });
  await admin.query(`DROP DATABASE IF EXISTS \`${DB}\``);
  await admin.query(`CREATE DATABASE \`${DB}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.end();

  const env = loadEnv({
    ...opts.env,
    DATABASE_URL: instance.urlFor(DB),
    LOG_LEVEL: 'silent',
    MAIL_SEND_INTERVAL_MS: '0',
  });
  const database = createDatabase(env.DATABASE_URL, { connectionLimit: opts.workers + 2 });
  await runMigrations(database.db);
  const logger = createLogger('silent');
  const services = createServices(env, logger);
  const app = createApp({ env, database, logger, sessions: new SessionKeys(env.SESSION_SECRET), services });
  try {
    const team = await createTeam(database.db);
    const login = await request(app).post('/api/auth/login').send({ email: team.coach.email, password: opts.password });
    const cookie = String(login.headers['set-cookie']).split(';')[0]!;

    const acknowledged: string[] = [];
    const refused: Record<string, number> = {};
    let phase: 'before' | 'down' | 'after' = 'before';
    let stop = false;
    let n = 0;
    const worker = async (w: number) => {
      while (!stop) {
        const name = `Crash ${w}-${n++}`;
        const res = await request(app)
          .post('/api/variants')
          .set('Cookie', cookie)
          .timeout(10_000)
          .send({
            name,
            lift: 'squat',
            family: 'box squat',
            bar: 'straight',
            equipment: [],
            emphasis: 'bottom',
            stress: { hip: 1 },
            risk: 1,
            specificity: 0.5,
            scheme: 'single',
            notes: null,
          })
          .then((r) => r.status)
          .catch(() => 0);
        if (res === 201) acknowledged.push(name);
        else {
          const key = `${phase}:${res}`;
          refused[key] = (refused[key] ?? 0) + 1;
          await sleep(50);
        }
      }
    };
    const load = Promise.all(Array.from({ length: opts.workers }, (_, w) => worker(w)));

    await sleep(opts.beforeMs);
    const pid = Number(readFileSync(join(instance.dir, 'mysqld.pid'), 'utf8'));
    const killedAt = Date.now();
    phase = 'down';
    process.kill(pid, 'SIGKILL');
    while (isAlive(pid)) await sleep(20);
    instance = await startMariaDb({ name: opts.name, port: opts.port, databases: [DB] });
    // Writes go through again once the pool has reconnected.
    const ackedBefore = acknowledged.length;
    while (acknowledged.length === ackedBefore && Date.now() - killedAt < 60_000) await sleep(50);
    const downForMs = Date.now() - killedAt;
    phase = 'after';
    await sleep(opts.afterMs);
    stop = true;
    await load;

    const found = new Set<string>();
    for (let i = 0; i < acknowledged.length; i += 500) {
      const rows = await database.db
        .select({ name: variants.name })
        .from(variants)
        .where(inArray(variants.name, acknowledged.slice(i, i + 500)));
      for (const r of rows) found.add(r.name);
    }
    return {
      acknowledged: acknowledged.length,
      lost: acknowledged.filter((a) => !found.has(a)).length,
      refusedWhileDown: refused,
      downForMs,
    };
  } finally {
    await stopServices(services);
    await database.close().catch(() => undefined);
    await instance.stop();
  }
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
