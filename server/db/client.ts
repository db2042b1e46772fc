// The database handle: drizzle over a mysql2 pool on the primary, and optionally a read replica. The pools
// reconnect by themselves after an outage.
//
// Which server a read goes to is chosen where the read is written, by the handle it uses:
// - `database.db` is the primary. Writes, transactions, and every read that must see a write already made
//   (the caller's own save, then their next look at that athlete's week; the sign-in path and sessions;
//   anything checked before a write) use it. It is the default: a read that does not say otherwise is
//   on the primary.
// - `database.mayLag` sends selects to the replica (Drizzle's `withReplicas`) and everything else to the
//   primary. Only reads that a few seconds of replication lag cannot mislead use it: the board's weeks
//   that are over, the library list, the history charts. Without a replica it is the primary.
// A replica that fails a read is set aside and that read runs on the primary; a probe in the background
// brings the replica back once it answers again.
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import { withReplicas } from 'drizzle-orm/mysql-core';
import mysql from 'mysql2/promise';
import { hasErrorCode } from './errors';
import * as schema from './schema';

export type Db = MySql2Database<typeof schema>;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Anything queries can run on: the database or an open transaction. */
export type Queryable = Db | Tx;

export type ReplicaState = 'none' | 'up' | 'down';

export interface Database {
  /** The primary: writes, transactions and reads that must see the latest write. */
  db: Db;
  /** Reads that may lag behind the primary by a few seconds (see above); writes still go to the primary. */
  mayLag: Db;
  pool: mysql.Pool;
  /** The replica's pool, when one is configured. */
  replicaPool: mysql.Pool | null;
  replica: ReplicaHealth;
  close(): Promise<void>;
}

export interface DatabaseOptions {
  connectionLimit?: number;
  /** A read replica of the primary; absent or empty: every read on the primary. */
  replicaUrl?: string;
  /** Called when reads move off the replica or back to it. */
  onReplicaChange?: (state: 'up' | 'down', reason?: string) => void;
}

function createPool(url: string, connectionLimit: number): mysql.Pool {
  const pool = mysql.createPool({
    uri: url,
    timezone: 'Z',
    connectionLimit,
    enableKeepAlive: true,
    connectTimeout: 3_000,
    dateStrings: ['DATE'],
    supportBigNumbers: true,
  });
  // Without a listener an idle connection that dies with the server would be an unhandled error.
  pool.on('connection', (conn) => conn.on('error', () => undefined));
  return pool;
}

const CONNECTION_CODES = [
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
];

/** The server could not be reached or dropped the connection: nothing about the query itself. */
export function isConnectionError(err: unknown): boolean {
  if ((err as { fatal?: unknown } | null)?.fatal === true) return true;
  return hasErrorCode(err, CONNECTION_CODES);
}

/** Whether reads may use the replica now; set aside on a failed read, taken back when a probe answers. */
export class ReplicaHealth {
  private down = false;
  private probe: NodeJS.Timeout | null = null;
  private closed = false;

  constructor(
    private readonly pool: mysql.Pool | null,
    private readonly onChange: DatabaseOptions['onReplicaChange'],
    private readonly probeEveryMs = 2_000,
  ) {}

  get state(): ReplicaState {
    if (!this.pool) return 'none';
    return this.down ? 'down' : 'up';
  }

  usable(): boolean {
    return this.pool !== null && !this.down;
  }

  /** Reads go to the primary until a probe of the replica answers. */
  setAside(reason: string): void {
    if (!this.pool || this.down || this.closed) return;
    this.down = true;
    this.onChange?.('down', reason);
    this.scheduleProbe();
  }

  private scheduleProbe(): void {
    if (this.probe || this.closed || !this.pool) return;
    const pool = this.pool;
    this.probe = setTimeout(() => {
      this.probe = null;
      void pingDatabase(pool).then((up) => {
        if (this.closed) return;
        if (up) {
          this.down = false;
          this.onChange?.('up');
        } else this.scheduleProbe();
      });
    }, this.probeEveryMs);
    this.probe.unref();
  }

  close(): void {
    this.closed = true;
    if (this.probe) clearTimeout(this.probe);
    this.probe = null;
  }
}

type Runner = (...args: unknown[]) => Promise<unknown>;

/**
 * What drizzle's replica handle talks to: the replica's pool while it is usable, the primary's
 * otherwise. A read that fails for want of a connection is run again on the primary (reads are safe to
 * repeat); any other error is the query's own and is passed on.
 */
function fallbackClient(replica: mysql.Pool, primary: mysql.Pool, health: ReplicaHealth) {
  const run =
    (method: 'query' | 'execute'): Runner =>
    async (...args) => {
      if (health.usable()) {
        try {
          return await (replica[method] as Runner)(...args);
        } catch (err) {
          if (!isConnectionError(err)) throw err;
          health.setAside(err instanceof Error ? err.message : String(err));
        }
      }
      return (primary[method] as Runner)(...args);
    };
  return {
    query: run('query'),
    execute: run('execute'),
    getConnection: () => (health.usable() ? replica : primary).getConnection(),
  };
}

export function createDatabase(url: string, opts: DatabaseOptions = {}): Database {
  const connectionLimit = opts.connectionLimit ?? 10;
  const pool = createPool(url, connectionLimit);
  const db = drizzle(pool, { schema, mode: 'planetscale' });
  const replicaPool = opts.replicaUrl ? createPool(opts.replicaUrl, connectionLimit) : null;
  const replica = new ReplicaHealth(replicaPool, opts.onReplicaChange);
  let mayLag: Db = db;
  if (replicaPool) {
    const client = fallbackClient(replicaPool, pool, replica);
    const replicaDb = drizzle(client as unknown as mysql.Pool, { schema, mode: 'planetscale' });
    mayLag = withReplicas(db, [replicaDb]) as Db;
  }
  return {
    db,
    mayLag,
    pool,
    replicaPool,
    replica,
    async close() {
      replica.close();
      await Promise.all([pool.end(), replicaPool?.end()]);
    },
  };
}

/** True when the database answers a trivial query within the timeout. */
export async function pingDatabase(pool: mysql.Pool, timeoutMs = 1_500): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      pool.query('SELECT 1'),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), timeoutMs);
      }),
    ]);
    return true;
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}
