// The whole topology on loopback, for `npm run cluster`, its tests and the load bench: a MariaDB primary
// and one replica kept in step by GTID replication, app instances on their own ports, and HAProxy in
// front dealing requests round-robin. Plain Node with no dependencies, like the other lifecycle scripts.
import { spawnSync } from 'node:child_process';
import { copyFileSync, createWriteStream, existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  BIN,
  ROOT,
  ensureApt,
  log,
  runSync,
  standinEnv,
  standinPorts,
  startChild,
  startMariaDb,
  waitForHttp,
} from './lib.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const DATABASE = 'rackturn';

/** Runs SQL as root over the server's socket; returns the tab-separated rows. */
export function rootSql(instance, sql) {
  const r = spawnSync(
    'mariadb',
    ['--no-defaults', `--socket=${instance.socket}`, '--user=root', '-N', '-B', '-e', sql],
    {
      encoding: 'utf8',
    },
  );
  if (r.status !== 0) throw new Error(`SQL on port ${instance.port} failed: ${r.stderr.trim()}`);
  return r.stdout
    .split('\n')
    .filter(Boolean)
    .map((line) => line.split('\t'));
}

/** The replica's replication threads and how far behind it says it is. */
export function replicationStatus(replica) {
  const r = spawnSync(
    'mariadb',
    ['--no-defaults', `--socket=${replica.socket}`, '--user=root', '-e', 'SHOW SLAVE STATUS\\G'],
    { encoding: 'utf8' },
  );
  if (r.status !== 0) throw new Error(`SHOW SLAVE STATUS failed: ${r.stderr.trim()}`);
  const field = (name) => r.stdout.match(new RegExp(`^\\s*${name}: (.*)$`, 'm'))?.[1]?.trim() ?? '';
  return {
    configured: r.stdout.trim() !== '',
    io: field('Slave_IO_Running') === 'Yes',
    sql: field('Slave_SQL_Running') === 'Yes',
    lastError: field('Last_Error') || field('Last_IO_Error'),
    gtid: field('Gtid_Slave_Pos'),
  };
}

/** Waits until the replica has applied everything the primary has written so far. */
export async function waitForReplica(primary, replica, timeoutMs = 30_000) {
  const [[target = '']] = rootSql(primary, 'SELECT @@global.gtid_binlog_pos');
  if (!target) return;
  const [[result]] = rootSql(replica, `SELECT MASTER_GTID_WAIT('${target}', ${timeoutMs / 1000})`);
  if (result !== '0') throw new Error(`the replica did not reach ${target} within ${timeoutMs / 1000} s`);
}

async function startDatabases({ name, dbPort, fresh }) {
  const primaryName = `${name}-primary`;
  const replicaName = `${name}-replica`;
  const dirs = [primaryName, replicaName].map((n) => join(ROOT, '.data', n));
  // A pair that was not set up together (or a fresh start asked for) starts again from empty folders:
  // a replica only makes sense as a copy of its own primary.
  const paired = dirs.every((d) => existsSync(join(d, 'replication-ready')));
  if (fresh || !paired) {
    for (const d of dirs) {
      rmSync(join(d, 'mariadb'), { recursive: true, force: true });
      rmSync(join(d, 'replication-ready'), { force: true });
    }
  }
  const primary = await startMariaDb({
    name: primaryName,
    port: dbPort,
    databases: [DATABASE],
    serverArgs: [
      '--server-id=1',
      `--log-bin=${join(dirs[0], 'mariadb', 'binlog')}`,
      '--binlog-format=ROW',
      '--gtid-strict-mode=1',
      '--expire-logs-days=2',
    ],
  });
  // The same passwords on both: the primary's user statements replicate to the replica.
  mkdirSync(dirs[1], { recursive: true });
  copyFileSync(join(dirs[0], 'secrets.json'), join(dirs[1], 'secrets.json'));
  const replica = await startMariaDb({
    name: replicaName,
    port: dbPort + 1,
    databases: [DATABASE],
    serverArgs: ['--server-id=2', '--read-only=1', `--relay-log=${join(dirs[1], 'mariadb', 'relay')}`],
  });

  const password = primary.secrets.dbPassword.replace(/'/g, "''");
  // Kept out of the binary log: the replica has no use for its own replication account.
  rootSql(
    primary,
    [
      'SET sql_log_bin = 0',
      `CREATE USER IF NOT EXISTS 'replicator'@'127.0.0.1' IDENTIFIED BY '${password}'`,
      `ALTER USER 'replicator'@'127.0.0.1' IDENTIFIED BY '${password}'`,
      "GRANT REPLICATION SLAVE ON *.* TO 'replicator'@'127.0.0.1'",
      'SET sql_log_bin = 1',
    ].join(';'),
  );
  rootSql(
    replica,
    [
      'STOP SLAVE',
      `CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=${dbPort}, MASTER_USER='replicator', ` +
        `MASTER_PASSWORD='${password}', MASTER_USE_GTID=slave_pos, MASTER_CONNECT_RETRY=1`,
      'START SLAVE',
    ].join(';'),
  );
  const deadline = Date.now() + 30_000;
  for (;;) {
    const status = replicationStatus(replica);
    if (status.io && status.sql) break;
    if (Date.now() > deadline) throw new Error(`replication did not start: ${status.lastError || 'no error given'}`);
    await sleep(200);
  }
  await waitForReplica(primary, replica);
  for (const d of dirs) writeFileSync(join(d, 'replication-ready'), new Date().toISOString());
  log(`MariaDB primary on 127.0.0.1:${dbPort}, replica on 127.0.0.1:${dbPort + 1} (GTID replication running)`);
  return { primary, replica };
}

function haproxyConfig({ balancerPort, appPorts }) {
  return [
    'global',
    '  maxconn 4096',
    'defaults',
    '  mode http',
    '  option forwardfor',
    '  option http-keep-alive',
    '  timeout connect 2s',
    '  timeout client 5m',
    '  timeout server 5m',
    '  retries 2',
    '  option redispatch',
    'frontend rackturn',
    `  bind 127.0.0.1:${balancerPort}`,
    '  default_backend apps',
    'backend apps',
    '  balance roundrobin',
    '  option httpchk GET /api/health',
    '  http-check expect status 200',
    ...appPorts.map((p, i) => `  server app${i + 1} 127.0.0.1:${p} check inter 1s fall 2 rise 1`),
    '',
  ].join('\n');
}

function clientBuild(name, rebuild) {
  const out = join(ROOT, '.tmp', `dist-${name}`);
  if (rebuild || !existsSync(join(out, 'index.html'))) {
    log('building the client (vite build)…');
    runSync(join(BIN, 'vite'), ['build', '--outDir', out, '--emptyOutDir', '--logLevel', 'warn']);
  }
  return out;
}

/**
 * Starts everything and returns handles to it. `standins: 'own'` starts the local service stand-ins at
 * `standinBase`; 'inherit' uses the ones named in the environment (as under `npm test`).
 */
export async function startCluster(opts = {}) {
  const {
    name = 'cluster',
    dbPort = 3320,
    appPorts = [3031, 3032],
    balancerPort = 3030,
    standins = 'own',
    standinBase = 4620,
    client = true,
    rebuild = false,
    fresh = false,
    replica: useReplica = true,
    seedDemo = true,
    appEnv = {},
  } = opts;
  const started = [];
  const stopAll = async () => {
    for (const s of started.reverse()) await s.stop().catch(() => undefined);
  };
  try {
    const haproxy = ensureApt('haproxy', ['haproxy']);
    const { primary, replica } = await startDatabases({ name, dbPort, fresh });
    started.push(primary, replica);
    const dataDir = primary.dir;
    const logDir = join(dataDir, 'logs');
    mkdirSync(logDir, { recursive: true });

    let serviceEnv = {};
    if (standins === 'own') {
      serviceEnv = standinEnv(standinPorts(standinBase), dataDir);
      const child = startChild(join(BIN, 'tsx'), ['server/standins/index.ts'], {
        env: { ...process.env, ...serviceEnv },
        stdio: ['ignore', 'ignore', 'inherit'],
      });
      started.push({ stop: () => child.stopGroup() });
      await waitForHttp(`${serviceEnv.MAIL_INBOX_URL}/messages`, { child, timeoutMs: 60_000 });
    }

    const balancerUrl = `http://127.0.0.1:${balancerPort}`;
    const primaryUrl = primary.urlFor(DATABASE);
    const replicaUrl = replica.urlFor(DATABASE);
    const baseEnv = {
      ...process.env,
      ...serviceEnv,
      NODE_ENV: 'development',
      HOST: '127.0.0.1',
      DATABASE_URL: primaryUrl,
      DATABASE_REPLICA_URL: useReplica ? replicaUrl : '',
      SESSION_SECRET: primary.secrets.sessionSecret,
      APP_ORIGIN: balancerUrl,
      EXTRA_ORIGINS: appPorts.map((p) => `http://127.0.0.1:${p}`).join(','),
      TRUST_PROXY: '1',
      CLIENT_DIST: client ? clientBuild(name, rebuild) : '',
      ...appEnv,
    };
    const apps = [];
    for (const [i, port] of appPorts.entries()) {
      const label = String.fromCharCode(97 + i);
      const logFile = join(logDir, `app-${label}.log`);
      const out = createWriteStream(logFile, { flags: 'w' });
      await new Promise((r) => out.once('open', r));
      // Only the first instance migrates and seeds; the others start once it is ready.
      const env = {
        ...baseEnv,
        PORT: String(port),
        DB_MIGRATE: i === 0 ? '1' : '0',
        SEED_DEMO: i === 0 && seedDemo ? '1' : '0',
      };
      const child = startChild(join(BIN, 'tsx'), ['server/index.ts'], { env, stdio: ['ignore', out, out] });
      const url = `http://127.0.0.1:${port}`;
      const app = {
        label,
        url,
        logFile,
        child,
        stop: async () => {
          await child.stopGroup();
          out.end();
        },
      };
      started.push(app);
      apps.push(app);
      if (i === 0) await waitForHttp(`${url}/api/health`, { child, timeoutMs: 120_000 });
    }
    await Promise.all(apps.map((a) => waitForHttp(`${a.url}/api/health`, { child: a.child, timeoutMs: 120_000 })));

    const cfg = join(dataDir, 'haproxy.cfg');
    writeFileSync(cfg, haproxyConfig({ balancerPort, appPorts }));
    const balancer = startChild(haproxy, ['-db', '-f', cfg], { stdio: ['ignore', 'ignore', 'inherit'] });
    started.push({ stop: () => balancer.stopGroup('SIGTERM', 5_000) });
    await waitForHttp(`${balancerUrl}/api/health`, { child: balancer, timeoutMs: 30_000 });
    log(`balancer on ${balancerUrl} → ${apps.map((a) => a.url).join(', ')}`);

    return {
      primary,
      replica,
      primaryUrl,
      replicaUrl,
      apps,
      balancerUrl,
      logDir,
      serviceEnv: { ...process.env, ...serviceEnv },
      /** Stops the replica's server (the apps keep running); `startReplica()` brings it back. */
      stopReplica: () => replica.stop(),
      async startReplica() {
        const again = await startMariaDb({
          name: `${name}-replica`,
          port: dbPort + 1,
          databases: [DATABASE],
          serverArgs: ['--server-id=2', '--read-only=1', `--relay-log=${join(replica.dir, 'mariadb', 'relay')}`],
        });
        replica.stop = again.stop;
        replica.startedHere = again.startedHere;
      },
      stop: stopAll,
    };
  } catch (err) {
    await stopAll();
    throw err;
  }
}
