// `npm run soak`: the reliability suite. Its own MariaDB instances and service stand-ins on loopback, an
// in-process app, then four parts: bounded fuzzing of every route as four kinds of caller, the invitation
// races, MariaDB killed with SIGKILL under a write load, and the two-instance topology with a GTID
// replica (tests/soak/topology.ts). Prints one JSON object and stops by itself (a hard time limit ends it
// if anything hangs). Sizes and ports can be set in the environment.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { createApp } from '../../server/app';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { loadEnv } from '../../server/config/env';
import { createLogger } from '../../server/lib/logger';
import { SessionKeys } from '../../server/lib/session';
import { createServices, stopServices } from '../../server/services';
import { startStandIns } from '../../server/standins';
import { standinEnv, standinPorts, startMariaDb } from '../../scripts/lib.mjs';
import { TEST_PASSWORD } from '../support/app';
import { crashUnderLoad } from './crash';
import { fuzzRoutes } from './fuzz';
import { cookieFor, soakFixture } from './fixture';
import { invitationRaces } from './races';
import { topologySoak } from './topology';

const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
const DB_PORT = num('SOAK_DB_PORT', 3340);
const STANDIN_BASE = num('SOAK_STANDIN_PORT_BASE', 4840);
const PER_ROUTE = num('SOAK_FUZZ_PER_ROUTE', 25);
const RACE_ROUNDS = num('SOAK_RACE_ROUNDS', 5);
const CRASH_ROUNDS = num('SOAK_CRASH_ROUNDS', 2);
const TIME_LIMIT_MS = num('SOAK_TIME_LIMIT_MS', 20 * 60_000);
const SEED = num('SOAK_SEED', 20261202);
const TOPOLOGY_ROUNDS = num('SOAK_TOPOLOGY_ROUNDS', 3);
const OUTBOX_MESSAGES = num('SOAK_OUTBOX_MESSAGES', 200);

const limit = setTimeout(() => {
  process.stderr.write(`soak: over the ${TIME_LIMIT_MS / 60_000} min limit, stopping\n`);
  process.exit(2);
}, TIME_LIMIT_MS);
limit.unref();

const started = Date.now();
const mariadb = await startMariaDb({ name: 'soak', port: DB_PORT, databases: ['rackturn_soak'] });
const standinDir = join(mariadb.dir, 'standins');
mkdirSync(standinDir, { recursive: true });
const serviceEnv = standinEnv(standinPorts(STANDIN_BASE), standinDir);
const baseEnv = {
  ...process.env,
  ...serviceEnv,
  NODE_ENV: 'test',
  SESSION_SECRET: mariadb.secrets.sessionSecret,
  APP_ORIGIN: 'http://127.0.0.1:3999',
  LOG_LEVEL: 'silent',
  MAIL_SEND_INTERVAL_MS: '0',
  CLIENT_DIST: '',
  TRUST_PROXY: '1',
  LOGIN_LIMIT_PER_IP: '1000000',
  LOGIN_LIMIT_PER_ACCOUNT: '1000000',
} as NodeJS.ProcessEnv;
const standins = await startStandIns(baseEnv);

const env = loadEnv({ ...baseEnv, DATABASE_URL: mariadb.urlFor('rackturn_soak') });
const database = createDatabase(env.DATABASE_URL, { connectionLimit: 20 });
const logger = createLogger('silent');
const services = createServices(env, logger);
const app = createApp({ env, database, logger, sessions: new SessionKeys(env.SESSION_SECRET), services });

let exitCode = 0;
try {
  await runMigrations(database.db);
  const address = '10.200.0.1';
  const fixture = await soakFixture(app, database.db, address);

  const fuzzStarted = Date.now();
  const fuzz = await fuzzRoutes({
    app,
    signIn: fixture.signIn,
    perRoute: PER_ROUTE,
    seed: SEED,
    knownIds: fixture.knownIds,
    address,
  });
  const fuzzMs = Date.now() - fuzzStarted;

  const head = { cookie: await cookieFor(app, fixture.team.headCoach.email, address), teamId: fixture.team.teamId };
  const races = [];
  for (let r = 0; r < RACE_ROUNDS; r++) races.push(await invitationRaces(app, database.db, head, 20, `soak${r}`));

  const crashes = [];
  for (let r = 0; r < CRASH_ROUNDS; r++) {
    crashes.push(
      await crashUnderLoad({
        name: 'soak-crash',
        port: DB_PORT + 1,
        beforeMs: 5_000,
        afterMs: 5_000,
        workers: 8,
        password: TEST_PASSWORD,
        env: { ...baseEnv, TRUST_PROXY: '0' },
      }),
    );
  }

  // Two app instances, a primary and a GTID replica on loopback (the cluster `npm run cluster` starts).
  const topology = await topologySoak({ rounds: TOPOLOGY_ROUNDS, outboxMessages: OUTBOX_MESSAGES });

  const racesOk = races.every(
    (r) =>
      r.distinct['201'] === 20 &&
      r.sameAddress['201'] === 1 &&
      r.sameAddress['409'] === 19 &&
      r.openInvitationsForAddress === 1 &&
      r.rosterEntriesForAddress === 1,
  );
  const lost = crashes.reduce((s, c) => s + c.lost, 0);
  const pass = fuzz.classes['5xx'] === 0 && fuzz.classes['no answer'] === 0 && racesOk && lost === 0 && topology.pass;
  if (!pass) exitCode = 1;
  process.stdout.write(
    JSON.stringify(
      {
        pass,
        seconds: Math.round((Date.now() - started) / 1000),
        fuzz: {
          routes: fuzz.routes,
          callers: 4,
          perRouteAndCaller: PER_ROUTE,
          requests: fuzz.requests,
          classes: fuzz.classes,
          byCaller: fuzz.byCaller,
          failures: fuzz.failures.slice(0, 50),
          seconds: Math.round(fuzzMs / 1000),
        },
        races: { rounds: races.length, ok: racesOk, results: races },
        crash: {
          rounds: crashes.length,
          acknowledgedWrites: crashes.reduce((s, c) => s + c.acknowledged, 0),
          lostWrites: lost,
          results: crashes,
        },
        topology,
      },
      null,
      2,
    ) + '\n',
  );
} catch (err) {
  exitCode = 1;
  process.stderr.write(`soak failed: ${(err as Error).stack ?? String(err)}\n`);
} finally {
  await stopServices(services);
  await database.close().catch(() => undefined);
  for (const s of standins.reverse()) await s.stop().catch(() => undefined);
  await mariadb.stop();
}
process.exit(exitCode);
