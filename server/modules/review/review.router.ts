// /api/athletes/:id/review: what a coach reviews on the athlete's page — this week's tissue work, tissue
// suggestions and check-ins, videos with comments, records per variant and the e1RM and bodyweight series.
import { Router } from 'express';
import { weekOfDate } from '../../../shared/engine/weeks';
import { idParams, type AthleteReview } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { NotFoundError } from '../../lib/errors';
import { findTeamAthlete } from '../athletes/athletes.service';
import { recentCheckins, tissueSuggestionsFor, tissueWorkFor } from '../tissue/tissue.service';
import { historyOf } from '../top-sets/history.service';
import { athleteVideos } from '../videos/videos.service';

export function reviewRouter(ctx: AppContext): Router {
  const router = Router();
  const db = ctx.database.db;

  router.get(
    '/athletes/:id/review',
    requireRole(STAFF),
    validate({ params: idParams }, async ({ params }, req): Promise<AthleteReview> => {
      const { teamId } = authOf(req);
      const athlete = await findTeamAthlete(db, teamId, params.id);
      if (!athlete) throw new NotFoundError('That athlete');
      const week = weekOfDate(new Date());
      const [suggestions, tissue, checkins, videos, history] = await Promise.all([
        tissueSuggestionsFor(db, teamId, athlete.id, week),
        tissueWorkFor(db, teamId, athlete.id, week),
        recentCheckins(db, teamId, athlete.id, 12),
        athleteVideos(db, teamId, athlete.id),
        // The e1RM and bodyweight series are history: a moment's replication lag cannot mislead them.
        historyOf(ctx.database.mayLag, teamId, athlete.id),
      ]);
      return {
        athlete: { id: athlete.id, name: athlete.name, sex: athlete.sex, division: athlete.division },
        week,
        suggestions,
        tissue,
        checkins,
        videos,
        ...history,
      };
    }),
  );

  return router;
}
