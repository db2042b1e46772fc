// Request logs never carry passwords, cookies or tokens.
import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { Writable } from 'node:stream';
import { createApp } from '../../server/app';
import { createDatabase } from '../../server/db/client';
import { SessionKeys } from '../../server/lib/session';
import { createServices } from '../../server/services';
import { TEST_PASSWORD, testEnv } from '../support/app';
import { createTeam } from '../support/factories';
import { createLogger } from '../../server/lib/logger';

describe('request logs', () => {
  it('record method, path and status, and nothing secret', async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _enc, done) {
        lines.push(String(chunk));
        done();
      },
    });
    const env = testEnv();
    const database = createDatabase(env.DATABASE_URL, { connectionLimit: 2 });
    // The production logger, writing into memory.
    const logger = createLogger('info', sink);
    const app = createApp({
      env,
      database,
      logger,
      sessions: new SessionKeys(env.SESSION_SECRET),
      services: createServices(env, logger),
    });
    try {
      const team = await createTeam(database.db);
      const agent = request.agent(app);
      const login = await agent.post('/api/auth/login').send({ email: team.coach.email, password: TEST_PASSWORD });
      expect(login.status).toBe(200);
      const token = String(login.headers['set-cookie']).split(';')[0]!.split('=')[1]!;
      await agent.get('/api/auth/me?token=secret-query-value');
      await new Promise((r) => setTimeout(r, 50));
      const all = lines.join('\n');
      expect(all).toContain('/api/auth/login');
      expect(all).toContain('"status":200');
      expect(all).not.toContain(TEST_PASSWORD);
      expect(all).not.toContain(token);
      expect(all).not.toContain('secret-query-value');
      expect(all).not.toMatch(/cookie/i);
    } finally {
      await database.close();
    }
  });
});
