// Reads that may lag go to the replica, everything else to the primary, and a replica that does not
// answer (at start-up or later) costs no read: it runs on the primary. The "replica" here is a second
// database on the test server reached through a TCP relay the test can cut, so which server answered is
// visible from the rows and a dead replica is one closed socket away. The real GTID replica is tested in
// the topology test.
import { createServer, createConnection, type Server, type Socket } from 'node:net';
import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import mysql from 'mysql2/promise';
import { createDatabase, type Database } from '../../server/db/client';
import { checkDatabaseServers } from '../../server/db/topology';
import { variants } from '../../server/db/schema';
import { createLogger } from '../../server/lib/logger';
import { createTeam, createVariant } from '../support/factories';
import { recreateDatabase, testDatabaseUrl } from '../support/integration-setup';

/** A relay from a local port to the test server that can be cut (every connection dropped) and restored. */
class Relay {
  private server: Server | null = null;
  private sockets = new Set<Socket>();
  port = 0;
  constructor(private readonly target: { host: string; port: number }) {}

  async open(port = 0): Promise<void> {
    this.server = createServer((client) => {
      const upstream = createConnection(this.target);
      for (const s of [client, upstream]) {
        this.sockets.add(s);
        s.on('close', () => this.sockets.delete(s));
        s.on('error', () => undefined);
      }
      client.pipe(upstream).pipe(client);
    });
    await new Promise<void>((r) => this.server!.listen(port, '127.0.0.1', r));
    this.port = (this.server.address() as { port: number }).port;
  }

  async cut(): Promise<void> {
    for (const s of this.sockets) s.destroy();
    await new Promise<void>((r) => (this.server ? this.server.close(() => r()) : r()));
    this.server = null;
  }
}

function capturedLogger() {
  const lines: string[] = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      lines.push(String(chunk));
      done();
    },
  });
  return { logger: createLogger('info', sink), lines };
}

const urlOn = (url: string, port: number) => {
  const u = new URL(url);
  u.port = String(port);
  return u.toString();
};

let primaryUrl: string;
let replicaUrl: string;
let relay: Relay;
let seeded: { teamId: number; onlyOnReplica: string };

beforeAll(async () => {
  primaryUrl = await recreateDatabase('rackturn_replica_primary');
  replicaUrl = await recreateDatabase('rackturn_replica_copy');
  // The same team id on both, with a variant the primary does not have: reads that find it came from the replica.
  const primary = createDatabase(primaryUrl, { connectionLimit: 2 });
  const copy = createDatabase(replicaUrl, { connectionLimit: 2 });
  const team = await createTeam(primary.db);
  const copyTeam = await createTeam(copy.db);
  expect(copyTeam.teamId).toBe(team.teamId);
  const onlyOnReplica = `Replica-only ${team.teamId}`;
  await createVariant(copy.db, team.teamId, { name: onlyOnReplica });
  seeded = { teamId: team.teamId, onlyOnReplica };
  await Promise.all([primary.close(), copy.close()]);
  const target = new URL(testDatabaseUrl(''));
  relay = new Relay({ host: target.hostname, port: Number(target.port) });
  await relay.open();
}, 60_000);

afterAll(async () => {
  await relay?.cut();
});

const namesVia = async (db: Database['db'], teamId: number) =>
  (await db.select({ name: variants.name }).from(variants).where(eq(variants.teamId, teamId))).map((r) => r.name);

/** The primary, with the copy behind the relay as its replica; `changes` records every switch of reads. */
function throughRelay() {
  const changes: string[] = [];
  const database = createDatabase(primaryUrl, {
    connectionLimit: 2,
    replicaUrl: urlOn(replicaUrl, relay.port),
    onReplicaChange: (s) => changes.push(s),
  });
  return { database, changes };
}

describe('read replica', () => {
  it('sends selects on the may-lag handle to the replica, and writes and primary reads to the primary', async () => {
    const { database, changes } = throughRelay();
    try {
      const { logger, lines } = capturedLogger();
      const report = await checkDatabaseServers(database, logger, { primary: primaryUrl, replica: replicaUrl });
      expect(report).toEqual({ primaryReadOnly: false, replica: 'up' });
      // Same server behind both URLs here, so the start-up check says so.
      expect(lines.join('')).toContain('names the primary itself');

      expect(await namesVia(database.mayLag, seeded.teamId)).toContain(seeded.onlyOnReplica);
      expect(await namesVia(database.db, seeded.teamId)).not.toContain(seeded.onlyOnReplica);
      // An insert through the may-lag handle still lands on the primary.
      await createVariant(database.mayLag, seeded.teamId, { name: 'Written through may-lag' });
      expect(await namesVia(database.db, seeded.teamId)).toContain('Written through may-lag');
      expect(await namesVia(database.mayLag, seeded.teamId)).not.toContain('Written through may-lag');
      expect(database.replica.state).toBe('up');
      expect(changes).toEqual([]);
    } finally {
      await database.close();
    }
  });

  it('reads from the primary when the replica dies, and from the replica again once it answers', async () => {
    const { database, changes } = throughRelay();
    try {
      expect(await namesVia(database.mayLag, seeded.teamId)).toContain(seeded.onlyOnReplica);
      const port = relay.port;
      await relay.cut();
      // The pooled connection is gone and no new one can be made: the read is served by the primary.
      const names = await namesVia(database.mayLag, seeded.teamId);
      expect(names).not.toContain(seeded.onlyOnReplica);
      expect(database.replica.state).toBe('down');
      expect(changes).toEqual(['down']);

      await relay.open(port);
      const deadline = Date.now() + 15_000;
      while (database.replica.state !== 'up' && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      expect(database.replica.state).toBe('up');
      expect(await namesVia(database.mayLag, seeded.teamId)).toContain(seeded.onlyOnReplica);
      expect(changes).toEqual(['down', 'up']);
    } finally {
      await database.close();
    }
  });

  it('says clearly at start-up that a replica does not answer, and serves every read from the primary', async () => {
    // A port with nothing behind it: a listener opened and closed again.
    const probe = new Relay({ host: '127.0.0.1', port: 1 });
    await probe.open();
    const deadPort = probe.port;
    await probe.cut();
    const deadUrl = urlOn(replicaUrl, deadPort);
    const database = createDatabase(primaryUrl, { connectionLimit: 2, replicaUrl: deadUrl });
    try {
      const { logger, lines } = capturedLogger();
      const report = await checkDatabaseServers(database, logger, { primary: primaryUrl, replica: deadUrl });
      expect(report.replica).toBe('down');
      const warning = lines.map((l) => JSON.parse(l) as { level: number; msg: string }).find((l) => l.level === 40);
      expect(warning?.msg).toBe(
        `the read replica 127.0.0.1:${deadPort}/rackturn_replica_copy does not answer: every read goes to the primary until it does`,
      );
      expect(lines.join('')).not.toContain(new URL(primaryUrl).password);
      expect(await namesVia(database.mayLag, seeded.teamId)).toContain('Written through may-lag');
    } finally {
      await database.close();
    }
  });

  it('passes on a query error from the replica rather than running the query twice', async () => {
    const empty = testDatabaseUrl('rackturn_replica_empty');
    const admin = await mysql.createConnection({ uri: testDatabaseUrl('') });
    await admin.query('CREATE DATABASE IF NOT EXISTS rackturn_replica_empty');
    await admin.end();
    const database = createDatabase(primaryUrl, { connectionLimit: 2, replicaUrl: empty });
    try {
      await expect(namesVia(database.mayLag, seeded.teamId)).rejects.toThrow();
      expect(database.replica.state).toBe('up');
    } finally {
      await database.close();
    }
  });

  it('without a replica, the may-lag handle is the primary', async () => {
    const database = createDatabase(primaryUrl, { connectionLimit: 1 });
    try {
      expect(database.mayLag).toBe(database.db);
      expect(database.replica.state).toBe('none');
    } finally {
      await database.close();
    }
  });
});
