// Stateless sessions: a jose-signed JWT in an httpOnly cookie, so any app instance can serve any request.
import { SignJWT, jwtVerify } from 'jose';
import type { Request, Response } from 'express';

export const SESSION_COOKIE = 'rackturn_session';
export const SESSION_TTL_S = 12 * 60 * 60;
/** Tokens older than this are re-issued on use, so an active session does not expire mid-workout. */
const REFRESH_AFTER_S = 10 * 60;

export interface SessionClaims {
  userId: number;
  teamId: number;
  issuedAt: number;
}

export class SessionKeys {
  private readonly key: Uint8Array;
  constructor(secret: string) {
    this.key = new TextEncoder().encode(secret);
  }

  async sign(userId: number, teamId: number): Promise<string> {
    return new SignJWT({ tid: teamId })
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject(String(userId))
      .setIssuedAt()
      .setExpirationTime(`${SESSION_TTL_S}s`)
      .sign(this.key);
  }

  async verify(token: string): Promise<SessionClaims | null> {
    try {
      const { payload } = await jwtVerify(token, this.key, { algorithms: ['HS256'] });
      const userId = Number(payload.sub);
      const teamId = Number(payload.tid);
      if (!Number.isSafeInteger(userId) || !Number.isSafeInteger(teamId) || !payload.iat) return null;
      return { userId, teamId, issuedAt: payload.iat };
    } catch {
      return null;
    }
  }
}

export function needsRefresh(claims: SessionClaims, nowS = Math.floor(Date.now() / 1000)): boolean {
  return nowS - claims.issuedAt > REFRESH_AFTER_S;
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
