// /api/plans: the plan entries of the board — list, save, clear, batch, history and generation.
import { Router } from 'express';
import {
  clearPlanQuery,
  generateBody,
  planBatchBody,
  planCellParams,
  planHistoryQuery,
  planListQuery,
  savePlanBody,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { generate } from './generate.service';
import { batchField, clearCell, listPlans, planHistory, saveChanges } from './plans.service';
import { alternativesFor } from './review.service';

export function plansRouter(ctx: AppContext): Router {
  const router = Router();
  const db = ctx.database.db;

  router.get(
    '/plans',
    requireRole(STAFF),
    validate({ query: planListQuery }, ({ query }, req) => listPlans(db, authOf(req).teamId, query)),
  );

  router.post(
    '/plans/generate',
    requireRole(STAFF),
    validate({ body: generateBody }, ({ body }, req) => generate(db, authOf(req), body)),
  );

  router.post(
    '/plans/batch',
    requireRole(STAFF),
    validate({ body: planBatchBody }, async ({ body }, req) => {
      const { entries, affected } = await saveChanges(db, authOf(req), body.changes, batchField);
      return { items: entries, total: entries.length, affected };
    }),
  );

  router.put(
    '/plans/:athleteId/:week/:slotId',
    requireRole(STAFF),
    validate({ params: planCellParams, body: savePlanBody }, async ({ params, body }, req, res) => {
      const { entries, created, affected } = await saveChanges(db, authOf(req), [{ ...params, ...body }]);
      if (created) res.status(201);
      return { ...entries[0], affected };
    }),
  );

  router.delete(
    '/plans/:athleteId/:week/:slotId',
    requireRole(STAFF),
    validate({ params: planCellParams, query: clearPlanQuery }, ({ params, query }, req) =>
      clearCell(db, authOf(req), params, query.version),
    ),
  );

  router.get(
    '/plans/:athleteId/:week/:slotId/history',
    requireRole(STAFF),
    validate({ params: planCellParams, query: planHistoryQuery }, ({ params, query }, req) =>
      planHistory(db, authOf(req).teamId, params, query.limit, query.offset),
    ),
  );

  router.get(
    '/plans/:athleteId/:week/:slotId/alternatives',
    requireRole(STAFF),
    validate({ params: planCellParams }, ({ params }, req) => alternativesFor(db, authOf(req).teamId, params)),
  );

  return router;
}
