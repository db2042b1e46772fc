// The database handle: drizzle over a mysql2 pool. The pool reconnects by itself after an outage.
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema';

export type Db = MySql2Database<typeof schema>;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Anything queries can run on: the database or an open transaction. */
export type Queryable = Db | Tx;

export interface Database {
  db: Db;
  pool: mysql.Pool;
  close(): Promise<void>;
}

export function createDatabase(url: string, opts: { connectionLimit?: number } = {}): Database {
  const pool = mysql.createPool({
    uri: url,
    timezone: 'Z',
    connectionLimit: opts.connectionLimit ?? 10,
    enableKeepAlive: true,
    connectTimeout: 3_000,
    dateStrings: ['DATE'],
    supportBigNumbers: true,
  });
  // Without a listener an idle connection that dies with the server would be an unhandled error.
  pool.on('connection', (conn) => conn.on('error', () => undefined));
  const db = drizzle(pool, { schema, mode: 'planetscale' });
  return { db, pool, close: () => pool.end() };
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
