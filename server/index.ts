// Process entry: read the environment, prepare the database, listen, and shut down gracefully.
import { loadEnv } from './config/env';
import { createApp } from './app';
import { createDatabase } from './db/client';
import { runMigrations } from './db/migrate';
import { checkDatabaseServers, serverOf } from './db/topology';
import { createLogger } from './lib/logger';
import { SessionKeys } from './lib/session';
import type { AppContext } from './context';
import { createServices, stopServices } from './services';
import { startNoticeJobs } from './modules/notices/notices.service';
import { stopLiveEvents } from './modules/events/events.service';

const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL);
const database = createDatabase(env.DATABASE_URL, {
  replicaUrl: env.DATABASE_REPLICA_URL,
  onReplicaChange: (state, reason) => {
    const replica = serverOf(env.DATABASE_REPLICA_URL);
    if (state === 'down') logger.warn({ replica, reason }, 'the read replica failed a read: reads go to the primary');
    else logger.info({ replica }, 'the read replica answers again: reads that may lag go back to it');
  },
});
await checkDatabaseServers(database, logger, { primary: env.DATABASE_URL, replica: env.DATABASE_REPLICA_URL });

if (env.DB_MIGRATE) {
  await runMigrations(database.db);
  logger.info('migrations applied');
}
if (env.SEED_DEMO) {
  const { seedDemoIfEmpty } = await import('./db/seed/demo');
  const seeded = await seedDemoIfEmpty(database.db);
  logger.info(seeded ? 'demo data seeded' : 'demo data already present');
}

const services = createServices(env, logger);
const ctx: AppContext = { env, database, logger, sessions: new SessionKeys(env.SESSION_SECRET), services };
const app = createApp(ctx);
const noticeJobs = startNoticeJobs(ctx, env.NOTICE_JOBS_INTERVAL_MS);
const server = app.listen(env.PORT, env.HOST, () => {
  logger.info({ url: `http://${env.HOST}:${env.PORT}` }, 'listening');
});

let closing = false;
async function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  logger.info({ signal }, 'shutting down');
  noticeJobs.stop();
  // Open event streams would hold server.close() until the clients go.
  stopLiveEvents(ctx);
  server.close();
  server.closeIdleConnections();
  setTimeout(() => server.closeAllConnections(), 5_000).unref();
  await stopServices(services).catch(() => undefined);
  await database.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
