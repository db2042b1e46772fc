// The short run of the topology on loopback, as `npm run cluster` starts it: a MariaDB primary with a GTID
// replica and two app instances. Nothing an instance keeps for itself may change an answer: a save on one
// is read on the other, a sign-out holds on both, rate limits and the outbox are shared, and the replica
// can lag or stop without a wrong or failed read. `npm run soak` runs the same checks at full size.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDatabase, type Database } from '../../server/db/client';
import { checkDatabaseServers } from '../../server/db/topology';
import { createLogger } from '../../server/lib/logger';
import type { Cluster } from '../../scripts/cluster-lib.mjs';
import {
  call,
  outboxExactlyOnce,
  rateLimitAcrossInstances,
  replicaStoppedFallsBack,
  saveVisibleWhileReplicaLags,
  signOutOnARefusedOnB,
  startTopology,
  TOPOLOGY_FREE_FAILURES,
  TOPOLOGY_SESSION_CACHE_MS,
  writeOnAReadOnB,
} from '../support/topology';
import { Writable } from 'node:stream';

const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
const SESSION_CACHE_MS = TOPOLOGY_SESSION_CACHE_MS;
const FREE_FAILURES = TOPOLOGY_FREE_FAILURES;

let cluster: Cluster;
let database: Database;

beforeAll(async () => {
  cluster = await startTopology({
    name: `${process.env.TEST_INSTANCE ?? 'test'}-topology`,
    dbPort: num('TEST_CLUSTER_DB_PORT', 3350),
    appPort: num('TEST_CLUSTER_APP_PORT', 3110),
    standinBase: num('TEST_CLUSTER_STANDIN_PORT_BASE', 4520),
  });
  database = createDatabase(cluster.primaryUrl, { connectionLimit: 4 });
}, 240_000);

afterAll(async () => {
  await database?.close();
  await cluster?.stop();
}, 60_000);

describe('two instances, a primary and a replica', () => {
  it('deals requests to both instances through the balancer', async () => {
    const replies = await Promise.all(Array.from({ length: 4 }, () => call(cluster.balancerUrl, 'GET', '/api/health')));
    expect(replies.map((r) => r.body)).toEqual(Array(4).fill({ ok: true, db: 'up', replica: 'up' }));
  });

  it('reads through B a save made through A', async () => {
    expect(await writeOnAReadOnB(cluster, database)).toEqual({ checked: 3 });
  }, 30_000);

  it('refuses on B a session signed out on A', async () => {
    const { refusedAfterMs } = await signOutOnARefusedOnB(cluster, database, SESSION_CACHE_MS);
    expect(refusedAfterMs).toBeLessThanOrEqual(SESSION_CACHE_MS + 1_500);
  }, 30_000);

  it('counts failed sign-ins across both instances', async () => {
    expect(await rateLimitAcrossInstances(cluster, database, FREE_FAILURES)).toEqual({ heldAfter: FREE_FAILURES });
  }, 30_000);

  it('delivers each outbox message once with both instances sending', async () => {
    const result = await outboxExactlyOnce(cluster, database, 60);
    expect(result.delivered).toBe(60);
    expect(result.sentPerInstance.reduce((a, b) => a + b, 0)).toBe(60);
    // Both senders took part (claims are small batches, so neither can take the whole queue at once).
    expect(Math.min(...result.sentPerInstance)).toBeGreaterThan(0);
  }, 90_000);

  it("shows a coach's save in their next read while the replica lags", async () => {
    expect(await saveVisibleWhileReplicaLags(cluster, database)).toEqual({ saveSeenOn: 2 });
  }, 30_000);

  it('reads from the primary while the replica is stopped, and uses the replica again after', async () => {
    const result = await replicaStoppedFallsBack(cluster, database);
    expect(result.readsWhileDown).toBe(6);
  }, 90_000);

  it('says at start-up that a primary is read-only', async () => {
    // The replica's URL given as the primary: the mistake the message is for.
    const wrong = createDatabase(cluster.replicaUrl, { connectionLimit: 1 });
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _enc, done) {
        lines.push(String(chunk));
        done();
      },
    });
    try {
      const report = await checkDatabaseServers(wrong, createLogger('info', sink), {
        primary: cluster.replicaUrl,
        replica: '',
      });
      expect(report.primaryReadOnly).toBe(true);
      expect(lines.join('')).toContain('is read-only (read_only=ON): every save will fail');
    } finally {
      await wrong.close();
    }
  });
});
