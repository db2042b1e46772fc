// Authorization entries for the athlete's week and history, top sets, bodyweights, check-ins and the
// coach's review of an athlete.
import { weekOfDate } from '../../../shared/engine/weeks';
import { createPlanEntry, createVariant } from '../../support/factories';
import { athleteOnly, signedIn, staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  async setup(db, team) {
    const variantId = await createVariant(db, team.teamId);
    const planEntryId = await createPlanEntry(db, team.teamId, team.athleteId, variantId, {
      week: weekOfDate(new Date()),
    });
    return { trainingPlanEntry: planEntryId };
  },
  cases: {
    'GET /api/my-week': { path: () => '/api/my-week', expect: athleteOnly(200) },
    'GET /api/my-history': { path: () => '/api/my-history', expect: athleteOnly(200) },
    'POST /api/top-sets': { path: () => '/api/top-sets', invalidBody: {}, expect: athleteOnly(422) },
    'GET /api/top-sets': {
      path: (f) => `/api/top-sets?athleteId=${f.team.athleteId}`,
      expect: signedIn(200, 404),
    },
    'PUT /api/bodyweights/:measuredOn': {
      path: () => '/api/bodyweights/2026-03-01',
      invalidBody: { unit: 'stone', weight: -1 },
      expect: athleteOnly(422),
    },
    'GET /api/bodyweights': {
      path: (f) => `/api/bodyweights?athleteId=${f.team.athleteId}`,
      expect: signedIn(200, 404),
    },
    'POST /api/tissue/checkins': { path: () => '/api/tissue/checkins', invalidBody: {}, expect: athleteOnly(422) },
    'GET /api/athletes/:id/review': {
      path: (f) => `/api/athletes/${f.team.athleteId}/review`,
      expect: staff(200),
    },
  },
};
