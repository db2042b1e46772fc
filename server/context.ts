// What every module gets from createApp(): the database, settings, logger and service adapters.
import type { Database } from './db/client';
import type { Env } from './config/env';
import type { Logger } from './lib/logger';
import type { SessionKeys } from './lib/session';
import type { Services } from './services';

export interface AppContext {
  env: Env;
  database: Database;
  logger: Logger;
  sessions: SessionKeys;
  services: Services;
}
