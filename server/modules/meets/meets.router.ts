// /api/meets: meets, the athletes entered with weight class and division, and their attempt plans.
import { Router } from 'express';
import {
  meetBody,
  meetEntryBody,
  meetEntryParams,
  meetEntryPatchBody,
  meetListQuery,
  meetParams,
  meetPatchBody,
  jumpsBody,
  markBody,
  meetDayAttemptParams,
  meetDayEntryParams,
  meetDayParams,
  undoMarkQuery,
  weighInBody,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import * as service from './meets.service';
import * as day from './meet-day.service';

export function meetsRouter(ctx: AppContext): Router {
  const router = Router();
  const staff = requireRole(STAFF);

  router.get(
    '/meets',
    staff,
    validate({ query: meetListQuery }, ({ query }, req) => service.listMeets(ctx, authOf(req).teamId, query)),
  );

  router.post(
    '/meets',
    staff,
    validate({ body: meetBody }, async ({ body }, req, res) => {
      res.status(201).json(await service.createMeet(ctx, authOf(req).teamId, body));
    }),
  );

  router.get(
    '/meets/:id',
    staff,
    validate({ params: meetParams }, ({ params }, req) => service.getMeet(ctx, authOf(req).teamId, params.id)),
  );

  router.patch(
    '/meets/:id',
    staff,
    validate({ params: meetParams, body: meetPatchBody }, ({ params, body }, req) =>
      service.patchMeet(ctx, authOf(req).teamId, params.id, body),
    ),
  );

  router.delete(
    '/meets/:id',
    staff,
    validate({ params: meetParams }, async ({ params }, req, res) => {
      await service.removeMeet(ctx, authOf(req).teamId, params.id);
      res.status(204).end();
    }),
  );

  router.post(
    '/meets/:id/entries',
    staff,
    validate({ params: meetParams, body: meetEntryBody }, async ({ params, body }, req, res) => {
      res.status(201).json(await service.addEntry(ctx, authOf(req).teamId, params.id, body));
    }),
  );

  router.patch(
    '/meets/:id/entries/:entryId',
    staff,
    validate({ params: meetEntryParams, body: meetEntryPatchBody }, ({ params, body }, req) =>
      service.patchEntry(ctx, authOf(req).teamId, params.id, params.entryId, body),
    ),
  );

  router.delete(
    '/meets/:id/entries/:entryId',
    staff,
    validate({ params: meetEntryParams }, async ({ params }, req, res) => {
      await service.removeEntry(ctx, authOf(req).teamId, params.id, params.entryId);
      res.status(204).end();
    }),
  );

  // Meet day: the live state, marks (idempotent by key), weigh-in, usual jumps, results into history.
  router.get(
    '/meets/:id/day',
    staff,
    validate({ params: meetDayParams }, ({ params }, req) => day.getMeetDay(ctx, authOf(req).teamId, params.id)),
  );

  router.post(
    '/meets/:id/day/marks',
    staff,
    validate({ params: meetDayParams, body: markBody }, async ({ params, body }, req, res) => {
      const out = await day.mark(ctx, authOf(req), params.id, body);
      res.status(out.replay ? 200 : 201).json(out);
    }),
  );

  router.delete(
    '/meets/:id/day/marks/:attemptId',
    staff,
    validate({ params: meetDayAttemptParams, query: undoMarkQuery }, async ({ params, query }, req, res) => {
      await day.undoMark(ctx, authOf(req).teamId, params.id, params.attemptId, query.version);
      res.status(204).end();
    }),
  );

  router.put(
    '/meets/:id/day/entries/:entryId/weigh-in',
    staff,
    validate({ params: meetDayEntryParams, body: weighInBody }, ({ params, body }, req) =>
      day.weighIn(ctx, authOf(req).teamId, params.id, params.entryId, body),
    ),
  );

  router.put(
    '/meets/:id/day/entries/:entryId/jumps',
    staff,
    validate({ params: meetDayEntryParams, body: jumpsBody }, ({ params, body }, req) =>
      day.saveJumps(ctx, authOf(req).teamId, params.id, params.entryId, body),
    ),
  );

  router.post(
    '/meets/:id/day/results',
    staff,
    validate({ params: meetDayParams }, ({ params }, req) => day.saveResults(ctx, authOf(req), params.id)),
  );

  return router;
}
