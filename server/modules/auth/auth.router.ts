// /api/auth: sign in, sign out, who am I.
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { loginBody, type Me } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { AppError } from '../../lib/errors';
import { clearSessionCookie, setSessionCookie } from '../../lib/session';
import { signIn } from './auth.service';

function loginLimiters(ctx: AppContext) {
  const tooMany = () => {
    throw new AppError(429, 'too_many_attempts', 'Too many sign-in attempts. Wait a few minutes and try again.');
  };
  const common = {
    windowMs: 15 * 60 * 1000,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: tooMany,
  };
  return [
    rateLimit({ ...common, limit: ctx.env.LOGIN_LIMIT_PER_IP }),
    rateLimit({
      ...common,
      limit: ctx.env.LOGIN_LIMIT_PER_ACCOUNT,
      // Per account: the typed address, normalised the way sign-in reads it.
      keyGenerator: (req) =>
        `account:${String(req.body?.email ?? '')
          .trim()
          .toLowerCase()}`,
    }),
  ];
}

export function authRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/auth/login',
    ...loginLimiters(ctx),
    validate({ body: loginBody }, async ({ body }, req, res) => {
      const session = await signIn(ctx, body.email, body.password);
      setSessionCookie(req, res, session.token);
      return { ok: true };
    }),
  );

  router.post(
    '/auth/logout',
    validate({}, (_input, req, res) => {
      clearSessionCookie(req, res);
      return { ok: true };
    }),
  );

  router.get(
    '/auth/me',
    requireRole(ANY_ROLE),
    validate({}, (_input, req): Me => {
      const a = authOf(req);
      return {
        id: a.userId,
        email: a.email,
        name: a.name,
        role: a.role,
        teamId: a.teamId,
        teamName: a.teamName,
        unit: a.unit,
        athleteId: a.athleteId,
      };
    }),
  );

  return router;
}
