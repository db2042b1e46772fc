// End-to-end: build the client, start the real server on a fresh database seeded with the demo, and
// hand its URL to the tests. The server is stopped afterwards.
import type { TestProject } from 'vitest/node';
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { join, resolve } from 'node:path';
import { recreateDatabase } from '../../support/integration-setup';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    e2eDatabaseUrl: string;
  }
}

const ROOT = resolve(import.meta.dirname, '../../..');
let server: ChildProcess | null = null;

export default async function setup(project: TestProject) {
  const databaseUrl = await recreateDatabase('rackturn_e2e');
  const dist = join(ROOT, '.tmp', `e2e-dist-${process.env.TEST_INSTANCE ?? 'test'}`);
  const build = spawnSync(
    join(ROOT, 'node_modules/.bin/vite'),
    ['build', '--outDir', dist, '--emptyOutDir', '--logLevel', 'warn'],
    {
      cwd: ROOT,
      stdio: 'inherit',
    },
  );
  if (build.status !== 0) throw new Error('vite build failed');

  const port = Number(process.env.TEST_APP_PORT ?? 3100);
  const baseUrl = `http://127.0.0.1:${port}`;
  server = spawn(join(ROOT, 'node_modules/.bin/tsx'), ['server/index.ts'], {
    cwd: ROOT,
    stdio: ['ignore', 'ignore', 'inherit'],
    detached: true,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: process.env.TEST_SESSION_SECRET ?? 'e2e-secret-e2e-secret-e2e-secret-e2e',
      APP_ORIGIN: baseUrl,
      CLIENT_DIST: dist,
      DB_MIGRATE: '1',
      SEED_DEMO: '1',
      LOG_LEVEL: 'warn',
      LOGIN_LIMIT_PER_IP: '10000',
      LOGIN_LIMIT_PER_ACCOUNT: '10000',
    },
  });
  const deadline = Date.now() + 90_000;
  for (;;) {
    if (server.exitCode !== null) throw new Error(`the e2e server exited with ${server.exitCode}`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) break;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline) throw new Error('the e2e server did not come up');
    await new Promise((r) => setTimeout(r, 200));
  }
  project.provide('baseUrl', baseUrl);
  project.provide('e2eDatabaseUrl', databaseUrl);

  return async () => {
    if (server?.pid && server.exitCode === null) {
      const gone = new Promise((r) => server!.once('exit', r));
      process.kill(-server.pid, 'SIGTERM');
      await Promise.race([gone, new Promise((r) => setTimeout(r, 10_000))]);
    }
  };
}
