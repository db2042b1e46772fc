// /api/bodyweights: one reading per day (PUT to a date writes or replaces it), and the list.
import { Router } from 'express';
import { toKg } from '../../../shared/calc';
import { bodyweightDateParams, bodyweightListQuery, logBodyweightBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, ATHLETE, authOf, requireRole } from '../../middleware/auth';
import { idempotent } from '../../middleware/idempotency';
import { ValidationError } from '../../lib/errors';
import { validate } from '../../middleware/validate';
import { athleteInScope, ownAthleteId } from '../../lib/scope';
import { listBodyweights, upsertBodyweight } from './bodyweights.repository';

/** A reading may be dated up to a day ahead of the server's clock (time zones), never further. */
function checkDate(measuredOn: string, now = new Date()) {
  if (Date.parse(`${measuredOn}T00:00:00Z`) > now.getTime() + 86_400_000) {
    throw new ValidationError('Some fields need attention.', { 'params.measuredOn': ['That day has not come yet'] });
  }
}

export function bodyweightsRouter(ctx: AppContext): Router {
  const router = Router();

  router.put(
    '/bodyweights/:measuredOn',
    requireRole(ATHLETE),
    idempotent(ctx),
    validate({ params: bodyweightDateParams, body: logBodyweightBody }, async ({ params, body }, req, res) => {
      checkDate(params.measuredOn);
      const { bodyweight, created } = await upsertBodyweight(ctx.database.db, {
        teamId: authOf(req).teamId,
        athleteId: ownAthleteId(req),
        measuredOn: params.measuredOn,
        weightKg: Math.round(toKg(body.weight, body.unit) * 100) / 100,
      });
      res.status(created ? 201 : 200);
      return bodyweight;
    }),
  );

  router.get(
    '/bodyweights',
    requireRole(ANY_ROLE),
    validate({ query: bodyweightListQuery }, async ({ query }, req) => {
      const athleteId = await athleteInScope(ctx.database.db, req, query.athleteId);
      return listBodyweights(ctx.database.db, authOf(req).teamId, athleteId, query);
    }),
  );

  return router;
}
