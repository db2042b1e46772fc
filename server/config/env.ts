// The server's environment, checked once at start-up with a readable list of what is wrong.
import { z } from 'zod';

const bool = z
  .enum(['0', '1', 'true', 'false', ''])
  .optional()
  .transform((v) => v === '1' || v === 'true');

const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  DATABASE_URL: z.string().startsWith('mysql://', 'must be a mysql:// URL'),
  /** A read replica of DATABASE_URL for reads that may lag; empty: every read on the primary. */
  DATABASE_REPLICA_URL: z
    .union([z.literal(''), z.string().startsWith('mysql://', 'must be a mysql:// URL')])
    .default(''),
  SESSION_SECRET: z.string().min(32, 'must be at least 32 characters'),
  APP_ORIGIN: z.url().default('http://127.0.0.1:3000'),
  EXTRA_ORIGINS: z.string().default(''),
  /** Behind a load balancer or TLS proxy: how many proxy hops to trust for protocol and address. */
  TRUST_PROXY: z.coerce.number().int().min(0).max(10).default(0),
  CLIENT_DIST: z.string().default(''),
  DB_MIGRATE: bool,
  SEED_DEMO: bool,
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Failed sign-ins from one address (any account) before each further one is held back, growing. */
  LOGIN_LIMIT_PER_IP: z.coerce.number().int().positive().default(30),
  /** Failed sign-ins for one account from one address before each further one is held back, growing. */
  LOGIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
  /** The first hold after the free failures; each further failure doubles it, up to LOGIN_DELAY_MAX_S. */
  LOGIN_DELAY_BASE_S: z.coerce.number().int().positive().default(2),
  LOGIN_DELAY_MAX_S: z.coerce.number().int().positive().default(900),
  /** How long an instance trusts a session it looked up before asking MariaDB again (a revocation elsewhere takes this long). */
  SESSION_CACHE_MS: z.coerce.number().int().min(0).max(60_000).default(3_000),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().default(4400),
  SMTP_SECURE: bool,
  SMTP_USER: z.string().default(''),
  SMTP_PASSWORD: z.string().default(''),
  MAIL_FROM: z.string().default('Rackturn <no-reply@rackturn.test>'),
  /** How often coaches' notice jobs run (missed top sets, daily summaries); 0 turns them off. */
  NOTICE_JOBS_INTERVAL_MS: z.coerce
    .number()
    .int()
    .min(0)
    .default(5 * 60_000),
  /** How often the outbox sender looks for due mail; 0 turns the loop off (sends only when asked). */
  MAIL_SEND_INTERVAL_MS: z.coerce.number().int().min(0).default(5_000),
  /** First retry delay after a failed send; it doubles on each failure up to MAIL_RETRY_MAX_MS. */
  MAIL_RETRY_BASE_MS: z.coerce.number().int().positive().default(30_000),
  MAIL_RETRY_MAX_MS: z.coerce.number().int().positive().default(3_600_000),
  RESET_LIMIT_PER_IP: z.coerce.number().int().positive().default(20),
  RESET_LIMIT_PER_ADDRESS: z.coerce.number().int().positive().default(5),
  S3_ENDPOINT: z.string().default(''),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().default('rackturn-videos'),
  S3_ACCESS_KEY_ID: z.string().default(''),
  S3_SECRET_ACCESS_KEY: z.string().default(''),
  /** Largest video upload accepted, in bytes (200 MB). */
  VIDEO_MAX_BYTES: z.coerce
    .number()
    .int()
    .positive()
    .default(200 * 1024 * 1024),
  PAYMENTS_HOST: z.string().default(''),
  PAYMENTS_PORT: z.coerce.number().int().default(4403),
  PAYMENTS_PROTOCOL: z.enum(['http', 'https']).default('https'),
  PAYMENTS_SECRET_KEY: z.string().default('sk_test_rackturn_local_fake'),
  PAYMENTS_WEBHOOK_SECRET: z.string().default('whsec_rackturn_local_fake'),
});

export type Env = z.infer<typeof schema>;

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  - ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The server's environment is not valid:\n${lines.join('\n')}`);
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.SEED_DEMO) {
    throw new Error('SEED_DEMO must not be set in production: demo accounts are for development only');
  }
  return parsed.data;
}

/** Every origin whose cookie-authenticated writes are accepted. */
export function allowedOrigins(env: Env): Set<string> {
  const extra = env.EXTRA_ORIGINS.split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  return new Set([new URL(env.APP_ORIGIN).origin, ...extra]);
}
