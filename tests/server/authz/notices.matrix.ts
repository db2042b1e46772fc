// Authorization entries for coaches' notices: coaches only; the e-mail's off link needs no sign-in and
// answers 400 to a missing or forged token (a broken link, not a form to correct).
import { all, staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  cases: {
    'GET /api/notices': { path: () => '/api/notices', expect: staff(200, 200) },
    'PUT /api/notices/read-all': { path: () => '/api/notices/read-all', expect: staff(200, 200) },
    'PUT /api/notices/:id/read': { path: () => '/api/notices/0/read', expect: staff(422, 422) },
    'GET /api/notices/settings': { path: () => '/api/notices/settings', expect: staff(200, 200) },
    'PUT /api/notices/settings': {
      path: () => '/api/notices/settings',
      invalidBody: {},
      validBody: () => ({ dailyEmail: true }),
      expect: staff(422, 200),
    },
    'GET /api/notices/daily-email/off': { path: () => '/api/notices/daily-email/off', expect: all(400) },
    'POST /api/notices/daily-email/off': { path: () => '/api/notices/daily-email/off', expect: all(400) },
  },
};
