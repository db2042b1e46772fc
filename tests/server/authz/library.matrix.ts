// Authorization entries for the exercise library and its CSV export and import.
import { createPlanEntry, createVariant } from '../../support/factories';
import { staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  async setup(db, team) {
    // In someone's history, so DELETE archives it and answers the same for every coach.
    const variantId = await createVariant(db, team.teamId, { name: `Matrix variant ${Date.now()}` });
    await createPlanEntry(db, team.teamId, team.athleteId, variantId, { week: '2026-W02', slotId: 'matrix' });
    return { libraryVariant: variantId };
  },
  cases: {
    'GET /api/variants': { path: () => '/api/variants', expect: staff(200, 200) },
    'GET /api/variants/facets': { path: () => '/api/variants/facets', expect: staff(200, 200) },
    'GET /api/variants/export': { path: () => '/api/variants/export', expect: staff(200, 200) },
    // No file attached: refused before anything is read.
    'POST /api/variants/import': { path: () => '/api/variants/import', expect: staff(422, 422) },
    'POST /api/variants': { path: () => '/api/variants', invalidBody: {}, expect: staff(422, 422) },
    'GET /api/variants/:id': { path: (f) => `/api/variants/${f.ids.libraryVariant}`, expect: staff(200) },
    'PATCH /api/variants/:id': {
      path: (f) => `/api/variants/${f.ids.libraryVariant}`,
      invalidBody: { risk: 9 },
      validBody: () => ({ notes: 'not yours', version: 1 }),
      expect: staff(422),
    },
    'DELETE /api/variants/:id': { path: (f) => `/api/variants/${f.ids.libraryVariant}`, expect: staff(200) },
  },
};
