// Authorization entries for the team rules: every coach reads them, only the head coach writes.
import { headOnly, staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  cases: {
    'GET /api/rules': { path: () => '/api/rules', expect: staff(200, 200) },
    'PUT /api/rules': { path: () => '/api/rules', invalidBody: { version: -1 }, expect: headOnly(422, 422) },
  },
};
