// /api/athletes: the roster, each athlete's restrictions, and their history of picks and results.
import { Router } from 'express';
import {
  athleteBody,
  athleteHistoryQuery,
  athleteListQuery,
  athleteParams,
  athletePatchBody,
  restrictionBody,
  restrictionParams,
  restrictionPatchBody,
  restWeekParams,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import * as service from './athletes.service';

export function athletesRouter(ctx: AppContext): Router {
  const router = Router();
  const staff = requireRole(STAFF);

  router.get(
    '/athletes',
    staff,
    validate({ query: athleteListQuery }, ({ query }, req) => service.listAthletes(ctx, authOf(req).teamId, query)),
  );

  // Before `/athletes/:id`: the team's athlete accounts a roster entry can be linked to.
  router.get(
    '/athletes/accounts',
    staff,
    validate({}, (_input, req) => service.listAccounts(ctx, authOf(req).teamId)),
  );

  router.post(
    '/athletes',
    staff,
    validate({ body: athleteBody }, async ({ body }, req, res) => {
      res.status(201).json(await service.createAthlete(ctx, authOf(req), body));
    }),
  );

  router.get(
    '/athletes/:id',
    staff,
    validate({ params: athleteParams }, ({ params }, req) => service.getAthlete(ctx, authOf(req).teamId, params.id)),
  );

  router.patch(
    '/athletes/:id',
    staff,
    validate({ params: athleteParams, body: athletePatchBody }, ({ params, body }, req) =>
      service.patchAthlete(ctx, authOf(req).teamId, params.id, body),
    ),
  );

  router.delete(
    '/athletes/:id',
    staff,
    validate({ params: athleteParams }, ({ params }, req) =>
      service.archiveAthlete(ctx, authOf(req).teamId, params.id),
    ),
  );

  router.get(
    '/athletes/:id/history',
    staff,
    validate({ params: athleteParams, query: athleteHistoryQuery }, ({ params, query }, req) =>
      service.athleteHistory(ctx, authOf(req).teamId, params.id, query),
    ),
  );

  router.post(
    '/athletes/:id/restrictions',
    staff,
    validate({ params: athleteParams, body: restrictionBody }, async ({ params, body }, req, res) => {
      res.status(201).json(await service.addRestriction(ctx, authOf(req), params.id, body));
    }),
  );

  router.patch(
    '/athletes/:id/restrictions/:restrictionId',
    staff,
    validate({ params: restrictionParams, body: restrictionPatchBody }, ({ params, body }, req) =>
      service.patchRestriction(ctx, authOf(req).teamId, params.id, params.restrictionId, body),
    ),
  );

  router.delete(
    '/athletes/:id/restrictions/:restrictionId',
    staff,
    validate({ params: restrictionParams }, async ({ params }, req, res) => {
      await service.removeRestriction(ctx, authOf(req).teamId, params.id, params.restrictionId);
      res.status(204).end();
    }),
  );

  // A rest or deload week: the planner leaves the athlete's max-effort slots of that week empty.
  router.put(
    '/athletes/:athleteId/rest-weeks/:week',
    staff,
    validate({ params: restWeekParams }, async ({ params }, req, res) => {
      const { created, item } = await service.markRestWeek(ctx, authOf(req), params.athleteId, params.week);
      res.status(created ? 201 : 200).json(item);
    }),
  );

  router.delete(
    '/athletes/:athleteId/rest-weeks/:week',
    staff,
    validate({ params: restWeekParams }, async ({ params }, req, res) => {
      await service.unmarkRestWeek(ctx, authOf(req).teamId, params.athleteId, params.week);
      res.status(204).end();
    }),
  );

  return router;
}
