// Fee plans, the athletes' fee table, paying and cancelling, and the provider's webhook.
import { all, athleteOnly, headOnly, type MatrixModule } from './types';
import { createFeePlan, setAthleteBilling } from '../../support/factories';

export const matrix: MatrixModule = {
  async setup(db, team) {
    const feePlan = await createFeePlan(db, team.teamId);
    // Named by an athlete's (ended) fee: the head coach's delete is refused with 409, not carried out.
    const usedFeePlan = await createFeePlan(db, team.teamId);
    await setAthleteBilling(db, team.teamId, team.athleteId, { feePlanId: usedFeePlan, status: 'cancelled' });
    return { feePlan, usedFeePlan };
  },
  cases: {
    'GET /api/fees/plans': {
      path: () => '/api/fees/plans',
      expect: { signedOut: 401, athlete: 200, coach: 200, headCoach: 200, otherTeam: 200 },
    },
    'POST /api/fees/plans': { path: () => '/api/fees/plans', invalidBody: {}, expect: headOnly(422, 422) },
    'PATCH /api/fees/plans/:id': {
      path: (f) => `/api/fees/plans/${f.ids.feePlan}`,
      invalidBody: {},
      validBody: () => ({ name: 'Taken over', price: '1', version: 1 }),
      expect: headOnly(422),
    },
    'POST /api/fees/plans/:id/archive': {
      path: (f) => `/api/fees/plans/${f.ids.feePlan}/archive`,
      invalidBody: {},
      validBody: () => ({ version: 1 }),
      expect: headOnly(422),
    },
    'POST /api/fees/plans/:id/restore': {
      path: (f) => `/api/fees/plans/${f.ids.feePlan}/restore`,
      invalidBody: {},
      validBody: () => ({ version: 1 }),
      expect: headOnly(422),
    },
    'DELETE /api/fees/plans/:id': {
      path: (f) => `/api/fees/plans/${f.ids.usedFeePlan}?version=1`,
      expect: headOnly(409),
    },
    'GET /api/fees/athletes': { path: () => '/api/fees/athletes', expect: headOnly(200, 200) },
    'POST /api/fees/athletes/:athleteId/checkout': {
      path: (f) => `/api/fees/athletes/${f.team.athleteId}/checkout`,
      invalidBody: {},
      validBody: (f) => ({ planId: f.ids.feePlan }),
      expect: headOnly(422),
    },
    'POST /api/fees/athletes/:athleteId/cancel': {
      path: (f) => `/api/fees/athletes/${f.team.athleteId}/cancel`,
      expect: headOnly(409),
    },
    'GET /api/my-fee': { path: () => '/api/my-fee', expect: athleteOnly(200) },
    'POST /api/my-fee/checkout': { path: () => '/api/my-fee/checkout', invalidBody: {}, expect: athleteOnly(422) },
    // The athlete's fee is over (cancelled), so there is nothing to cancel: 409, and nothing changes.
    'POST /api/my-fee/cancel': { path: () => '/api/my-fee/cancel', expect: athleteOnly(409) },
    // No signature header: refused before anything is read.
    'POST /api/webhooks/payments': { path: () => '/api/webhooks/payments', invalidBody: {}, expect: all(400) },
  },
};
