// /api/my-fee: an athlete's own fee (status, checkout, cancel); /api/fees/athletes/:athleteId/…: the
// head coach doing the same on an athlete's behalf.
import { Router } from 'express';
import { athleteIdParams, checkoutBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ATHLETE, HEAD_COACH, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { ownAthleteId } from '../../lib/scope';
import { athleteFee, cancelFee, startCheckout } from './payments.service';

export function paymentsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/my-fee',
    requireRole(ATHLETE),
    validate({}, (_input, req) => {
      const a = authOf(req);
      return athleteFee(ctx, a.teamId, ownAthleteId(req));
    }),
  );

  router.post(
    '/my-fee/checkout',
    requireRole(ATHLETE),
    validate({ body: checkoutBody }, ({ body }, req) => {
      const a = authOf(req);
      return startCheckout(ctx, a.teamId, ownAthleteId(req), body.planId, 'athlete');
    }),
  );

  router.post(
    '/my-fee/cancel',
    requireRole(ATHLETE),
    validate({}, (_input, req) => {
      const a = authOf(req);
      return cancelFee(ctx, a.teamId, ownAthleteId(req));
    }),
  );

  router.post(
    '/fees/athletes/:athleteId/checkout',
    requireRole(HEAD_COACH),
    validate({ params: athleteIdParams, body: checkoutBody }, ({ params, body }, req) =>
      startCheckout(ctx, authOf(req).teamId, params.athleteId, body.planId, 'coach'),
    ),
  );

  router.post(
    '/fees/athletes/:athleteId/cancel',
    requireRole(HEAD_COACH),
    validate({ params: athleteIdParams }, ({ params }, req) => cancelFee(ctx, authOf(req).teamId, params.athleteId)),
  );

  return router;
}
