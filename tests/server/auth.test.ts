// Sign-in, sessions, cross-site protection and the error shape.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { users } from '../../server/db/schema';
import { SESSION_COOKIE } from '../../server/lib/session';
import { TEST_PASSWORD, useTestApp } from '../support/app';
import { createTeam, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
});

function sessionCookie(res: request.Response): string {
  const raw = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return raw.find((c) => c.startsWith(`${SESSION_COOKIE}=`)) ?? '';
}

describe('POST /api/auth/login', () => {
  it('signs in and sets an httpOnly, SameSite=Lax session cookie with a 12-hour life', async () => {
    const res = await request(t.app)
      .post('/api/auth/login')
      .send({ email: team.headCoach.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const cookie = sessionCookie(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain http on loopback
    expect(cookie).toMatch(/Max-Age=43200/);
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const res = await request(t.app)
      .post('/api/auth/login')
      .send({ email: `  ${team.coach.email.toUpperCase()} `, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('answers an unknown e-mail and a wrong password identically', async () => {
    const wrong = await request(t.app)
      .post('/api/auth/login')
      .send({ email: team.coach.email, password: 'not-the-password' });
    const unknown = await request(t.app)
      .post('/api/auth/login')
      .send({ email: 'nobody@example.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('invalid_credentials');
  });

  it('reports field errors for a malformed body', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'not-an-email', password: 42 });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('answers malformed JSON with 400 and bodies over 1 MB with 413, never 500', async () => {
    const bad = await request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_json');
    const huge = await request(t.app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(1_100_000) }));
    expect(huge.status).toBe(413);
    expect(JSON.stringify(huge.body)).not.toMatch(/at .*\.ts:\d+/);
  });
});

describe('GET /api/auth/me', () => {
  it('is 401 when signed out', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error).toMatchObject({ code: 'unauthorized' });
  });

  it('tells who is signed in, with role and team', async () => {
    const agent = await t.signIn(team.athleteUser.email);
    const res = await agent.get('/api/auth/me');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      email: team.athleteUser.email,
      role: 'athlete',
      teamId: team.teamId,
      teamName: team.name,
      athleteId: team.athleteId,
    });
  });

  it('refuses a forged or tampered token', async () => {
    const res = await request(t.app)
      .get('/api/auth/me')
      .set('Cookie', `${SESSION_COOKIE}=eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOiIxIn0.bad`);
    expect(res.status).toBe(401);
  });

  it('ends sessions issued before a password change', async () => {
    const extra = await createTeam(t.ctx.database.db);
    const agent = await t.signIn(extra.coach.email);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await t.ctx.database.db
      .update(users)
      .set({ passwordChangedAt: new Date(Date.now() + 2000) })
      .where(eq(users.id, extra.coach.id));
    // Changed behind the app's back, so seen once this instance's short session cache has passed
    // (a change through the app ends the sessions at once: see sessions.test.ts).
    await new Promise((r) => setTimeout(r, t.ctx.env.SESSION_CACHE_MS + 50));
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});

describe('POST /api/auth/logout', () => {
  it('clears the cookie so the next request is signed out', async () => {
    const agent = await t.signIn(team.coach.email);
    const out = await agent.post('/api/auth/logout');
    expect(out.status).toBe(200);
    expect(sessionCookie(out)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});

describe('cross-site writes', () => {
  it('refuses a foreign Origin and accepts the app’s own', async () => {
    const agent = await t.signIn(team.coach.email);
    const foreign = await agent.post('/api/auth/logout').set('Origin', 'https://evil.example');
    expect(foreign.status).toBe(403);
    expect(foreign.body.error.code).toBe('forbidden');
    const own = await agent.post('/api/auth/logout').set('Origin', 'http://127.0.0.1:3999');
    expect(own.status).toBe(200);
  });

  it('refuses a write the browser marks as cross-site', async () => {
    const res = await request(t.app).post('/api/auth/logout').set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(403);
  });
});

describe('security headers', () => {
  it('sends a Content-Security-Policy without inline scripts', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toContain('unsafe-inline');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('answers unknown API routes with JSON 404', async () => {
    const res = await request(t.app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('sign-in rate limits', () => {
  const limited = useTestApp({ LOGIN_LIMIT_PER_ACCOUNT: '3', LOGIN_LIMIT_PER_IP: '1000' });

  it('limits attempts per account, whatever the password', async () => {
    const email = `limit-${Date.now()}@example.test`;
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      statuses.push(
        (
          await request(limited.app)
            .post('/api/auth/login')
            .send({ email, password: 'guess-' + i })
        ).status,
      );
    }
    expect(statuses.slice(0, 3)).toEqual([401, 401, 401]);
    expect(statuses.slice(3)).toEqual([429, 429]);
    // Another account from the same address is not affected by that account's limit.
    const other = await request(limited.app)
      .post('/api/auth/login')
      .send({ email: team.coach.email, password: TEST_PASSWORD });
    expect(other.status).toBe(200);
  });
});

describe('sign-in rate limit per address', () => {
  // The counters are shared through the database: this test signs in "from" an address of its own.
  const limited = useTestApp({ LOGIN_LIMIT_PER_ACCOUNT: '1000', LOGIN_LIMIT_PER_IP: '3', TRUST_PROXY: '1' });

  it('limits attempts from one address across accounts', async () => {
    const address = `10.77.${process.pid & 255}.${Date.now() % 250}`;
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      statuses.push(
        (
          await request(limited.app)
            .post('/api/auth/login')
            .set('X-Forwarded-For', address)
            .send({ email: `ip-${i}-${Date.now()}@example.test`, password: 'x' })
        ).status,
      );
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
  });
});

describe('tokens of the old kind', () => {
  it('refuses a well-signed JWT: only a session row signs anyone in', async () => {
    const { SignJWT } = await import('jose');
    const key = new TextEncoder().encode(t.ctx.env.SESSION_SECRET);
    const token = await new SignJWT({ tid: team.teamId })
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject(String(team.coach.id))
      .setIssuedAt()
      .setExpirationTime('12h')
      .sign(key);
    expect((await request(t.app).get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=${token}`)).status).toBe(401);
  });
});

describe('behind a TLS proxy', () => {
  const proxied = useTestApp({ TRUST_PROXY: '1', APP_ORIGIN: 'https://rackturn.example' });

  it('marks the session cookie Secure when the request came over https', async () => {
    const res = await request(proxied.app)
      .post('/api/auth/login')
      .set('X-Forwarded-Proto', 'https')
      .send({ email: team.coach.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(sessionCookie(res)).toMatch(/; Secure/i);
    expect(res.headers['strict-transport-security']).toBeDefined();
  });
});
