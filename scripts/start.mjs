// `npm start`: everything up with demo data on a fresh machine — MariaDB, the local stand-ins, the
// built client and the API in one Express process — and everything down again on Ctrl-C or SIGTERM.
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  BIN,
  ROOT,
  ensureNodeModules,
  log,
  runSync,
  standinEnv,
  standinPorts,
  startChild,
  startMariaDb,
  waitForHttp,
} from './lib.mjs';

const dev = process.argv.includes('--dev');
const port = Number(process.env.PORT ?? 3000);
const dbPort = Number(process.env.DB_PORT ?? 3307);
const t0 = Date.now();

ensureNodeModules();
// RACKTURN_INSTANCE keeps a second checkout's or developer's data, ports and build apart.
const instance = process.env.RACKTURN_INSTANCE ?? 'dev';
const clientOut = instance === 'dev' ? join(ROOT, 'dist') : join(ROOT, '.tmp', `dist-${instance}`);
const db = await startMariaDb({ name: instance, port: dbPort, databases: ['rackturn'] });
log(`MariaDB ${db.startedHere ? 'started' : 'already running'} on 127.0.0.1:${dbPort}`);

const ports = standinPorts(Number(process.env.STANDIN_PORT_BASE ?? 4400));
const env = {
  ...process.env,
  ...standinEnv(ports, db.dir),
  NODE_ENV: process.env.NODE_ENV ?? 'development',
  PORT: String(port),
  HOST: process.env.HOST ?? '127.0.0.1',
  DATABASE_URL: db.urlFor('rackturn'),
  SESSION_SECRET: db.secrets.sessionSecret,
  APP_ORIGIN: process.env.APP_ORIGIN ?? `http://127.0.0.1:${port}`,
  DB_MIGRATE: '1',
  SEED_DEMO: process.env.NODE_ENV === 'production' ? '0' : '1',
  CLIENT_DIST: dev ? '' : clientOut,
  EXTRA_ORIGINS: dev ? `http://127.0.0.1:5173,http://localhost:5173` : '',
};

const children = [];
let stopping = false;
async function stopAll(code = 0) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  for (const child of children.reverse()) await child.stopGroup();
  await db.stop();
  log('stopped');
  process.exit(code);
}
process.on('SIGINT', () => stopAll(0));
process.on('SIGTERM', () => stopAll(0));
process.on('SIGHUP', () => stopAll(0));

try {
  const standins = startChild(join(BIN, 'tsx'), ['server/standins/index.ts'], { env });
  children.push(standins);
  standins.on('exit', (c) => !stopping && (log(`local stand-ins exited (${c})`), stopAll(1)));

  if (!dev) buildClientIfChanged();

  const server = startChild(join(BIN, 'tsx'), ['server/index.ts'], { env });
  children.push(server);
  server.on('exit', (c) => !stopping && (log(`server exited (${c})`), stopAll(c ?? 1)));
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, { child: server, timeoutMs: 120_000 });

  if (dev) {
    const vite = startChild(join(BIN, 'vite'), ['--host', '127.0.0.1', '--port', '5173', '--strictPort'], { env });
    children.push(vite);
    vite.on('exit', (c) => !stopping && stopAll(c ?? 1));
  }

  const url = dev ? 'http://127.0.0.1:5173' : `http://127.0.0.1:${port}`;
  log(`ready in ${((Date.now() - t0) / 1000).toFixed(1)} s → ${url}`);
  if (env.SEED_DEMO === '1') {
    log('demo sign-ins (password rackturn-demo):');
    log('  coach@rackturn.test    head coach, Copperkettle Barbell Club');
    log('  athlete@rackturn.test  athlete, Copperkettle Barbell Club');
    log('  other@rackturn.test    head coach of a second team (to see isolation)');
  }
  log('press Ctrl-C to stop everything');
} catch (err) {
  log(String(err instanceof Error ? err.message : err));
  await stopAll(1);
}

/** Builds the client unless the last build came from exactly these sources (keeps a second start fast). */
function buildClientIfChanged() {
  const hash = createHash('sha256');
  const walk = (p) => {
    if (!existsSync(p)) return;
    if (statSync(p).isDirectory()) for (const f of readdirSync(p).sort()) walk(join(p, f));
    else hash.update(`${p}\n`).update(readFileSync(p));
  };
  for (const p of [
    'src',
    'shared',
    'index.html',
    'vite.config.ts',
    'tailwind.config.ts',
    'package-lock.json',
    'public',
  ])
    walk(join(ROOT, p));
  const digest = hash.digest('hex');
  const stamp = join(clientOut, '.build-stamp');
  if (existsSync(stamp) && readFileSync(stamp, 'utf8') === digest) {
    log('client build is up to date');
    return;
  }
  log('building the client (vite build)…');
  runSync(join(BIN, 'vite'), ['build', '--outDir', clientOut, '--emptyOutDir', '--logLevel', 'warn']);
  writeFileSync(stamp, digest);
}
