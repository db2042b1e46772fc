// Authorization entries for the roster: athletes, their restrictions and their history.
import { addWeeks, weekOfDate } from '../../../shared/engine/weeks';
import { restWeeks } from '../../../server/db/schema';
import { createAthlete, createRestriction } from '../../support/factories';
import { staff, type MatrixModule } from './types';

// Weeks still ahead, so they can be marked and unmarked: one to mark, one marked already to unmark.
const markWeek = addWeeks(weekOfDate(new Date()), 3);
const unmarkWeek = addWeeks(weekOfDate(new Date()), 4);

export const matrix: MatrixModule = {
  async setup(db, team) {
    // An athlete of its own, so archiving it leaves the team's linked athlete to the other modules.
    const athleteId = await createAthlete(db, team.teamId, { name: 'Matrix roster athlete' });
    const restrictionId = await createRestriction(db, team.teamId, athleteId);
    await db.insert(restWeeks).values({ teamId: team.teamId, athleteId, week: unmarkWeek });
    return { rosterAthlete: athleteId, rosterRestriction: restrictionId };
  },
  cases: {
    'GET /api/athletes': { path: () => '/api/athletes', expect: staff(200, 200) },
    'GET /api/athletes/accounts': { path: () => '/api/athletes/accounts', expect: staff(200, 200) },
    'POST /api/athletes': { path: () => '/api/athletes', invalidBody: {}, expect: staff(422, 422) },
    'GET /api/athletes/:id': { path: (f) => `/api/athletes/${f.ids.rosterAthlete}`, expect: staff(200) },
    'PATCH /api/athletes/:id': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}`,
      invalidBody: { sex: 'X' },
      validBody: () => ({ notes: 'not yours', version: 1 }),
      expect: staff(422),
    },
    // Archiving twice is the same as once.
    'DELETE /api/athletes/:id': { path: (f) => `/api/athletes/${f.ids.rosterAthlete}`, expect: staff(200) },
    'GET /api/athletes/:id/history': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}/history`,
      expect: staff(200),
    },
    'POST /api/athletes/:id/restrictions': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}/restrictions`,
      invalidBody: { joint: 'spine' },
      validBody: () => ({ joint: 'knee', maxStress: 1, fromDate: '2026-01-05' }),
      expect: staff(422),
    },
    'PATCH /api/athletes/:id/restrictions/:restrictionId': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}/restrictions/${f.ids.rosterRestriction}`,
      invalidBody: { maxStress: 7 },
      validBody: () => ({ note: 'not yours', version: 1 }),
      expect: staff(422),
    },
    // The coach's delete removes it; the head coach then finds nothing to delete.
    'DELETE /api/athletes/:id/restrictions/:restrictionId': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}/restrictions/${f.ids.rosterRestriction}`,
      expect: { signedOut: 401, athlete: 403, coach: 204, headCoach: 404, otherTeam: 404 },
    },
    // The coach marks the week; the head coach's mark finds it marked already.
    'PUT /api/athletes/:athleteId/rest-weeks/:week': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}/rest-weeks/${markWeek}`,
      expect: { signedOut: 401, athlete: 403, coach: 201, headCoach: 200, otherTeam: 404 },
    },
    'DELETE /api/athletes/:athleteId/rest-weeks/:week': {
      path: (f) => `/api/athletes/${f.ids.rosterAthlete}/rest-weeks/${unmarkWeek}`,
      expect: { signedOut: 401, athlete: 403, coach: 204, headCoach: 404, otherTeam: 404 },
    },
  },
};
