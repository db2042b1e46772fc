// The reliability suite in brief (the full run is `npm run soak`): every route fuzzed a little as four
// kinds of caller with no 5xx, the invitation races, and MariaDB killed under a write load with no
// acknowledged write lost.
import { beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../../server/lib/routes';
import { TEST_PASSWORD, useTestApp } from '../support/app';
import { crashUnderLoad } from '../soak/crash';
import { fuzzRoutes } from '../soak/fuzz';
import { cookieFor, soakFixture, type SoakFixture } from '../soak/fixture';
import { invitationRaces } from '../soak/races';

const t = useTestApp({ TRUST_PROXY: '1' });
// An address of this file's own, so its failed sign-ins never meet another file's counters.
const ADDRESS = `10.201.${process.pid & 255}.1`;
let fixture: SoakFixture;

beforeAll(async () => {
  fixture = await soakFixture(t.app, t.ctx.database.db, ADDRESS);
});

describe('reliability, short run', () => {
  it('fuzzes every route as anonymous, athlete, coach and head coach without a 5xx', async () => {
    const report = await fuzzRoutes({
      app: t.app,
      signIn: fixture.signIn,
      perRoute: 2,
      seed: 7,
      knownIds: fixture.knownIds,
      address: ADDRESS,
    });
    expect(report.routes).toBe(listRoutes(t.app.locals.apiRouter).length);
    expect(report.requests).toBe(report.routes * 4 * 2);
    expect(report.failures).toEqual([]);
    expect(report.classes['5xx']).toBe(0);
    expect(report.classes['4xx']).toBeGreaterThan(0);
  }, 180_000);

  it('answers invitation races with one success per address and clear conflicts', async () => {
    const head = { cookie: await cookieFor(t.app, fixture.team.headCoach.email, ADDRESS), teamId: fixture.team.teamId };
    const report = await invitationRaces(t.app, t.ctx.database.db, head, 10, `short${process.pid}`);
    expect(report).toEqual({
      distinct: { 201: 10 },
      sameAddress: { 201: 1, 409: 9 },
      openInvitationsForAddress: 1,
      rosterEntriesForAddress: 1,
    });
  });

  it('loses no acknowledged write when MariaDB is killed with SIGKILL and restarted under load', async () => {
    const report = await crashUnderLoad({
      name: `${process.env.TEST_INSTANCE ?? 'test'}-crash`,
      port: Number(process.env.TEST_DB_PORT ?? 3308) + 20,
      beforeMs: 800,
      afterMs: 800,
      workers: 4,
      password: TEST_PASSWORD,
      env: { ...process.env, SESSION_SECRET: t.ctx.env.SESSION_SECRET, APP_ORIGIN: t.ctx.env.APP_ORIGIN },
    });
    expect(report.acknowledged).toBeGreaterThan(0);
    expect(report.lost).toBe(0);
  }, 180_000);
});
