// /api/fees: the team's fee plans (head coach edits; everyone signed in reads the offered ones) and
// the head coach's table of every athlete's payment status.
import { Router } from 'express';
import {
  feeAthleteListQuery,
  feePlanBody,
  feePlanListQuery,
  feePlanUpdateBody,
  idParams,
  planVersionBody,
  planVersionQuery,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, HEAD_COACH, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import * as fees from './fees.service';

export function feesRouter(ctx: AppContext): Router {
  const router = Router();
  const db = ctx.database.db;

  router.get(
    '/fees/plans',
    requireRole(ANY_ROLE),
    validate({ query: feePlanListQuery }, ({ query }, req) => {
      const a = authOf(req);
      // Athletes choose among the plans on offer; archived ones are the head coach's business.
      return fees.listPlans(db, a.teamId, a.role === 'head_coach' ? query : { ...query, status: 'active' });
    }),
  );

  router.post(
    '/fees/plans',
    requireRole(HEAD_COACH),
    validate({ body: feePlanBody }, async ({ body }, req, res) => {
      const plan = await fees.createPlan(db, authOf(req).teamId, body);
      res.status(201).json(plan);
    }),
  );

  router.patch(
    '/fees/plans/:id',
    requireRole(HEAD_COACH),
    validate({ params: idParams, body: feePlanUpdateBody }, ({ params, body }, req) =>
      fees.updatePlan(db, authOf(req).teamId, params.id, body),
    ),
  );

  router.post(
    '/fees/plans/:id/archive',
    requireRole(HEAD_COACH),
    validate({ params: idParams, body: planVersionBody }, ({ params, body }, req) =>
      fees.setArchived(db, authOf(req).teamId, params.id, body.version, true),
    ),
  );

  router.post(
    '/fees/plans/:id/restore',
    requireRole(HEAD_COACH),
    validate({ params: idParams, body: planVersionBody }, ({ params, body }, req) =>
      fees.setArchived(db, authOf(req).teamId, params.id, body.version, false),
    ),
  );

  router.delete(
    '/fees/plans/:id',
    requireRole(HEAD_COACH),
    validate({ params: idParams, query: planVersionQuery }, async ({ params, query }, req, res) => {
      await fees.deletePlan(db, authOf(req).teamId, params.id, query.version);
      res.status(204).end();
    }),
  );

  router.get(
    '/fees/athletes',
    requireRole(HEAD_COACH),
    validate({ query: feeAthleteListQuery }, ({ query }, req) => fees.listAthleteFees(db, authOf(req).teamId, query)),
  );

  return router;
}
