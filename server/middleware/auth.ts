// Session check, role check and team scope. Every protected route gets `req.auth`; repositories take
// its teamId so no query can reach another team's rows.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/schemas';
import type { AppContext } from '../context';
import { ForbiddenError, UnauthorizedError } from '../lib/errors';
import { SESSION_COOKIE, clearSessionCookie, needsRefresh, setSessionCookie } from '../lib/session';
import { findSessionUser } from '../modules/auth/auth.repository';

export interface AuthContext {
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

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext;
  }
}

export const STAFF: readonly Role[] = ['head_coach', 'coach'];
export const HEAD_COACH: readonly Role[] = ['head_coach'];
export const ATHLETE: readonly Role[] = ['athlete'];
export const ANY_ROLE: readonly Role[] = ['head_coach', 'coach', 'athlete'];

/** Attaches `req.auth` when a valid session cookie is present; never rejects by itself. */
export function loadSession(ctx: AppContext): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token !== 'string' || token === '') return next();
    const claims = await ctx.sessions.verify(token);
    if (!claims) {
      clearSessionCookie(req, res);
      return next();
    }
    const user = await findSessionUser(ctx.database.db, claims.userId, claims.teamId);
    // A password change ends every session issued before it.
    if (!user || (user.passwordChangedAt && user.passwordChangedAt.getTime() > claims.issuedAt * 1000 + 999)) {
      clearSessionCookie(req, res);
      return next();
    }
    req.auth = {
      userId: user.id,
      teamId: user.teamId,
      role: user.role,
      email: user.email,
      name: user.name,
      teamName: user.teamName,
      unit: user.unit,
      athleteId: user.athleteId ?? null,
    };
    if (needsRefresh(claims)) setSessionCookie(req, res, await ctx.sessions.sign(user.id, user.teamId));
    next();
  };
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
