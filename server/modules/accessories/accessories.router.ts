// /api/accessories: the team's accessory library (list, read, add, edit, archive and bring back), its CSV
// export and all-or-nothing import.
import { Router } from 'express';
import {
  LIBRARY_CSV_MAX_BYTES,
  accessoryBody,
  accessoryListQuery,
  accessoryPatchBody,
  idParams,
} from '../../../shared/schemas';
import { ValidationError } from '../../lib/errors';
import { megabytes, receiveFile } from '../../middleware/upload';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import * as service from './accessories.service';

export function accessoriesRouter(ctx: AppContext): Router {
  const router = Router();
  const upload = receiveFile({
    field: 'file',
    maxBytes: LIBRARY_CSV_MAX_BYTES,
    storage: 'memory',
    tooLarge: `That file is larger than the ${megabytes(LIBRARY_CSV_MAX_BYTES)} limit. Import the library in parts.`,
    oneFile: 'Send one CSV file in the “file” field',
  });

  router.get(
    '/accessories',
    requireRole(STAFF),
    validate({ query: accessoryListQuery }, ({ query }, req) =>
      service.listAccessories(ctx, authOf(req).teamId, query),
    ),
  );

  // Fixed paths come before `/accessories/:id`.
  router.get(
    '/accessories/export',
    requireRole(STAFF),
    validate({}, async (_input, req, res) => {
      const csv = await service.exportAccessories(ctx, authOf(req).teamId);
      const day = new Date().toISOString().slice(0, 10);
      res
        .status(200)
        .type('text/csv; charset=utf-8')
        .set('Content-Disposition', `attachment; filename="rackturn-accessories-${day}.csv"`)
        .send(csv);
    }),
  );

  router.post(
    '/accessories/import',
    requireRole(STAFF),
    upload,
    validate({}, async (_input, req) => {
      if (!req.file) {
        throw new ValidationError('Choose a CSV file to import.', { file: ['Choose a CSV file to import'] });
      }
      return service.importAccessories(ctx, authOf(req).teamId, req.file.buffer);
    }),
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
