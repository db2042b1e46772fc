// Start-up checks of the database servers, so a wrong setting shows as one clear log line rather than as
// puzzling errors later: a primary that refuses writes, a replica that does not answer, is writable, or is
// the primary itself. None of them stops the app: it serves from the primary what it can.
import type { Logger } from '../lib/logger';
import { pingDatabase, type Database } from './client';

/** Where a URL points, without its password, for log lines. */
export function serverOf(url: string): string {
  try {
    const u = new URL(url);
    return `${u.hostname}:${u.port || '3306'}${u.pathname}`;
  } catch {
    return '(unreadable URL)';
  }
}

interface ServerFacts {
  readOnly: boolean;
  serverId: number;
}

async function factsOf(pool: NonNullable<Database['replicaPool']>): Promise<ServerFacts> {
  const [rows] = await pool.query('SELECT @@global.read_only AS ro, @@server_id AS id');
  const row = (rows as { ro: number | string; id: number | string }[])[0]!;
  return { readOnly: Number(row.ro) === 1, serverId: Number(row.id) };
}

export interface TopologyReport {
  primaryReadOnly: boolean;
  replica: 'none' | 'up' | 'down';
}

export async function checkDatabaseServers(
  database: Database,
  logger: Logger,
  urls: { primary: string; replica: string },
): Promise<TopologyReport> {
  const log = logger.child({ module: 'database' });
  let primary: ServerFacts | null = null;
  try {
    primary = await factsOf(database.pool);
  } catch (err) {
    log.error(
      { primary: serverOf(urls.primary), err: err instanceof Error ? err.message : String(err) },
      `the primary database ${serverOf(urls.primary)} does not answer; requests fail until it does`,
    );
  }
  if (primary?.readOnly) {
    log.error(
      { primary: serverOf(urls.primary) },
      `the primary database ${serverOf(urls.primary)} is read-only (read_only=ON): every save will fail. ` +
        'DATABASE_URL must name the writable server; a replica belongs in DATABASE_REPLICA_URL',
    );
  }
  if (!database.replicaPool) {
    log.info('no read replica configured: every read on the primary');
    return { primaryReadOnly: primary?.readOnly ?? false, replica: 'none' };
  }
  const where = serverOf(urls.replica);
  if (!(await pingDatabase(database.replicaPool, 3_000))) {
    database.replica.setAside('did not answer at start-up');
    log.warn(
      { replica: where },
      `the read replica ${where} does not answer: every read goes to the primary until it does`,
    );
    return { primaryReadOnly: primary?.readOnly ?? false, replica: 'down' };
  }
  const replica = await factsOf(database.replicaPool);
  if (primary && replica.serverId === primary.serverId) {
    log.warn({ replica: where }, `DATABASE_REPLICA_URL names the primary itself (same server_id ${replica.serverId})`);
  } else if (!replica.readOnly) {
    log.warn(
      { replica: where },
      `the read replica ${where} accepts writes (read_only=OFF); replicas should be read-only`,
    );
  }
  log.info({ replica: where }, `reads that may lag go to the replica ${where}`);
  return { primaryReadOnly: primary?.readOnly ?? false, replica: 'up' };
}
