// Sign-in limits slow a guesser down without letting anyone lock a real user out: failures count per
// account and address together, delays grow, the answer says how long to wait, and the counters live in
// MariaDB so every instance sees them.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { TEST_PASSWORD, useTestApp } from '../support/app';
import { createTeam, uniq, type TestTeam } from '../support/factories';

// Each test signs in "from" its own made-up addresses (through a trusted proxy header), so the shared
// counters of other test files never meet these.
const limits = { TRUST_PROXY: '1', LOGIN_LIMIT_PER_ACCOUNT: '3', LOGIN_LIMIT_PER_IP: '1000' };
const a = useTestApp(limits);
const b = useTestApp(limits);
let team: TestTeam;

beforeAll(async () => {
  team = await createTeam(a.ctx.database.db);
});

let next = 0;
const address = () => `10.${(process.pid >> 8) & 255}.${process.pid & 255}.${(next++ % 250) + 1}`;
const attempt = (app: typeof a.app, from: string, email: string, password: string) =>
  request(app).post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password });

describe('sign-in limits', () => {
  it('the right password from another address still works while an attacker is being held back', async () => {
    const attacker = address();
    const owner = address();
    const email = team.coach.email;
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) statuses.push((await attempt(a.app, attacker, email, `guess-${i}`)).status);
    expect(statuses.slice(0, 3)).toEqual([401, 401, 401]);
    expect(statuses.slice(3).every((s) => s === 429)).toBe(true);
    // The attacker's correct guess is held back too…
    expect((await attempt(a.app, attacker, email, TEST_PASSWORD)).status).toBe(429);
    // …but the owner, from their own address, signs in at once.
    expect((await attempt(a.app, owner, email, TEST_PASSWORD)).status).toBe(200);
  });

  it('answers 429 with Retry-After and the wait in words, and holds across instances', async () => {
    const from = address();
    const email = `nobody-${uniq()}@example.test`;
    for (let i = 0; i < 3; i++) expect((await attempt(a.app, from, email, 'x')).status).toBe(401);
    const held = await attempt(b.app, from, email, 'x'); // another instance
    expect(held.status).toBe(429);
    const wait = Number(held.headers['retry-after']);
    expect(wait).toBeGreaterThanOrEqual(1);
    expect(held.body.error.code).toBe('too_many_attempts');
    expect(held.body.error.message).toMatch(/Try again in \d+ (second|minute)s?/);
    expect(held.body.error.retryAfterSeconds).toBe(wait);
  });

  it('makes each further failure wait longer', async () => {
    const from = address();
    const email = `grow-${uniq()}@example.test`;
    const waits: number[] = [];
    for (let i = 0; i < 3; i++) await attempt(a.app, from, email, 'x');
    for (let round = 0; round < 3; round++) {
      const held = await attempt(a.app, from, email, 'x');
      expect(held.status).toBe(429);
      waits.push(Number(held.headers['retry-after']));
      // Let the hold pass without waiting: a further failure after it counts again.
      await a.ctx.database.pool.query('UPDATE sign_in_limits SET blocked_until = NOW(3) - INTERVAL 1 SECOND');
      expect((await attempt(a.app, from, email, 'x')).status).toBe(401);
    }
    expect(waits[1]).toBeGreaterThan(waits[0]!);
    expect(waits[2]).toBeGreaterThan(waits[1]!);
  });

  it('a correct sign-in clears that account-and-address counter', async () => {
    const from = address();
    const email = team.headCoach.email;
    for (let i = 0; i < 2; i++) expect((await attempt(a.app, from, email, 'wrong')).status).toBe(401);
    expect((await attempt(a.app, from, email, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await attempt(a.app, from, email, 'wrong')).status).toBe(401);
  });
});

describe('sign-in limit per address across accounts', () => {
  const perAddress = useTestApp({ TRUST_PROXY: '1', LOGIN_LIMIT_PER_ACCOUNT: '1000', LOGIN_LIMIT_PER_IP: '3' });

  it('holds back an address that tries many accounts', async () => {
    const from = address();
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++)
      statuses.push((await attempt(perAddress.app, from, `spray-${i}-${uniq()}@example.test`, 'x')).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
  });
});
