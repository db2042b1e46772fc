// /api/board: everything the coach's board shows and checks, for a span of weeks.
import { Router } from 'express';
import { boardQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { today } from '../plans/plans.service';
import { loadBoard } from './board.service';

export function boardRouter(ctx: AppContext): Router {
  const router = Router();
  router.get(
    '/board',
    requireRole(STAFF),
    validate({ query: boardQuery }, ({ query }, req) => {
      // Weeks that are over change rarely and a coach looking back can take a second's lag: the replica.
      // Any span that reaches this week or later is where saves land, so it reads the primary.
      const db = query.to < today().week ? ctx.database.mayLag : ctx.database.db;
      return loadBoard(db, authOf(req).teamId, query);
    }),
  );
  return router;
}
