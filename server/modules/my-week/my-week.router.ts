// /api/my-week and /api/my-history: the athlete's own week and history pages (with their videos and
// the coaches' comments on them).
import { Router } from 'express';
import { myWeekQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ATHLETE, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { historyOf } from '../top-sets/history.service';
import { athleteVideos } from '../videos/videos.service';
import { myWeekJson } from './my-week.service';
import { ownAthleteId } from '../../lib/scope';

export function myWeekRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/my-week',
    requireRole(ATHLETE),
    validate({ query: myWeekQuery }, async ({ query }, req, res) => {
      const auth = authOf(req);
      const who = { teamId: auth.teamId, athleteId: ownAthleteId(req), unit: auth.unit };
      // Already JSON: kept between requests while nothing it shows has changed.
      res.type('json').send(await myWeekJson(ctx, who, query.week));
    }),
  );

  router.get(
    '/my-history',
    requireRole(ATHLETE),
    validate({}, async (_input, req) => {
      const auth = authOf(req);
      const athleteId = ownAthleteId(req);
      const [history, videos] = await Promise.all([
        // Charts of past training may lag a moment (the replica); My week itself reads the primary.
        historyOf(ctx.database.mayLag, auth.teamId, athleteId),
        athleteVideos(ctx.database.db, auth.teamId, athleteId),
      ]);
      return { unit: auth.unit, ...history, videos };
    }),
  );

  return router;
}
