// /api/board: everything the coach's board shows and checks, for a span of weeks.
import { Router } from 'express';
import { boardQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { loadBoard } from './board.service';

export function boardRouter(ctx: AppContext): Router {
  const router = Router();
  router.get(
    '/board',
    requireRole(STAFF),
    validate({ query: boardQuery }, ({ query }, req) => loadBoard(ctx.database.db, authOf(req).teamId, query)),
  );
  return router;
}
