// Authorization entries for the accessory library.
import { accessories } from '../../../server/db/schema';
import { staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  async setup(db, team) {
    const [row] = await db
      .insert(accessories)
      .values({
        teamId: team.teamId,
        name: `Matrix row ${Date.now()}`,
        category: 'upperBack',
        stress: {},
        sets: 3,
        reps: 10,
      })
      .$returningId();
    return { libraryAccessory: row!.id };
  },
  cases: {
    'GET /api/accessories': { path: () => '/api/accessories', expect: staff(200, 200) },
    'GET /api/accessories/export': { path: () => '/api/accessories/export', expect: staff(200, 200) },
    // No file attached: refused before anything is read.
    'POST /api/accessories/import': { path: () => '/api/accessories/import', expect: staff(422, 422) },
    'POST /api/accessories': { path: () => '/api/accessories', invalidBody: {}, expect: staff(422, 422) },
    'GET /api/accessories/:id': { path: (f) => `/api/accessories/${f.ids.libraryAccessory}`, expect: staff(200) },
    'PATCH /api/accessories/:id': {
      path: (f) => `/api/accessories/${f.ids.libraryAccessory}`,
      invalidBody: { sets: 0 },
      validBody: () => ({ notes: 'not yours', version: 1 }),
      expect: staff(422),
    },
  },
};
