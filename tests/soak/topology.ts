// The full topology run for `npm run soak`: the cluster as `npm run cluster` starts it (primary, GTID
// replica, two instances, HAProxy), every topology check over several rounds, 200 queued messages with
// both senders at work, and traffic through the balancer while the replica stops and starts. Runs alone
// with `npx tsx tests/soak/topology.ts` and prints its JSON.
import { pathToFileURL } from 'node:url';
import { createDatabase } from '../../server/db/client';
import {
  call,
  outboxExactlyOnce,
  rateLimitAcrossInstances,
  replicaStoppedFallsBack,
  saveVisibleWhileReplicaLags,
  signIn,
  signOutOnARefusedOnB,
  startTopology,
  TOPOLOGY_FREE_FAILURES,
  TOPOLOGY_SESSION_CACHE_MS,
  writeOnAReadOnB,
} from '../support/topology';
import { createTeam } from '../support/factories';

const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);

export interface TopologyOptions {
  rounds: number;
  outboxMessages: number;
}

export async function topologySoak(opts: TopologyOptions) {
  const sessionCacheMs = TOPOLOGY_SESSION_CACHE_MS;
  const freeFailures = TOPOLOGY_FREE_FAILURES;
  const cluster = await startTopology({
    name: 'soak-topology',
    dbPort: num('SOAK_CLUSTER_DB_PORT', 3344),
    appPort: num('SOAK_CLUSTER_APP_PORT', 3346),
    standinBase: num('SOAK_CLUSTER_STANDIN_PORT_BASE', 4850),
  });
  const database = createDatabase(cluster.primaryUrl, { connectionLimit: 4 });
  const failures: string[] = [];
  const results: Record<string, unknown[]> = {};
  const run = async (name: string, check: () => Promise<unknown>) => {
    try {
      (results[name] ??= []).push(await check());
    } catch (err) {
      failures.push(`${name}: ${err instanceof Error ? err.message : String(err)}`);
    }
  };
  try {
    for (let r = 0; r < opts.rounds; r++) {
      await run('writeOnAReadOnB', () => writeOnAReadOnB(cluster, database));
      await run('signOutOnARefusedOnB', () => signOutOnARefusedOnB(cluster, database, sessionCacheMs));
      await run('rateLimitAcrossInstances', () => rateLimitAcrossInstances(cluster, database, freeFailures));
      await run('saveVisibleWhileReplicaLags', () => saveVisibleWhileReplicaLags(cluster, database));
    }
    await run('outboxExactlyOnce', async () => {
      const result = await outboxExactlyOnce(cluster, database, opts.outboxMessages, 180_000);
      if (Math.min(...result.sentPerInstance) === 0)
        throw new Error(`one sender sent nothing: ${result.sentPerInstance}`);
      return result;
    });
    // Readers through the balancer keep going while the replica stops and comes back: no failed answer.
    await run('balancerThroughReplicaOutage', async () => {
      const team = await createTeam(database.db);
      const cookie = await signIn(cluster.balancerUrl, team.coach.email);
      let stop = false;
      const statuses: Record<string, number> = {};
      const reader = async () => {
        while (!stop) {
          const reply = await call(cluster.balancerUrl, 'GET', '/api/variants?limit=50', { cookie });
          statuses[reply.status] = (statuses[reply.status] ?? 0) + 1;
        }
      };
      const readers = Array.from({ length: 4 }, reader);
      const outage = await replicaStoppedFallsBack(cluster, database);
      stop = true;
      await Promise.all(readers);
      const bad = Object.entries(statuses).filter(([s]) => s !== '200');
      if (bad.length)
        throw new Error(`reads through the balancer failed during the outage: ${JSON.stringify(statuses)}`);
      return { ...outage, readsThroughBalancer: statuses['200'] ?? 0 };
    });
  } finally {
    await database.close();
    await cluster.stop();
  }
  return { pass: failures.length === 0, rounds: opts.rounds, failures, results };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const result = await topologySoak({
    rounds: num('SOAK_TOPOLOGY_ROUNDS', 3),
    outboxMessages: num('SOAK_OUTBOX_MESSAGES', 200),
  });
  process.stdout.write(JSON.stringify(result, null, 2) + '\n');
  process.exit(result.pass ? 0 : 1);
}
