// A store for express-rate-limit that keeps its counters in MariaDB, so a limit holds across every app
// instance behind a load balancer. Keys are hashed: the table holds no addresses or e-mail addresses.
// Times come from the database's clock (in UTC, as the driver reads them), the one clock every instance shares.
import { createHash } from 'node:crypto';
import { eq, lt, sql } from 'drizzle-orm';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Db } from './client';
import { rateLimitHits } from './schema';

/** Expired counters are swept about once per this many increments. */
const SWEEP_EVERY = 200;

export class MariaDbRateLimitStore implements Store {
  /** Not local: a key counted here is counted for every instance. */
  localKeys = false;
  private windowMs = 60_000;
  private increments = 0;

  constructor(
    private readonly db: Db,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private hash(key: string): string {
    return createHash('sha256').update(`${this.prefix}:${key}`).digest('hex');
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.db
      .select({ hits: rateLimitHits.hits, resetAt: rateLimitHits.resetAt })
      .from(rateLimitHits)
      .where(eq(rateLimitHits.keyHash, this.hash(key)));
    if (!row || row.resetAt.getTime() <= Date.now()) return undefined;
    return { totalHits: row.hits, resetTime: row.resetAt };
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const keyHash = this.hash(key);
    const windowEnd = sql`UTC_TIMESTAMP(3) + INTERVAL ${this.windowMs * 1000} MICROSECOND`;
    // One atomic statement per hit: a window that has ended starts again at 1. MariaDB evaluates the
    // assignments left to right, so `reset_at` is still the old value when `hits` is decided.
    await this.db
      .insert(rateLimitHits)
      .values({ keyHash, hits: 1, resetAt: windowEnd })
      .onDuplicateKeyUpdate({
        set: {
          hits: sql`IF(${rateLimitHits.resetAt} <= UTC_TIMESTAMP(3), 1, ${rateLimitHits.hits} + 1)`,
          resetAt: sql`IF(${rateLimitHits.resetAt} <= UTC_TIMESTAMP(3), ${windowEnd}, ${rateLimitHits.resetAt})`,
        },
      });
    if (++this.increments % SWEEP_EVERY === 0) {
      await this.db.delete(rateLimitHits).where(lt(rateLimitHits.resetAt, sql`UTC_TIMESTAMP(3) - INTERVAL 1 DAY`));
    }
    const [row] = await this.db
      .select({ hits: rateLimitHits.hits, resetAt: rateLimitHits.resetAt })
      .from(rateLimitHits)
      .where(eq(rateLimitHits.keyHash, keyHash));
    return { totalHits: row?.hits ?? 1, resetTime: row?.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .update(rateLimitHits)
      .set({ hits: sql`GREATEST(${rateLimitHits.hits}, 1) - 1` })
      .where(eq(rateLimitHits.keyHash, this.hash(key)));
  }

  async resetKey(key: string): Promise<void> {
    await this.db.delete(rateLimitHits).where(eq(rateLimitHits.keyHash, this.hash(key)));
  }
}
