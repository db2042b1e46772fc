// /api/variants: the team's exercise library, its CSV export and all-or-nothing import.
import { Router } from 'express';
import {
  LIBRARY_CSV_MAX_BYTES,
  idParams,
  variantBody,
  variantListQuery,
  variantPatchBody,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { megabytes, receiveFile } from '../../middleware/upload';
import { validate } from '../../middleware/validate';
import { ValidationError } from '../../lib/errors';
import * as service from './variants.service';

export function variantsRouter(ctx: AppContext): Router {
  const router = Router();
  const upload = receiveFile({
    field: 'file',
    maxBytes: LIBRARY_CSV_MAX_BYTES,
    storage: 'memory',
    tooLarge: `That file is larger than the ${megabytes(LIBRARY_CSV_MAX_BYTES)} limit. Import the library in parts.`,
    oneFile: 'Send one CSV file in the “file” field',
  });

  router.get(
    '/variants',
    requireRole(STAFF),
    validate({ query: variantListQuery }, ({ query }, req) => service.listVariants(ctx, authOf(req).teamId, query)),
  );

  // Fixed paths come before `/variants/:id`.
  router.get(
    '/variants/facets',
    requireRole(STAFF),
    validate({}, (_input, req) => service.variantFacets(ctx, authOf(req).teamId)),
  );

  router.get(
    '/variants/export',
    requireRole(STAFF),
    validate({}, async (_input, req, res) => {
      const csv = await service.exportLibrary(ctx, authOf(req).teamId);
      const day = new Date().toISOString().slice(0, 10);
      res
        .status(200)
        .type('text/csv; charset=utf-8')
        .set('Content-Disposition', `attachment; filename="rackturn-library-${day}.csv"`)
        .send(csv);
    }),
  );

  router.post(
    '/variants/import',
    requireRole(STAFF),
    upload,
    validate({}, async (_input, req) => {
      if (!req.file) {
        throw new ValidationError('Choose a CSV file to import.', { file: ['Choose a CSV file to import'] });
      }
      return service.importLibrary(ctx, authOf(req).teamId, req.file.buffer);
    }),
  );

  router.get(
    '/variants/:id',
    requireRole(STAFF),
    validate({ params: idParams }, ({ params }, req) => service.getVariant(ctx, authOf(req).teamId, params.id)),
  );

  router.post(
    '/variants',
    requireRole(STAFF),
    validate({ body: variantBody }, async ({ body }, req, res) => {
      const created = await service.createVariant(ctx, authOf(req).teamId, body);
      res.status(201).json(created);
    }),
  );

  router.patch(
    '/variants/:id',
    requireRole(STAFF),
    validate({ params: idParams, body: variantPatchBody }, ({ params, body }, req) =>
      service.patchVariant(ctx, authOf(req).teamId, params.id, body),
    ),
  );

  router.delete(
    '/variants/:id',
    requireRole(STAFF),
    validate({ params: idParams }, ({ params }, req) => service.removeVariant(ctx, authOf(req).teamId, params.id)),
  );

  return router;
}
