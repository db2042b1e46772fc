// One app per test file: createApp() on the real test database, with supertest agents per user.
import { afterAll, inject } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/config/env';
import type { AppContext } from '../../server/context';
import { createDatabase } from '../../server/db/client';
import { createLogger } from '../../server/lib/logger';
import { SessionKeys } from '../../server/lib/session';
import { createServices, stopServices } from '../../server/services';

export interface TestApp {
  ctx: AppContext;
  app: Express;
  /** A supertest agent that keeps cookies, signed in as that user. */
  signIn(email: string, password?: string): Promise<request.Agent>;
}

export const TEST_PASSWORD = 'test-password-123';

export function testEnv(overrides: Record<string, string> = {}) {
  return loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: inject('databaseUrl'),
    SESSION_SECRET: 'integration-test-secret-integration-test-secret',
    APP_ORIGIN: 'http://127.0.0.1:3999',
    LOG_LEVEL: 'silent',
    LOGIN_LIMIT_PER_IP: '10000',
    LOGIN_LIMIT_PER_ACCOUNT: '10000',
    // Rate-limit counters live in the shared test database: every file's requests come from one address.
    RESET_LIMIT_PER_IP: '10000',
    CLIENT_DIST: '',
    ...overrides,
  });
}

/** Builds the app for this test file and closes its pool after the file's tests. */
export function useTestApp(envOverrides: Record<string, string> = {}): TestApp {
  const env = testEnv(envOverrides);
  const database = createDatabase(env.DATABASE_URL, { connectionLimit: 5 });
  const logger = createLogger('silent');
  const services = createServices(env, logger);
  const ctx: AppContext = { env, database, logger, sessions: new SessionKeys(env.SESSION_SECRET), services };
  const app = createApp(ctx);
  afterAll(async () => {
    await stopServices(services);
    await database.close();
  });
  return {
    ctx,
    app,
    async signIn(email, password = TEST_PASSWORD) {
      const agent = request.agent(app);
      const res = await agent.post('/api/auth/login').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return agent;
    },
  };
}
