// Authorization entries for plan entries, plan generation and the coach's board.
import { addWeeks, weekOfDate } from '../../../shared/engine/weeks';
import { createPlanEntry, createVariant } from '../../support/factories';
import { staff, type MatrixModule } from './types';

const week = addWeeks(weekOfDate(new Date()), 3);
const board = `from=${addWeeks(week, -7)}&to=${addWeeks(week, 5)}`;

export const matrix: MatrixModule = {
  async setup(db, team) {
    const planVariant = await createVariant(db, team.teamId, { lift: 'squat' });
    const planEntry = await createPlanEntry(db, team.teamId, team.athleteId, planVariant, { week, slotId: 'lower' });
    return { planVariant, planEntry };
  },
  cases: {
    'GET /api/plans': { path: () => `/api/plans?from=${week}&to=${week}`, expect: staff(200, 200) },
    'POST /api/plans/generate': {
      path: () => '/api/plans/generate',
      invalidBody: { weeks: 'someday' },
      validBody: (f) => ({ weeks: 'next', athleteIds: [f.team.athleteId] }),
      expect: staff(422),
    },
    'POST /api/plans/batch': {
      path: () => '/api/plans/batch',
      invalidBody: { changes: [] },
      validBody: (f) => ({
        changes: [{ athleteId: f.team.athleteId, week, slotId: 'lower', variantId: f.ids.planVariant, version: 1 }],
      }),
      expect: staff(422),
    },
    'PUT /api/plans/:athleteId/:week/:slotId': {
      path: (f) => `/api/plans/${f.team.athleteId}/${week}/lower`,
      invalidBody: { variantId: 'box squat' },
      validBody: (f) => ({ variantId: f.ids.planVariant, version: 1 }),
      expect: staff(422),
    },
    // A version nobody has: staff get 409 and nothing changes; the other team does not find the cell.
    'DELETE /api/plans/:athleteId/:week/:slotId': {
      path: (f) => `/api/plans/${f.team.athleteId}/${week}/lower?version=99`,
      expect: staff(409),
    },
    'GET /api/plans/:athleteId/:week/:slotId/history': {
      path: (f) => `/api/plans/${f.team.athleteId}/${week}/lower/history`,
      expect: staff(200),
    },
    // Another team's athlete is not found.
    'GET /api/plans/:athleteId/:week/:slotId/alternatives': {
      path: (f) => `/api/plans/${f.team.athleteId}/${week}/lower/alternatives`,
      expect: staff(200),
    },
    'GET /api/board': { path: () => `/api/board?${board}`, expect: staff(200, 200) },
  },
};
