// Limits that slow down password guessing without letting anyone lock a real user out. Failures are
// counted per account and address together (so failures from one address never hold back the owner
// signing in from another) and per address alone (one address trying many accounts). After the free
// failures each further one holds that key back for twice as long as the last, up to a ceiling. The
// counters live in MariaDB, so every instance sees the same ones.
import { createHash } from 'node:crypto';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/errors';
import * as repo from './sign-in-limits.repository';

/** A failure this long after the previous one starts the count again. */
const QUIET_WINDOW_MS = 60 * 60 * 1000;

interface LimitKey {
  hash: string;
  free: number;
}

const hashKey = (...parts: string[]) => createHash('sha256').update(parts.join('\0')).digest('hex');

function keysFor(ctx: AppContext, email: string, address: string): { pair: LimitKey; address: LimitKey } {
  return {
    pair: { hash: hashKey('pair', email.trim().toLowerCase(), address), free: ctx.env.LOGIN_LIMIT_PER_ACCOUNT },
    address: { hash: hashKey('address', address), free: ctx.env.LOGIN_LIMIT_PER_IP },
  };
}

/** The hold after `failures` failures with `free` of them allowed: 0, then base, 2 × base… up to max. */
export function holdSeconds(failures: number, free: number, baseS: number, maxS: number): number {
  if (failures < free) return 0;
  return Math.min(maxS, baseS * 2 ** Math.min(failures - free, 30));
}

function inWords(seconds: number): string {
  if (seconds < 90) return `${seconds} second${seconds === 1 ? '' : 's'}`;
  const minutes = Math.ceil(seconds / 60);
  return `${minutes} minutes`;
}

export class TooManyAttemptsError extends AppError {
  constructor(readonly retryAfterSeconds: number) {
    super(
      429,
      'too_many_attempts',
      `Too many sign-in attempts for this account from here. Try again in ${inWords(retryAfterSeconds)}.`,
      { retryAfterSeconds },
    );
  }
}

/** Throws TooManyAttemptsError while this account-and-address, or this address, is held back. */
export async function checkSignInAllowed(ctx: AppContext, email: string, address: string): Promise<void> {
  const keys = keysFor(ctx, email, address);
  const now = new Date();
  const until = await repo.latestHold(ctx.database.db, [keys.pair.hash, keys.address.hash], now);
  if (until) throw new TooManyAttemptsError(Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 1000)));
}

export async function recordSignInFailure(ctx: AppContext, email: string, address: string): Promise<void> {
  const db = ctx.database.db;
  const now = new Date();
  const windowStart = new Date(now.getTime() - QUIET_WINDOW_MS);
  for (const key of Object.values(keysFor(ctx, email, address))) {
    const failures = await repo.countFailure(db, key.hash, now, windowStart);
    const hold = holdSeconds(failures, key.free, ctx.env.LOGIN_DELAY_BASE_S, ctx.env.LOGIN_DELAY_MAX_S);
    if (hold > 0) await repo.holdUntil(db, key.hash, new Date(now.getTime() + hold * 1000));
  }
  // Now and then, forget keys that have been quiet for a day.
  if (Math.random() < 0.01) await repo.deleteQuietSince(db, new Date(now.getTime() - 24 * QUIET_WINDOW_MS));
}

/** A correct password clears that account-and-address count (not the address's own count). */
export async function recordSignInSuccess(ctx: AppContext, email: string, address: string): Promise<void> {
  await repo.clearKey(ctx.database.db, keysFor(ctx, email, address).pair.hash);
}
