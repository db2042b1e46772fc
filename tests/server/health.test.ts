// Health and recovery: with its own MariaDB instance, stopped and started under a running app.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createDatabase, type Database } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { createLogger } from '../../server/lib/logger';
import { SessionKeys } from '../../server/lib/session';
import { startMariaDb, type MariaDbInstance } from '../../scripts/lib.mjs';
import { testEnv } from '../support/app';
import { createServices, stopServices, type Services } from '../../server/services';

let instance: MariaDbInstance;
let database: Database;
let app: ReturnType<typeof createApp>;
let services: Services | undefined;
const PORT = Number(process.env.TEST_DB_PORT ?? 3308) + 10;
const NAME = `${process.env.TEST_INSTANCE ?? 'test'}-outage`;

beforeAll(async () => {
  instance = await startMariaDb({ name: NAME, port: PORT, databases: ['rackturn_outage'] });
  const env = testEnv({ DATABASE_URL: instance.urlFor('rackturn_outage') });
  database = createDatabase(env.DATABASE_URL, { connectionLimit: 3 });
  await runMigrations(database.db);
  const logger = createLogger('silent');
  services = createServices(env, logger);
  app = createApp({
    env,
    database,
    logger,
    sessions: new SessionKeys(env.SESSION_SECRET),
    services,
  });
}, 60_000);

afterAll(async () => {
  if (services) await stopServices(services);
  await database?.close().catch(() => undefined);
  await instance?.stop();
});

describe('GET /api/health', () => {
  it('says up while MariaDB answers, down with 503 while it is stopped, and recovers without a restart', async () => {
    const up = await request(app).get('/api/health');
    expect(up.status).toBe(200);
    expect(up.body).toEqual({ ok: true, db: 'up', replica: 'none' });

    await instance.stop();
    const down = await request(app).get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body).toEqual({ ok: false, db: 'down', replica: 'none' });
    // Other routes answer a clear 503 or 401, never a 500 with internals.
    const login = await request(app).post('/api/auth/login').send({ email: 'a@b.test', password: 'whatever-pass' });
    expect(login.status).toBe(503);
    expect(login.body.error.code).toBe('db_unavailable');

    instance = await startMariaDb({ name: NAME, port: PORT, databases: ['rackturn_outage'] });
    let status = 0;
    for (let i = 0; i < 30 && status !== 200; i++) {
      status = (await request(app).get('/api/health')).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(status).toBe(200);
    const after = await request(app).post('/api/auth/login').send({ email: 'a@b.test', password: 'whatever-pass' });
    expect(after.status).toBe(401);
  }, 60_000);
});
