// Session check, role check and team scope. Every protected route gets `req.auth`; repositories take
// its teamId so no query can reach another team's rows.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/schemas';
import type { AppContext } from '../context';
import { ForbiddenError, UnauthorizedError } from '../lib/errors';
import { SESSION_COOKIE, clearSessionCookie, setSessionCookie, type SessionAuth } from '../lib/session';
import { resolveSession } from '../modules/auth/sessions.service';

/** The caller of a protected route. */
export type AuthContext = SessionAuth;

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext;
  }
}

export const STAFF: readonly Role[] = ['head_coach', 'coach'];
export const HEAD_COACH: readonly Role[] = ['head_coach'];
export const ATHLETE: readonly Role[] = ['athlete'];
export const ANY_ROLE: readonly Role[] = ['head_coach', 'coach', 'athlete'];

/** Sets `req.auth` when the session cookie names a live session (for the API and the app's page alike). */
export async function attachSession(ctx: AppContext, req: Request, res: Response): Promise<void> {
  const token: unknown = req.cookies?.[SESSION_COOKIE];
  if (typeof token !== 'string' || token === '') return;
  const found = await resolveSession(ctx, token);
  if (!found) {
    clearSessionCookie(req, res);
    return;
  }
  req.auth = found.record.auth;
  // The session's end moved ahead: so does the cookie's.
  if (found.renewCookie) setSessionCookie(req, res, token);
}

/** Attaches `req.auth` when the session cookie names a live session; never rejects by itself. */
export function loadSession(ctx: AppContext): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => attachSession(ctx, req, res).then(() => next(), next);
}

export function requireRole(roles: readonly Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.auth) return next(new UnauthorizedError());
    if (!roles.includes(req.auth.role)) return next(new ForbiddenError());
    next();
  };
}

/** The caller, for handlers behind requireRole. */
export function authOf(req: Request): AuthContext {
  if (!req.auth) throw new UnauthorizedError();
  return req.auth;
}
