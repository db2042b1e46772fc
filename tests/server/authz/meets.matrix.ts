// Authorization entries for meets and the athletes entered in them.
import { createMeet, createMeetEntry } from '../../support/factories';
import { staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  async setup(db, team) {
    const meetId = await createMeet(db, team.teamId);
    const entryId = await createMeetEntry(db, team.teamId, meetId, team.athleteId);
    const doomedMeet = await createMeet(db, team.teamId, { name: 'Matrix meet to delete' });
    return { meet: meetId, meetEntry: entryId, doomedMeet };
  },
  cases: {
    'GET /api/meets': { path: () => '/api/meets', expect: staff(200, 200) },
    'POST /api/meets': { path: () => '/api/meets', invalidBody: {}, expect: staff(400, 400) },
    'GET /api/meets/:id': { path: (f) => `/api/meets/${f.ids.meet}`, expect: staff(200) },
    'PATCH /api/meets/:id': {
      path: (f) => `/api/meets/${f.ids.meet}`,
      invalidBody: { date: 'soon' },
      validBody: () => ({ notes: 'not yours', version: 1 }),
      expect: staff(400),
    },
    // The coach's delete removes it; the head coach then finds nothing to delete.
    'DELETE /api/meets/:id': {
      path: (f) => `/api/meets/${f.ids.doomedMeet}`,
      expect: { signedOut: 401, athlete: 403, coach: 204, headCoach: 404, otherTeam: 404 },
    },
    'POST /api/meets/:id/entries': {
      path: (f) => `/api/meets/${f.ids.meet}/entries`,
      invalidBody: { athleteId: 'someone' },
      validBody: (f) => ({ athleteId: f.other.athleteId }),
      expect: staff(400),
    },
    'PATCH /api/meets/:id/entries/:entryId': {
      path: (f) => `/api/meets/${f.ids.meet}/entries/${f.ids.meetEntry}`,
      invalidBody: { attempts: { squat: [-5] } },
      validBody: () => ({ weightClass: '63', version: 1 }),
      expect: staff(400),
    },
    'DELETE /api/meets/:id/entries/:entryId': {
      path: (f) => `/api/meets/${f.ids.meet}/entries/${f.ids.meetEntry}`,
      expect: { signedOut: 401, athlete: 403, coach: 204, headCoach: 404, otherTeam: 404 },
    },
  },
};
