// Adapters for hosted services (mail, video storage, payments), built once from the environment.
// Each talks to the real service through its SDK, or to the local stand-in on loopback.
import type { Env } from '../config/env';
import type { Logger } from '../lib/logger';
import { createPayments, type Payments } from './payments';
import { createMailService, type MailService } from './mail';
import { createStorage, type Storage } from './storage';

// Each service adds its adapter here.
export interface Services {
  /** Outgoing e-mail: queued in the outbox, delivered over SMTP by a sender loop. */
  mail: MailService;
  /** The payment provider's SDK (or the local fake) for coaching fees. */
  payments: Payments;
  /** Uploaded videos in object storage. */
  storage: Storage;
}

export function createServices(env: Env, logger: Logger): Services {
  return {
    mail: createMailService(env, logger),
    payments: createPayments(env, logger),
    storage: createStorage(env),
  };
}

/** Stops background work (outbox senders and the like) on shutdown. */
export async function stopServices(services: Services): Promise<void> {
  await services.mail.stop();
  services.storage.close();
}
