// The training week: coaches read and edit an athlete's week; the athlete logs their own sessions.
import { addWeeks, weekOfDate } from '../../../shared/engine/weeks';
import { athleteOnly, staff, type MatrixModule } from './types';

const week = addWeeks(weekOfDate(new Date()), 1);

export const matrix: MatrixModule = {
  cases: {
    'GET /api/athletes/:athleteId/weeks/:week': {
      path: (f) => `/api/athletes/${f.team.athleteId}/weeks/${week}`,
      expect: staff(200),
    },
    'GET /api/athletes/:athleteId/weeks/:week/accessories': {
      path: (f) => `/api/athletes/${f.team.athleteId}/weeks/${week}/accessories`,
      expect: staff(200),
    },
    'PUT /api/athletes/:athleteId/weeks/:week': {
      path: (f) => `/api/athletes/${f.team.athleteId}/weeks/${week}`,
      invalidBody: { version: 0 },
      validBody: () => ({ version: 0, deload: false, trainingMaxPct: 90, sessions: {} }),
      expect: staff(422),
    },
    'PUT /api/my-week/sessions/:sessionId': {
      path: () => '/api/my-week/sessions/lower-speed',
      invalidBody: { week: 'soon' },
      expect: athleteOnly(422),
    },
  },
};
