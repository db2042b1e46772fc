// /api/events: the signed-in caller's live stream (server-sent events) of changes to re-read.
import { Router } from 'express';
import type { AppContext } from '../../context';
import { ANY_ROLE, authOf, requireRole } from '../../middleware/auth';
import { AppError } from '../../lib/errors';
import { hubFor } from './events.service';

export function eventsRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/events', requireRole(ANY_ROLE), async (req, res, next) => {
    // Only a client that asks for a stream gets one (browsers' EventSource always does).
    if (!req.accepts('text/event-stream') || !req.get('accept')?.includes('text/event-stream')) {
      next(new AppError(406, 'not_acceptable', 'This address sends a stream of events: ask for text/event-stream.'));
      return;
    }
    try {
      await hubFor(ctx).subscribe(authOf(req), res);
    } catch (err) {
      next(err);
    }
  });
  return router;
}
