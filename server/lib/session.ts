// Server-side sessions: the browser holds an opaque random id in an httpOnly cookie and MariaDB holds the
// session row under the id's keyed hash, so ending a session anywhere ends it everywhere. Look-ups are
// kept for a few seconds per instance (SESSION_CACHE_MS) so a request costs a hash and a map read; another
// instance sees a revocation within that time, this one at once.
import { createHmac, randomBytes } from 'node:crypto';
import type { Request, Response } from 'express';
import type { Role } from '../../shared/schemas';

export const SESSION_COOKIE = 'rackturn_session';
/** A session unused this long ends; each use moves its end this far ahead again. */
export const SESSION_TTL_S = 12 * 60 * 60;
/** However active, a session ends this long after sign-in. */
export const SESSION_MAX_S = 30 * 24 * 60 * 60;
/** How stale "last seen" may get before a request writes it (and renews the cookie). */
export const TOUCH_AFTER_MS = 60_000;
/** Cached sessions held per instance at most; the oldest go first. */
const CACHE_MAX = 10_000;

/** Who is calling, for every protected route. */
export interface SessionAuth {
  sessionId: number;
  userId: number;
  teamId: number;
  role: Role;
  email: string;
  name: string;
  teamName: string;
  unit: 'kg' | 'lb';
  /** The roster entry linked to this account, for athletes. */
  athleteId: number | null;
}

export interface SessionRecord {
  auth: SessionAuth;
  createdAt: Date;
  lastSeenAt: Date;
  expiresAt: Date;
}

interface CacheEntry {
  record: SessionRecord;
  until: number;
}

/** The session secret (keying the stored hashes) and this instance's short look-up cache. */
export class SessionKeys {
  private readonly key: Buffer;
  private readonly cache = new Map<string, CacheEntry>();

  constructor(secret: string) {
    this.key = Buffer.from(secret, 'utf8');
  }

  /** A fresh session id (256 random bits) for the cookie, and the hash the database keeps. */
  newId(): { token: string; hash: string } {
    const token = randomBytes(32).toString('base64url');
    return { token, hash: this.hash(token) };
  }

  hash(token: string): string {
    return createHmac('sha256', this.key).update(token).digest('hex');
  }

  cached(hash: string, now = Date.now()): SessionRecord | null {
    const entry = this.cache.get(hash);
    if (!entry) return null;
    if (entry.until <= now || entry.record.expiresAt.getTime() <= now) {
      this.cache.delete(hash);
      return null;
    }
    return entry.record;
  }

  remember(hash: string, record: SessionRecord, ttlMs: number, now = Date.now()): void {
    if (ttlMs <= 0) return;
    this.cache.delete(hash);
    this.cache.set(hash, { record, until: now + ttlMs });
    if (this.cache.size > CACHE_MAX) this.cache.delete(this.cache.keys().next().value!);
  }

  forget(hash: string): void {
    this.cache.delete(hash);
  }

  /** Drops cached sessions that match, after a change that ends them. */
  forgetWhere(match: (auth: SessionAuth) => boolean): void {
    for (const [hash, entry] of this.cache) if (match(entry.record.auth)) this.cache.delete(hash);
  }
}

export function setSessionCookie(req: Request, res: Response, token: string): void {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: req.secure,
    path: '/',
    maxAge: SESSION_TTL_S * 1000,
  });
}

export function clearSessionCookie(req: Request, res: Response): void {
  res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', secure: req.secure, path: '/' });
}
