// /api/weeks/:week/publish and /api/weeks/:week/publication: coaches send a week to their athletes.
import { Router } from 'express';
import { publishBody, publishWeekParams } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { getPublication, publishCheck, publishWeek } from './publishing.service';

export function publishingRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/weeks/:week/publication',
    requireRole(STAFF),
    validate({ params: publishWeekParams }, ({ params }, req) => getPublication(ctx, authOf(req).teamId, params.week)),
  );

  router.post(
    '/weeks/:week/publish',
    requireRole(STAFF),
    validate({ params: publishWeekParams, body: publishBody }, async ({ params, body }, req, res) => {
      if (body.dryRun) return publishCheck(ctx, authOf(req).teamId, params.week);
      const { created, result } = await publishWeek(ctx, authOf(req), params.week);
      res.status(created ? 201 : 200);
      return result;
    }),
  );

  return router;
}
