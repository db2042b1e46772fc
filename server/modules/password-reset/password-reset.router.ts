// /api/auth/password-reset: ask for a reset link, check a link, and set the new password with it.
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { forgotPasswordBody, resetPasswordBody, resetTokenQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { MariaDbRateLimitStore } from '../../db/rate-limit-store';
import { validate } from '../../middleware/validate';
import { AppError } from '../../lib/errors';
import { setSessionCookie } from '../../lib/session';
import { startSession } from '../auth/sessions.service';
import { RESET_REQUESTED, checkResetToken, completeReset, requestReset } from './password-reset.service';

/** Every request answers after at least this long, so its timing does not tell whether the address is known. */
export const RESET_ANSWER_FLOOR_MS = 300;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function resetLimiters(ctx: AppContext) {
  const common = {
    windowMs: 15 * 60 * 1000,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'too_many_attempts', 'Too many reset requests. Wait a few minutes and try again.');
    },
  };
  return [
    rateLimit({
      ...common,
      limit: ctx.env.RESET_LIMIT_PER_IP,
      store: new MariaDbRateLimitStore(ctx.database.db, 'reset-ip'),
    }),
    rateLimit({
      ...common,
      limit: ctx.env.RESET_LIMIT_PER_ADDRESS,
      store: new MariaDbRateLimitStore(ctx.database.db, 'reset-address'),
      // This limit guards an inbox: a body without a valid address (refused as 400 below) counts only
      // against the caller's address, not against one shared empty key every such request would fill.
      skip: (req) => !forgotPasswordBody.safeParse(req.body).success,
      keyGenerator: (req) =>
        `reset:${String(req.body?.email ?? '')
          .trim()
          .toLowerCase()}`,
    }),
  ];
}

export function passwordResetRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/auth/password-reset',
    ...resetLimiters(ctx),
    validate({ body: forgotPasswordBody }, async ({ body }) => {
      // The answer never waits on the address's own work (a known one stores a link and queues its mail,
      // an unknown one does nothing): both answer after the same fixed time however busy the database
      // is, so the time cannot tell them apart. The work goes on in the background; a failure is logged.
      requestReset(ctx, body.email).catch((err: unknown) =>
        ctx.logger.error({ err }, 'could not handle a password reset request'),
      );
      await sleep(RESET_ANSWER_FLOOR_MS);
      return { ok: true, message: RESET_REQUESTED };
    }),
  );

  router.get(
    '/auth/password-reset/check',
    validate({ query: resetTokenQuery }, ({ query }) => checkResetToken(ctx, query.token)),
  );

  router.post(
    '/auth/password-reset/complete',
    validate({ body: resetPasswordBody }, async ({ body }, req, res) => {
      const done = await completeReset(ctx, body.token, body.password);
      if (done.membership) {
        const who = { userId: done.userId, ...done.membership };
        setSessionCookie(req, res, await startSession(ctx, who, req.get('user-agent')));
      }
      return { ok: true, signedIn: Boolean(done.membership) };
    }),
  );

  return router;
}
