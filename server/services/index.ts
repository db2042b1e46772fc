// Adapters for hosted services (mail, video storage, payments), built once from the environment.
// Each talks to the real service through its SDK, or to the local stand-in on loopback.
import type { Env } from '../config/env';
import type { Logger } from '../lib/logger';

// Each service adds its adapter here.
export interface Services {}

export function createServices(_env: Env, _logger: Logger): Services {
  return {};
}

/** Stops background work (outbox senders and the like) on shutdown. */
export async function stopServices(_services: Services): Promise<void> {}
