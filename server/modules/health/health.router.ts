// /api/health: is the app up and can it reach the database?
import { Router } from 'express';
import type { AppContext } from '../../context';
import { pingDatabase } from '../../db/client';
import { validate } from '../../middleware/validate';

export function healthRouter(ctx: AppContext): Router {
  const router = Router();
  router.get(
    '/health',
    validate({}, async (_input, _req, res) => {
      const up = await pingDatabase(ctx.database.pool);
      // The replica's state is what this instance believes: 'down' means its reads run on the primary.
      res.status(up ? 200 : 503).json({ ok: up, db: up ? 'up' : 'down', replica: ctx.database.replica.state });
    }),
  );
  return router;
}
