// Starting, resolving and ending sessions. The row decides: a session is valid while its row exists, has
// not expired, its membership still exists with the role it was granted, and the password has not changed
// since it began. Every way of ending sessions deletes rows at once and drops them from this instance's cache.
import Bowser from 'bowser';
import type { Role, SessionList } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { NotFoundError } from '../../lib/errors';
import { SESSION_MAX_S, SESSION_TTL_S, TOUCH_AFTER_MS, type SessionRecord } from '../../lib/session';
import * as repo from './sessions.repository';

const plus = (d: Date, seconds: number) => new Date(d.getTime() + seconds * 1000);

/** The next end of a session used now: the idle life ahead, never past the absolute cap. */
function nextExpiry(createdAt: Date, now: Date): Date {
  return new Date(Math.min(plus(now, SESSION_TTL_S).getTime(), plus(createdAt, SESSION_MAX_S).getTime()));
}

/** A new session row; returns the cookie value. Runs inside the caller's transaction when given one. */
export async function startSession(
  ctx: AppContext,
  who: { userId: number; teamId: number; role: Role },
  userAgent: string | undefined,
  db: Queryable = ctx.database.db,
): Promise<string> {
  const now = new Date();
  const { token, hash } = ctx.sessions.newId();
  await repo.deleteExpiredSessions(db, who.userId, now);
  await repo.insertSession(db, {
    idHash: hash,
    ...who,
    userAgent: userAgent ? userAgent.slice(0, 255) : null,
    now,
    expiresAt: nextExpiry(now, now),
  });
  return token;
}

/**
 * The caller behind a cookie, or null. `renewCookie` is set when this request moved the session's end
 * ahead, so the browser's cookie should move with it.
 */
export async function resolveSession(
  ctx: AppContext,
  token: string,
): Promise<{ record: SessionRecord; renewCookie: boolean } | null> {
  const hash = ctx.sessions.hash(token);
  const nowMs = Date.now();
  let record = ctx.sessions.cached(hash, nowMs);
  if (!record) {
    record = await loadRecord(ctx, hash, new Date(nowMs));
    if (!record) return null;
    ctx.sessions.remember(hash, record, ctx.env.SESSION_CACHE_MS, nowMs);
  }
  if (nowMs - record.lastSeenAt.getTime() < TOUCH_AFTER_MS) return { record, renewCookie: false };
  // Written at most once a minute per session and instance; the cached record moves first so
  // concurrent requests do not all write.
  const now = new Date(nowMs);
  record.lastSeenAt = now;
  record.expiresAt = nextExpiry(record.createdAt, now);
  await repo.touchSession(ctx.database.db, record.auth.sessionId, now, record.expiresAt);
  return { record, renewCookie: true };
}

async function loadRecord(ctx: AppContext, hash: string, now: Date): Promise<SessionRecord | null> {
  const db = ctx.database.db;
  const row = await repo.findSessionByHash(db, hash);
  if (!row) return null;
  const ended =
    row.expiresAt.getTime() <= now.getTime() ||
    row.memberRole === null ||
    row.memberRole !== row.role ||
    (row.passwordChangedAt !== null && row.passwordChangedAt.getTime() > row.createdAt.getTime());
  if (ended) {
    await repo.deleteSessionById(db, row.id);
    return null;
  }
  return {
    auth: {
      sessionId: row.id,
      userId: row.userId,
      teamId: row.teamId,
      role: row.role,
      email: row.email,
      name: row.name,
      teamName: row.teamName,
      unit: row.unit,
      athleteId: row.athleteId ?? null,
    },
    createdAt: row.createdAt,
    lastSeenAt: row.lastSeenAt,
    expiresAt: row.expiresAt,
  };
}

/** Sign-out: this session only. */
export async function endSession(ctx: AppContext, token: string): Promise<void> {
  const hash = ctx.sessions.hash(token);
  ctx.sessions.forget(hash);
  await repo.deleteSessionByHash(ctx.database.db, hash);
}

/** One of the caller's own sessions, from the list. */
export async function endOwnSession(ctx: AppContext, userId: number, sessionId: number): Promise<void> {
  if (!(await repo.deleteOwnSession(ctx.database.db, userId, sessionId))) throw new NotFoundError('That session');
  ctx.sessions.forgetWhere((a) => a.sessionId === sessionId);
}

/**
 * Every session of an account (sign out everywhere, a new password), or only its sessions in one team (a
 * changed role, a removed membership). Pass the open transaction when the change itself is in one.
 */
export async function endUserSessions(
  ctx: AppContext,
  userId: number,
  opts: { teamId?: number; db?: Queryable } = {},
): Promise<number> {
  const ended = await repo.deleteUserSessions(opts.db ?? ctx.database.db, userId, opts.teamId);
  ctx.sessions.forgetWhere((a) => a.userId === userId && (opts.teamId === undefined || a.teamId === opts.teamId));
  return ended;
}

/** "Firefox on Linux", "Safari on iPhone": enough to recognise one's own devices. */
export function deviceLabel(userAgent: string | null): string {
  if (!userAgent) return 'Unknown device';
  const p = Bowser.parse(userAgent);
  const browser = p.browser.name;
  const where = p.platform.model ?? p.os.name;
  if (browser && where) return `${browser} on ${where}`;
  return browser ?? where ?? 'Unknown device';
}

export async function listOwnSessions(
  ctx: AppContext,
  auth: { userId: number; sessionId: number },
): Promise<SessionList> {
  const rows = await repo.listUserSessions(ctx.database.db, auth.userId, new Date());
  return {
    items: rows.map((r) => ({
      id: r.id,
      device: deviceLabel(r.userAgent),
      createdAt: r.createdAt.toISOString(),
      lastSeenAt: r.lastSeenAt.toISOString(),
      current: r.id === auth.sessionId,
    })),
    total: rows.length,
  };
}
