// /api/athletes/:athleteId/weeks/:week (coaches: the whole week of one athlete, and the accessories the
// rotation suggests for it) and
// /api/my-week/sessions/:sessionId (the athlete logs a session).
import { Router } from 'express';
import { athleteWeekBody, athleteWeekParams, sessionLogBody, sessionLogParams } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ATHLETE, STAFF, authOf, requireRole } from '../../middleware/auth';
import { idempotent } from '../../middleware/idempotency';
import { validate } from '../../middleware/validate';
import { ownAthleteId } from '../../lib/scope';
import { suggestAccessories } from './accessory-rotation.service';
import * as service from './week.service';

export function weekRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/athletes/:athleteId/weeks/:week',
    requireRole(STAFF),
    validate({ params: athleteWeekParams }, ({ params }, req) =>
      service.getAthleteWeek(ctx, authOf(req).teamId, params.athleteId, params.week),
    ),
  );

  router.get(
    '/athletes/:athleteId/weeks/:week/accessories',
    requireRole(STAFF),
    validate({ params: athleteWeekParams }, ({ params }, req) =>
      suggestAccessories(ctx, authOf(req).teamId, params.athleteId, params.week),
    ),
  );

  router.put(
    '/athletes/:athleteId/weeks/:week',
    requireRole(STAFF),
    validate({ params: athleteWeekParams, body: athleteWeekBody }, ({ params, body }, req) =>
      service.putAthleteWeek(ctx, authOf(req), params.athleteId, params.week, body),
    ),
  );

  router.put(
    '/my-week/sessions/:sessionId',
    requireRole(ATHLETE),
    idempotent(ctx),
    validate({ params: sessionLogParams, body: sessionLogBody }, ({ params, body }, req) =>
      service.logSession(ctx, { teamId: authOf(req).teamId, athleteId: ownAthleteId(req) }, params.sessionId, body),
    ),
  );

  return router;
}
