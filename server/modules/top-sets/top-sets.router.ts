// /api/top-sets: an athlete logs a top set against this week's pick; history lists per athlete.
import { Router } from 'express';
import { logTopSetBody, topSetListQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, ATHLETE, authOf, requireRole } from '../../middleware/auth';
import { idempotent } from '../../middleware/idempotency';
import { validate } from '../../middleware/validate';
import { athleteInScope, ownAthleteId } from '../../lib/scope';
import { listTopSets } from './top-sets.repository';
import { logTopSet } from './top-sets.service';

export function topSetsRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/top-sets',
    requireRole(ATHLETE),
    idempotent(ctx),
    validate({ body: logTopSetBody }, async ({ body }, req, res) => {
      const auth = authOf(req);
      const logged = await logTopSet(
        ctx,
        { teamId: auth.teamId, athleteId: ownAthleteId(req), userId: auth.userId },
        body,
      );
      res.status(201);
      return logged;
    }),
  );

  router.get(
    '/top-sets',
    requireRole(ANY_ROLE),
    validate({ query: topSetListQuery }, async ({ query }, req) => {
      const athleteId = await athleteInScope(ctx.database.db, req, query.athleteId);
      return listTopSets(ctx.database.db, authOf(req).teamId, athleteId, query);
    }),
  );

  return router;
}
