// What the phone and API benchmarks run against: a fresh database with the demo club and the board
// bench's 40-athlete team, the built client, and speed-target.ts in its own process (app + bare baseline).
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import mysql from 'mysql2/promise';
import { ROOT, startMariaDb } from '../../scripts/lib.mjs';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/demo';
import { buildClient, seed as seedBoardTeam } from './board';

export interface SpeedStack {
  /** The app, serving the built client and the API. */
  origin: string;
  /** The bare Express + mysql2 baseline. */
  bareOrigin: string;
  databaseUrl: string;
  stop(): Promise<void>;
}

const DB_NAME = 'rackturn_speed_bench';

export async function startSpeedStack(): Promise<SpeedStack> {
  const instance = process.env.TEST_INSTANCE ?? 'test';
  const db = await startMariaDb({
    name: instance === 'test' ? 'test' : `test-${instance}`,
    port: Number(process.env.TEST_DB_PORT ?? 3308),
    databases: [DB_NAME],
  });
  let child: ChildProcess | undefined;
  try {
    const admin = await mysql.createConnection({ uri: db.urlFor('') });
    await admin.query(`DROP DATABASE IF EXISTS \`${DB_NAME}\``);
    await admin.query(`CREATE DATABASE \`${DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await admin.end();
    const url = db.urlFor(DB_NAME);
    const migrating = createDatabase(url);
    await runMigrations(migrating.db);
    await migrating.close();
    // The board team first: its seed reads every variant in the database as its own library.
    await seedBoardTeam(url);
    const seeding = createDatabase(url);
    await seedDemo(seeding.db);
    await seeding.close();

    const dist = join(ROOT, '.tmp', `speed-dist-${instance}`);
    buildClient(dist);

    const appPort = Number(process.env.TEST_APP_PORT ?? 3100);
    const barePort = appPort + 1;
    const nodeArgs = [
      '--import',
      'tsx',
      ...(process.env.BENCH_CPU_PROF ? ['--cpu-prof', '--cpu-prof-dir=.tmp/prof'] : []),
    ];
    child = spawn(process.execPath, [...nodeArgs, join(ROOT, 'tests/bench/speed-target.ts')], {
      cwd: ROOT,
      env: {
        ...process.env,
        DATABASE_URL: url,
        CLIENT_DIST: dist,
        APP_PORT: String(appPort),
        BARE_PORT: String(barePort),
      },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    const started = child;
    await new Promise<void>((resolve, reject) => {
      started.once('exit', (code) => reject(new Error(`speed-target exited with ${code}`)));
      createInterface({ input: started.stdout! }).on('line', (line) => line === 'ready' && resolve());
    });
    return {
      origin: `http://127.0.0.1:${appPort}`,
      bareOrigin: `http://127.0.0.1:${barePort}`,
      databaseUrl: url,
      async stop() {
        started.removeAllListeners('exit');
        const exited = new Promise((r) => started.once('exit', r));
        started.kill('SIGTERM');
        await exited;
        await db.stop();
      },
    };
  } catch (err) {
    child?.kill('SIGTERM');
    await db.stop();
    throw err;
  }
}

/** Signs in through the API and returns the session cookie. */
export async function signIn(origin: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${origin}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email}: ${res.status} ${await res.text()}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}
