// Server-side sessions: the cookie is an opaque id of a row in MariaDB; signing out, signing out
// everywhere, a password change, a changed role or a removed membership end the affected sessions,
// on this instance at once and on every other instance within the short look-up cache.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { memberships, sessions } from '../../server/db/schema';
import { SESSION_COOKIE } from '../../server/lib/session';
import { inboxClient } from '../../server/standins/smtp';
import { useTestApp } from '../support/app';
import { createTeam, createUser, type TestTeam } from '../support/factories';

const CACHE_MS = 400;
const a = useTestApp({ SESSION_CACHE_MS: String(CACHE_MS) });
const b = useTestApp({ SESSION_CACHE_MS: String(CACHE_MS) });
const inbox = inboxClient();
let team: TestTeam;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeAll(async () => {
  team = await createTeam(a.ctx.database.db);
});

/** Signs in on app A and returns the raw cookie value, as an attacker who copied it would hold it. */
async function signInRaw(email: string, userAgent = 'TestBrowser/1.0 (X11; Linux)'): Promise<string> {
  const res = await request(a.app)
    .post('/api/auth/login')
    .set('User-Agent', userAgent)
    .send({ email, password: 'test-password-123' });
  expect(res.status).toBe(200);
  const raw = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  return raw!.split(';')[0]!.slice(SESSION_COOKIE.length + 1);
}

const me = (app: typeof a.app, token: string) =>
  request(app).get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=${token}`);

describe('the session cookie', () => {
  it('is an opaque random id, and the database keeps only its hash', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    const token = await signInRaw(user.email);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(token).not.toContain('.');
    const rows = await a.ctx.database.db.select().from(sessions).where(eq(sessions.userId, user.id));
    expect(rows).toHaveLength(1);
    expect(JSON.stringify(rows[0])).not.toContain(token);
    expect(rows[0]).toMatchObject({ teamId: team.teamId, role: 'coach', userAgent: 'TestBrowser/1.0 (X11; Linux)' });
  });
});

describe('signing out', () => {
  it('ends the session on the server: a copied cookie no longer works', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    const token = await signInRaw(user.email);
    expect((await me(a.app, token)).status).toBe(200);
    const out = await request(a.app).post('/api/auth/logout').set('Cookie', `${SESSION_COOKIE}=${token}`);
    expect(out.status).toBe(200);
    const after = await me(a.app, token);
    expect(after.status).toBe(401);
    // …and it is not handed a fresh cookie either.
    expect(String(after.headers['set-cookie'] ?? '')).not.toMatch(/Max-Age=43200/);
  });

  it('is refused by another instance within the look-up cache time', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    const token = await signInRaw(user.email);
    expect((await me(b.app, token)).status).toBe(200); // now in B's cache
    await request(a.app).post('/api/auth/logout').set('Cookie', `${SESSION_COOKIE}=${token}`);
    expect((await me(a.app, token)).status).toBe(401); // at once where it happened
    await sleep(CACHE_MS + 50);
    expect((await me(b.app, token)).status).toBe(401);
  });
});

describe('sign out everywhere', () => {
  it('ends every session of the account, on every instance', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    const phone = await signInRaw(user.email, 'Phone/1');
    const laptop = await signInRaw(user.email, 'Laptop/1');
    expect((await me(b.app, phone)).status).toBe(200);
    const res = await request(a.app).post('/api/auth/logout-everywhere').set('Cookie', `${SESSION_COOKIE}=${laptop}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, ended: 2 });
    expect((await me(a.app, phone)).status).toBe(401);
    expect((await me(a.app, laptop)).status).toBe(401);
    await sleep(CACHE_MS + 50);
    expect((await me(b.app, phone)).status).toBe(401);
  });
});

describe('the list of sessions', () => {
  it('lists the account’s own sessions with device and last seen, and ends one by id', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'athlete');
    const phone = await signInRaw(user.email, 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_0 like Mac OS X) Mobile/15E148');
    const laptop = await signInRaw(user.email, 'Mozilla/5.0 (X11; Linux x86_64) Firefox/128.0');
    const other = await signInRaw(team.coach.email);
    const list = await request(a.app).get('/api/auth/sessions').set('Cookie', `${SESSION_COOKIE}=${laptop}`);
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(2);
    const current = list.body.items.find((s: { current: boolean }) => s.current);
    const phoneRow = list.body.items.find((s: { current: boolean }) => !s.current);
    expect(current.device).toMatch(/Linux/);
    expect(current.device).toMatch(/Firefox/);
    expect(phoneRow.device).toMatch(/iPhone/);
    expect(Date.parse(phoneRow.lastSeenAt)).toBeGreaterThan(Date.now() - 60_000);
    expect(Object.keys(phoneRow).sort()).toEqual(['createdAt', 'current', 'device', 'id', 'lastSeenAt']);

    // Someone else's session id is simply not found.
    const [coachRow] = await a.ctx.database.db.select().from(sessions).where(eq(sessions.userId, team.coach.id));
    const foreign = await request(a.app)
      .delete(`/api/auth/sessions/${coachRow!.id}`)
      .set('Cookie', `${SESSION_COOKIE}=${laptop}`);
    expect(foreign.status).toBe(404);
    expect((await me(a.app, other)).status).toBe(200);

    const end = await request(a.app)
      .delete(`/api/auth/sessions/${phoneRow.id}`)
      .set('Cookie', `${SESSION_COOKIE}=${laptop}`);
    expect(end.status).toBe(200);
    expect((await me(a.app, phone)).status).toBe(401);
    expect((await me(a.app, laptop)).status).toBe(200);
  });
});

describe('changes to the account end its sessions', () => {
  it('a password reset ends sessions started in the same second', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    await request(a.app).post('/api/auth/password-reset').send({ email: user.email });
    const [mail] = await inbox.waitFor(user.email, { subject: 'new Rackturn password' });
    const resetToken = /\/reset-password\?token=([A-Za-z0-9_-]{43})/.exec(mail!.text)![1]!;
    const token = await signInRaw(user.email);
    expect((await me(b.app, token)).status).toBe(200);
    const done = await request(a.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: resetToken, password: 'brand-new-password-1', confirmPassword: 'brand-new-password-1' });
    expect(done.status).toBe(200);
    expect((await me(a.app, token)).status).toBe(401);
    await sleep(CACHE_MS + 50);
    expect((await me(b.app, token)).status).toBe(401);
  });

  it('a changed role or a removed membership ends the session', async () => {
    const db = a.ctx.database.db;
    const coach = await createUser(db, team.teamId, 'coach');
    const gone = await createUser(db, team.teamId, 'coach');
    const t1 = await signInRaw(coach.email);
    const t2 = await signInRaw(gone.email);
    expect((await me(b.app, t1)).body.role).toBe('coach');
    expect((await me(b.app, t2)).status).toBe(200);
    await db
      .update(memberships)
      .set({ role: 'head_coach' })
      .where(and(eq(memberships.userId, coach.id), eq(memberships.teamId, team.teamId)));
    await db.delete(memberships).where(and(eq(memberships.userId, gone.id), eq(memberships.teamId, team.teamId)));
    await sleep(CACHE_MS + 50);
    expect((await me(b.app, t1)).status).toBe(401);
    expect((await me(b.app, t2)).status).toBe(401);
    expect(await db.select().from(sessions).where(eq(sessions.userId, gone.id))).toHaveLength(0);
  });
});

describe('session life', () => {
  it('slides: a session last seen a while ago is extended and its cookie renewed; a fresh one is not', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    const token = await signInRaw(user.email);
    const fresh = await me(a.app, token);
    expect(fresh.status).toBe(200);
    expect(fresh.headers['set-cookie']).toBeUndefined();
    const old = new Date(Date.now() - 20 * 60_000);
    await a.ctx.database.db
      .update(sessions)
      .set({ lastSeenAt: old, expiresAt: new Date(old.getTime() + 12 * 3600_000) })
      .where(eq(sessions.userId, user.id));
    const res = await me(b.app, token); // B has not cached it yet
    expect(res.status).toBe(200);
    expect(String(res.headers['set-cookie'])).toMatch(/Max-Age=43200/);
    const [row] = await a.ctx.database.db.select().from(sessions).where(eq(sessions.userId, user.id));
    expect(row!.lastSeenAt.getTime()).toBeGreaterThan(Date.now() - 60_000);
    expect(row!.expiresAt.getTime()).toBeGreaterThan(Date.now() + 11.9 * 3600_000);
  });

  it('refuses an expired session', async () => {
    const user = await createUser(a.ctx.database.db, team.teamId, 'coach');
    const token = await signInRaw(user.email);
    await a.ctx.database.db
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(sessions.userId, user.id));
    expect((await me(b.app, token)).status).toBe(401);
  });
});
