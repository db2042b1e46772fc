// `npm test`: the same bootstrap as `npm start`, into a separate test instance (own data folder,
// ports and socket, so it runs beside `npm start`), then every suite: unit, property, integration
// against the real MariaDB, and end-to-end in Chromium. Ends with a plain "N passed, N failed" line.
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import {
  BIN,
  ROOT,
  ensureApt,
  ensureNodeModules,
  log,
  standinEnv,
  standinPorts,
  startChild,
  startMariaDb,
} from './lib.mjs';

const extraArgs = process.argv.slice(2);
ensureNodeModules();
ensureApt('chromium', ['chromium', 'fonts-liberation']);
// The topology test puts HAProxy in front of two app instances.
ensureApt('haproxy', ['haproxy']);

const tmp = join(ROOT, '.tmp');
mkdirSync(tmp, { recursive: true });
// TEST_INSTANCE and the port variables let several checkouts or developers test side by side.
const instance = process.env.TEST_INSTANCE ?? 'test';
const dbPort = Number(process.env.TEST_DB_PORT ?? 3308);
// Its own folder, apart from any `npm start` instance of the same name.
const folder = instance === 'test' ? 'test' : `test-${instance}`;
const db = await startMariaDb({ name: folder, port: dbPort, databases: ['rackturn_test', 'rackturn_e2e'] });
log(`test MariaDB "${instance}" on 127.0.0.1:${dbPort}`);

const ports = standinPorts(Number(process.env.TEST_STANDIN_PORT_BASE ?? 4500));
const env = {
  ...process.env,
  ...standinEnv(ports, db.dir),
  NODE_ENV: 'test',
  TMPDIR: tmp,
  TEST_DB_ADMIN_URL: db.urlFor(''),
  TEST_DB_SOCKET: db.socket,
  TEST_SESSION_SECRET: db.secrets.sessionSecret,
  TEST_APP_PORT: process.env.TEST_APP_PORT ?? '3100',
  TEST_INSTANCE: instance,
  TEST_DB_PORT: String(dbPort),
};

const children = [];
let finished = false;
async function cleanup() {
  for (const c of children.reverse()) await c.stopGroup();
  await db.stop();
}
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(sig, async () => {
    if (finished) return;
    finished = true;
    await cleanup();
    process.exit(130);
  });
}

const standins = startChild(join(BIN, 'tsx'), ['server/standins/index.ts'], { env });
children.push(standins);

const report = join(tmp, `${instance}-vitest-report.json`);
rmSync(report, { force: true });
const vitest = startChild(
  join(BIN, 'vitest'),
  ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...extraArgs],
  { env, detached: false },
);
const code = await new Promise((resolve) => vitest.on('exit', (c, s) => resolve(c ?? (s ? 1 : 0))));
finished = true;
await cleanup();

let passed = 0;
let failed = 1; // no report at all counts as a failure
if (existsSync(report)) {
  const r = JSON.parse(readFileSync(report, 'utf8'));
  passed = r.numPassedTests ?? 0;
  failed = (r.numFailedTests ?? 0) + (r.numRuntimeErrorTestSuites ?? 0);
  if (!r.success && failed === 0) failed = 1;
}
if (code !== 0 && failed === 0) failed = 1;
process.stdout.write(`\n${passed} passed, ${failed} failed\n`);
process.exit(failed > 0 || code !== 0 ? 1 : 0);
