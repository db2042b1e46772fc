// Password reset through the API and the stand-in's inbox: one answer for known and unknown addresses,
// single-use one-hour links, every session and every other link ended by the change, and rate limits.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { outbox, passwordResets, users } from '../../server/db/schema';
import { inboxClient } from '../../server/standins/smtp';
import { RESET_ANSWER_FLOOR_MS } from '../../server/modules/password-reset/password-reset.router';
import { TEST_PASSWORD, useTestApp } from '../support/app';
import { createTeam, createUser, uniq, type TestTeam } from '../support/factories';

const t = useTestApp();
const inbox = inboxClient();
let team: TestTeam;

const NEW_PASSWORD = 'a-brand-new-password';

function tokenFrom(text: string): string {
  const m = /\/reset-password\?token=([A-Za-z0-9_-]{43})/.exec(text);
  if (!m) throw new Error(`no reset link in:\n${text}`);
  return m[1]!;
}

async function timed(email: string) {
  const started = performance.now();
  const res = await request(t.app).post('/api/auth/password-reset').send({ email });
  return { res, ms: performance.now() - started };
}

async function requestLink(email: string, count = 1): Promise<string> {
  expect((await request(t.app).post('/api/auth/password-reset').send({ email })).status).toBe(200);
  const mails = await inbox.waitFor(email, { count, subject: 'new Rackturn password' });
  return tokenFrom(mails[count - 1]!.text);
}

const complete = (token: string, password = NEW_PASSWORD, confirmPassword = password) =>
  request.agent(t.app).post('/api/auth/password-reset/complete').send({ token, password, confirmPassword });

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
});

describe('asking for a reset link', () => {
  it('answers a known and an unknown address alike, in about the same time; only the known one gets mail', async () => {
    const user = await createUser(t.ctx.database.db, team.teamId, 'coach');
    const unknown = `nobody-${uniq()}@example.test`;
    // Warm up once so the first request's start-up cost is not measured.
    await timed(`warm-${uniq()}@example.test`);
    const runs = { known: [] as number[], unknown: [] as number[] };
    let knownBody: unknown;
    let unknownBody: unknown;
    for (let i = 0; i < 3; i++) {
      const a = await timed(user.email);
      const b = await timed(unknown);
      expect(a.res.status).toBe(200);
      expect(b.res.status).toBe(200);
      knownBody = a.res.body;
      unknownBody = b.res.body;
      runs.known.push(a.ms);
      runs.unknown.push(b.ms);
    }
    expect(knownBody).toEqual(unknownBody);
    const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[1]!;
    for (const ms of [...runs.known, ...runs.unknown]) expect(ms).toBeGreaterThanOrEqual(RESET_ANSWER_FLOOR_MS - 5);
    expect(Math.abs(median(runs.known) - median(runs.unknown))).toBeLessThan(60);
    console.info(
      `reset answer times (ms): known ${runs.known.map(Math.round).join(', ')}; unknown ${runs.unknown.map(Math.round).join(', ')}`,
    );

    const mails = await inbox.waitFor(user.email, { count: 3 });
    expect(mails[0]!.subject).toBe('Choose a new Rackturn password');
    await t.ctx.services.mail.sendDue();
    expect(await inbox.list({ to: unknown })).toEqual([]);
    expect(await t.ctx.database.db.select().from(outbox).where(eq(outbox.toEmail, unknown))).toEqual([]);
  });

  it('reports a malformed address as a field error', async () => {
    const res = await request(t.app).post('/api/auth/password-reset').send({ email: 'nope' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['email']);
  });
});

describe('using the link', () => {
  it('sets the new password once, ends older sessions and every other link, and sends a notice', async () => {
    const user = await createUser(t.ctx.database.db, team.teamId, 'coach');
    const oldSession = await t.signIn(user.email);
    const first = await requestLink(user.email);
    const second = await requestLink(user.email, 2);
    const [stored] = await t.ctx.database.db
      .select()
      .from(passwordResets)
      .where(eq(passwordResets.userId, user.id))
      .limit(1);
    const validFor = stored!.expiresAt.getTime() - stored!.createdAt.getTime();
    expect(validFor).toBeGreaterThan(3_590_000);
    expect(validFor).toBeLessThanOrEqual(3_601_000);

    expect((await request(t.app).get(`/api/auth/password-reset/check?token=${second}`)).body).toEqual({ ok: true });
    // Sessions started before the change end; the one the reset starts goes on.
    await new Promise((r) => setTimeout(r, 1100));
    const done = await complete(second);
    expect(done.status).toBe(200);
    expect(done.body).toEqual({ ok: true, signedIn: true });
    expect((await oldSession.get('/api/auth/me')).status).toBe(401);

    const login = (password: string) => request(t.app).post('/api/auth/login').send({ email: user.email, password });
    expect((await login(TEST_PASSWORD)).status).toBe(401);
    expect((await login(NEW_PASSWORD)).status).toBe(200);
    const [u] = await t.ctx.database.db.select().from(users).where(eq(users.id, user.id));
    expect(u!.passwordChangedAt).not.toBeNull();

    for (const token of [first, second]) {
      const again = await complete(token, 'yet-another-password');
      expect(again.status).toBe(410);
      expect(again.body.error.code).toBe('reset_used');
    }
    const notice = await inbox.waitFor(user.email, { subject: 'password was changed' });
    expect(notice[0]!.text).toContain('/forgot-password');
  });

  it('refuses an expired link, an unknown one, a weak password and two different passwords', async () => {
    const user = await createUser(t.ctx.database.db, team.teamId, 'athlete');
    const token = await requestLink(user.email);
    const weak = await complete(token, 'short');
    expect(weak.status).toBe(422);
    expect(Object.keys(weak.body.error.fields)).toEqual(['password']);
    const differ = await complete(token, NEW_PASSWORD, 'something-else-entirely');
    expect(Object.keys(differ.body.error.fields)).toEqual(['confirmPassword']);
    const malformed = await complete('abc');
    expect(Object.keys(malformed.body.error.fields)).toEqual(['token']);
    const unknown = await complete('y'.repeat(43));
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('reset_not_found');

    await t.ctx.database.db
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(passwordResets.userId, user.id));
    const expired = await complete(token);
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('reset_expired');
    const check = await request(t.app).get(`/api/auth/password-reset/check?token=${token}`);
    expect(check.status).toBe(410);
    // Nothing changed.
    expect(
      (await request(t.app).post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD })).status,
    ).toBe(200);
  });
});

describe('rate limits', () => {
  const limited = useTestApp({ RESET_LIMIT_PER_ADDRESS: '2', RESET_LIMIT_PER_IP: '1000' });
  // Counters are shared through the database, so this app and its twin (another instance) count together;
  // each test comes from its own client address (forwarded by the proxy in front) to stand alone.
  const byIp = useTestApp({ RESET_LIMIT_PER_ADDRESS: '1000', RESET_LIMIT_PER_IP: '3', TRUST_PROXY: '1' });
  const byIpTwin = useTestApp({ RESET_LIMIT_PER_ADDRESS: '1000', RESET_LIMIT_PER_IP: '3', TRUST_PROXY: '1' });
  let lastOctet = 10 + (process.pid % 200);
  const clientAddress = () => `203.0.113.${lastOctet++ % 250}`;
  /** Sends one request per app, one after another, and gives their statuses. */
  async function inTurn<A>(apps: A[], send: (app: A, i: number) => PromiseLike<{ status: number }>) {
    const statuses: number[] = [];
    for (const [i, app] of apps.entries()) statuses.push((await send(app, i)).status);
    return statuses;
  }

  it('counts a body without a valid address against no address: every such request is a 422, never a 429', async () => {
    const statuses = await inTurn([limited, limited, limited, limited, limited], (app, i) =>
      request(app.app)
        .post('/api/auth/password-reset')
        .send(i < 3 ? {} : { email: 'not an address' }),
    );
    expect(statuses).toEqual([422, 422, 422, 422, 422]);
  });

  it('limits requests per address, whatever the address', async () => {
    const email = `limited-${uniq()}@example.test`;
    const statuses = await inTurn([limited, limited, limited, limited], (app) =>
      request(app.app).post('/api/auth/password-reset').send({ email }),
    );
    expect(statuses).toEqual([200, 200, 429, 429]);
    const fresh = await request(limited.app)
      .post('/api/auth/password-reset')
      .send({ email: `other-${uniq()}@example.test` });
    expect(fresh.status).toBe(200);
  });

  it('limits requests per client address across e-mail addresses', async () => {
    const from = clientAddress();
    const statuses = await inTurn([byIp, byIp, byIp, byIp], (app, i) =>
      request(app.app)
        .post('/api/auth/password-reset')
        .set('X-Forwarded-For', from)
        .send({ email: `ip-${i}-${uniq()}@example.test` }),
    );
    expect(statuses).toEqual([200, 200, 200, 429]);
  });

  it('counts one client across instances: the limit holds whichever instance answers', async () => {
    const from = clientAddress();
    const statuses = await inTurn([byIp, byIpTwin, byIp, byIpTwin], (app, i) =>
      request(app.app)
        .post('/api/auth/password-reset')
        .set('X-Forwarded-For', from)
        .send({ email: `twin-${i}-${uniq()}@example.test` }),
    );
    expect(statuses).toEqual([200, 200, 200, 429]);
    // Another client is not held back.
    const other = await request(byIpTwin.app)
      .post('/api/auth/password-reset')
      .set('X-Forwarded-For', clientAddress())
      .send({ email: `twin-other-${uniq()}@example.test` });
    expect(other.status).toBe(200);
  });
});
