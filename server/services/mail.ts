// The mail adapter: messages are queued in the outbox table in the caller's transaction, and a sender
// loop in the app process delivers them over SMTP (nodemailer) with exponential back-off on failure,
// so an SMTP outage delays mail and loses none.
import nodemailer, { type Transporter } from 'nodemailer';
import type { Env } from '../config/env';
import { createDatabase, type Database, type Queryable } from '../db/client';
import type { Logger } from '../lib/logger';
import { retryDelayMs, type OutgoingMail } from './mail/outbox';
import { claimDue, markFailed, markSent, queueMail } from './mail/outbox.repository';

export type { MailKind, OutgoingMail } from './mail/outbox';

/** Messages claimed per database round trip. */
const BATCH = 10;
/** How long a claimed message is held for this instance; well above the worst SMTP timeouts per batch. */
const LEASE_MS = 10 * 60_000;

export interface SendPass {
  sent: number;
  failed: number;
}

export interface MailService {
  /** Queues a message inside the caller's transaction; false when its dedupe key was queued before. */
  enqueue(db: Queryable, mail: OutgoingMail): Promise<boolean>;
  /** Asks the sender for a pass soon, e.g. right after a commit that queued mail. */
  kick(): void;
  /** Sends everything due now, in this call; what tests use instead of waiting for the loop. */
  sendDue(): Promise<SendPass>;
  stop(): Promise<void>;
}

function smtpTransport(env: Env): Transporter {
  return nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ...(env.SMTP_USER ? { auth: { user: env.SMTP_USER, pass: env.SMTP_PASSWORD } } : {}),
    // A dead server must not hold the sender for minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  });
}

export function createMailService(env: Env, logger: Logger, opts: { database?: Database } = {}): MailService {
  const log = logger.child({ module: 'mail' });
  const transport = smtpTransport(env);
  // The sender has its own small pool, so a burst of mail never starves request handling.
  let ownDb: Database | null = null;
  const database = () => opts.database ?? (ownDb ??= createDatabase(env.DATABASE_URL, { connectionLimit: 2 }));
  const interval = env.MAIL_SEND_INTERVAL_MS;

  let timer: NodeJS.Timeout | null = null;
  let current: Promise<SendPass> | null = null;
  let again = false;
  let stopped = false;

  async function sendOne(row: Awaited<ReturnType<typeof claimDue>>[number]): Promise<boolean> {
    const db = database().db;
    try {
      await transport.sendMail({
        from: env.MAIL_FROM,
        to: row.toEmail,
        subject: row.subject,
        text: row.textBody,
        html: row.htmlBody,
        headers: row.headers ?? {},
      });
    } catch (err) {
      const failures = row.attempts + 1;
      const delay = retryDelayMs(failures, env.MAIL_RETRY_BASE_MS, env.MAIL_RETRY_MAX_MS);
      const message = err instanceof Error ? err.message : String(err);
      log.warn({ outboxId: row.id, kind: row.kind, attempts: failures, retryInMs: delay, err: message }, 'send failed');
      await markFailed(db, row.id, message, new Date(Date.now() + delay));
      return false;
    }
    await markSent(db, row);
    return true;
  }

  async function pass(): Promise<SendPass> {
    const result: SendPass = { sent: 0, failed: 0 };
    const db = database().db;
    // Bounded, so one pass cannot run forever while new mail keeps arriving.
    for (let round = 0; round < 50; round++) {
      const rows = await claimDue(db, BATCH, LEASE_MS);
      for (const row of rows) {
        if (await sendOne(row)) result.sent++;
        else result.failed++;
      }
      if (rows.length < BATCH) break;
    }
    if (result.sent || result.failed) log.info(result, 'outbox pass');
    return result;
  }

  /** One pass at a time; a request for another during a pass runs right after it. */
  function runPass(): Promise<SendPass> {
    if (current) {
      again = true;
      return current;
    }
    current = pass().finally(() => {
      current = null;
      if (again && !stopped) {
        again = false;
        void runPass().catch(() => undefined);
      }
    });
    return current;
  }

  function schedule(delayMs: number) {
    if (stopped || interval === 0) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      runPass()
        .catch((err: unknown) => log.error({ err }, 'outbox pass failed'))
        .finally(() => schedule(interval));
    }, delayMs);
    timer.unref();
  }
  schedule(interval);

  return {
    enqueue: (db, mail) => queueMail(db, mail),
    kick: () => schedule(0),
    async sendDue() {
      // A pass already under way may have claimed rows before they were due; run one more after it.
      if (current) await current.catch(() => undefined);
      return runPass();
    },
    async stop() {
      if (stopped) return;
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      if (current) await current.catch(() => undefined);
      transport.close();
      if (ownDb) await ownDb.close();
    },
  };
}
