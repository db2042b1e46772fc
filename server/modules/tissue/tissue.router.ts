// /api/tissue/checkins: the athlete's next-day check-in on a week's connective-tissue work.
import { Router } from 'express';
import { tissueCheckinBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ATHLETE, authOf, requireRole } from '../../middleware/auth';
import { idempotent } from '../../middleware/idempotency';
import { validate } from '../../middleware/validate';
import { ownAthleteId } from '../../lib/scope';
import { recordCheckin } from './tissue.service';

export function tissueRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/tissue/checkins',
    requireRole(ATHLETE),
    idempotent(ctx),
    validate({ body: tissueCheckinBody }, async ({ body }, req, res) => {
      const saved = await recordCheckin(ctx, authOf(req).teamId, ownAthleteId(req), body);
      res.status(201);
      return saved;
    }),
  );

  return router;
}
