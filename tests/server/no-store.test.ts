// Every API answer tells browsers and proxies not to keep it: signed-in data must not outlive the session.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { useTestApp } from '../support/app';
import { createTeam, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
});

describe('Cache-Control on API answers', () => {
  it('is no-store on success, on errors, on unknown routes and when signed out', async () => {
    const coach = await t.signIn(team.coach.email);
    const answers: [string, request.Response][] = [
      ['me', await coach.get('/api/auth/me')],
      ['list', await coach.get('/api/variants')],
      ['export', await coach.get('/api/variants/export')],
      ['not found', await coach.get('/api/variants/999999999')],
      ['no route', await coach.get('/api/no-such-route')],
      ['signed out', await request(t.app).get('/api/auth/me')],
      ['invalid', await request(t.app).post('/api/auth/login').send({})],
      ['health', await request(t.app).get('/api/health')],
    ];
    for (const [what, res] of answers) expect(res.headers['cache-control'], what).toBe('no-store');
  });
});
