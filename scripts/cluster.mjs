// `npm run cluster`: the app as it runs past one machine, on loopback — a MariaDB primary with a GTID
// replica, two app instances and HAProxy in front — and all of it down again on Ctrl-C or SIGTERM.
// Ports: CLUSTER_DB_PORT (primary; the replica is one up), CLUSTER_APP_PORT (first instance; the second
// is one up), CLUSTER_PORT (the balancer), CLUSTER_STANDIN_PORT_BASE. `-- --fresh` starts from empty
// databases, `-- --rebuild` builds the client again, `-- --no-replica` runs every read on the primary, `-- --api-only` serves no client.
import { ensureNodeModules, log } from './lib.mjs';
import { startCluster } from './cluster-lib.mjs';

const args = process.argv.slice(2);
const num = (name, fallback) => Number(process.env[name] ?? fallback);
const appPort = num('CLUSTER_APP_PORT', 3031);
const t0 = Date.now();

ensureNodeModules();
let cluster = null;
let stopping = false;
async function stop(code) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  await cluster?.stop();
  log('stopped');
  process.exit(code);
}
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(sig, () => void stop(0));

try {
  cluster = await startCluster({
    name: process.env.CLUSTER_INSTANCE ?? 'cluster',
    dbPort: num('CLUSTER_DB_PORT', 3320),
    appPorts: [appPort, appPort + 1],
    balancerPort: num('CLUSTER_PORT', 3030),
    standinBase: num('CLUSTER_STANDIN_PORT_BASE', 4620),
    fresh: args.includes('--fresh'),
    rebuild: args.includes('--rebuild'),
    replica: !args.includes('--no-replica'),
    client: !args.includes('--api-only'),
  });
  for (const app of cluster.apps) {
    app.child.on('exit', (c) => {
      if (!stopping) {
        log(`instance ${app.label} exited (${c}); its log: ${app.logFile}`);
        void stop(1);
      }
    });
  }
  log(`ready in ${((Date.now() - t0) / 1000).toFixed(1)} s → ${cluster.balancerUrl}`);
  log(`instances: ${cluster.apps.map((a) => `${a.label} ${a.url}`).join(', ')}; logs in ${cluster.logDir}`);
  log('demo sign-ins (password rackturn-demo): coach@rackturn.test, athlete@rackturn.test');
  log('press Ctrl-C to stop everything');
} catch (err) {
  log(String(err instanceof Error ? err.message : err));
  await stop(1);
}
