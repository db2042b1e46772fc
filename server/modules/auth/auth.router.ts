// /api/auth: sign in, sign out (here or everywhere), who am I, and the account's signed-in sessions.
import { Router, type Request } from 'express';
import {
  idParams,
  loginBody,
  type Me,
  type SessionList,
  type SignOutEverywhereResponse,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { SESSION_COOKIE, clearSessionCookie, setSessionCookie } from '../../lib/session';
import { meOf, signIn } from './auth.service';
import { endOwnSession, endSession, endUserSessions, listOwnSessions } from './sessions.service';
import { TooManyAttemptsError } from './sign-in-limits';

const cookieOf = (req: Request): string | null => {
  const token: unknown = req.cookies?.[SESSION_COOKIE];
  return typeof token === 'string' && token !== '' ? token : null;
};

export function authRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/auth/login',
    validate({ body: loginBody }, async ({ body }, req, res) => {
      try {
        const session = await signIn(ctx, body.email, body.password, {
          address: req.ip ?? req.socket.remoteAddress ?? 'unknown',
          userAgent: req.get('user-agent'),
        });
        setSessionCookie(req, res, session.token);
        return { ok: true };
      } catch (err) {
        if (err instanceof TooManyAttemptsError) res.setHeader('Retry-After', String(err.retryAfterSeconds));
        throw err;
      }
    }),
  );

  router.post(
    '/auth/logout',
    validate({}, async (_input, req, res) => {
      const token = cookieOf(req);
      if (token) await endSession(ctx, token);
      clearSessionCookie(req, res);
      return { ok: true };
    }),
  );

  router.post(
    '/auth/logout-everywhere',
    requireRole(ANY_ROLE),
    validate({}, async (_input, req, res): Promise<SignOutEverywhereResponse> => {
      const ended = await endUserSessions(ctx, authOf(req).userId);
      clearSessionCookie(req, res);
      return { ok: true, ended };
    }),
  );

  router.get(
    '/auth/sessions',
    requireRole(ANY_ROLE),
    validate({}, (_input, req): Promise<SessionList> => listOwnSessions(ctx, authOf(req))),
  );

  router.delete(
    '/auth/sessions/:id',
    requireRole(ANY_ROLE),
    validate({ params: idParams }, async ({ params }, req) => {
      await endOwnSession(ctx, authOf(req).userId, params.id);
      return { ok: true };
    }),
  );

  router.get(
    '/auth/me',
    requireRole(ANY_ROLE),
    validate({}, (_input, req): Me => meOf(authOf(req))),
  );

  return router;
}
