// /api/accessories: the team's accessory library (list, read, add, edit, archive and bring back).
import { Router } from 'express';
import { accessoryBody, accessoryListQuery, accessoryPatchBody, idParams } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import * as service from './accessories.service';

export function accessoriesRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/accessories',
    requireRole(STAFF),
    validate({ query: accessoryListQuery }, ({ query }, req) =>
      service.listAccessories(ctx, authOf(req).teamId, query),
    ),
  );

  router.get(
    '/accessories/:id',
    requireRole(STAFF),
    validate({ params: idParams }, ({ params }, req) => service.getAccessory(ctx, authOf(req).teamId, params.id)),
  );

  router.post(
    '/accessories',
    requireRole(STAFF),
    validate({ body: accessoryBody }, async ({ body }, req, res) => {
      res.status(201).json(await service.createAccessory(ctx, authOf(req).teamId, body));
    }),
  );

  router.patch(
    '/accessories/:id',
    requireRole(STAFF),
    validate({ params: idParams, body: accessoryPatchBody }, ({ params, body }, req) =>
      service.patchAccessory(ctx, authOf(req).teamId, params.id, body),
    ),
  );

  return router;
}
