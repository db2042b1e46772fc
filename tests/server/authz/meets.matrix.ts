// Authorization entries for meets and the athletes entered in them.
import { createMeet, createMeetAttempt, createMeetEntry } from '../../support/factories';
import { staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  async setup(db, team) {
    const meetId = await createMeet(db, team.teamId);
    const entryId = await createMeetEntry(db, team.teamId, meetId, team.athleteId);
    const doomedMeet = await createMeet(db, team.teamId, { name: 'Matrix meet to delete' });
    // Meet day: a meet in the future (results cannot be saved yet) with one entry and one judged attempt.
    const dayMeet = await createMeet(db, team.teamId, { name: 'Matrix meet day', date: '2031-05-01' });
    const dayEntry = await createMeetEntry(db, team.teamId, dayMeet, team.athleteId);
    const dayAttempt = await createMeetAttempt(db, team.teamId, dayMeet, dayEntry);
    return { meet: meetId, meetEntry: entryId, doomedMeet, dayMeet, dayEntry, dayAttempt };
  },
  cases: {
    'GET /api/meets': { path: () => '/api/meets', expect: staff(200, 200) },
    'POST /api/meets': { path: () => '/api/meets', invalidBody: {}, expect: staff(422, 422) },
    'GET /api/meets/:id': { path: (f) => `/api/meets/${f.ids.meet}`, expect: staff(200) },
    'PATCH /api/meets/:id': {
      path: (f) => `/api/meets/${f.ids.meet}`,
      invalidBody: { date: 'soon' },
      validBody: () => ({ notes: 'not yours', version: 1 }),
      expect: staff(422),
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
      expect: staff(422),
    },
    'PATCH /api/meets/:id/entries/:entryId': {
      path: (f) => `/api/meets/${f.ids.meet}/entries/${f.ids.meetEntry}`,
      invalidBody: { attempts: { squat: [-5] } },
      validBody: () => ({ weightClass: '63', version: 1 }),
      expect: staff(422),
    },
    'DELETE /api/meets/:id/entries/:entryId': {
      path: (f) => `/api/meets/${f.ids.meet}/entries/${f.ids.meetEntry}`,
      expect: { signedOut: 401, athlete: 403, coach: 204, headCoach: 404, otherTeam: 404 },
    },
    'GET /api/meets/:id/day': { path: (f) => `/api/meets/${f.ids.dayMeet}/day`, expect: staff(200) },
    'POST /api/meets/:id/day/marks': {
      path: (f) => `/api/meets/${f.ids.dayMeet}/day/marks`,
      invalidBody: { key: 'x', result: 'maybe' },
      validBody: (f) => ({
        key: 'matrix-other-team-1',
        entryId: f.ids.dayEntry,
        lift: 'bench',
        attemptNo: 1,
        weightKg: 100,
        result: 'good',
      }),
      expect: staff(422),
    },
    'DELETE /api/meets/:id/day/marks/:attemptId': {
      path: (f) => `/api/meets/${f.ids.dayMeet}/day/marks/${f.ids.dayAttempt}?version=99`,
      // A stale version: coaches get 409 and nothing is taken back.
      expect: staff(409),
    },
    'PUT /api/meets/:id/day/entries/:entryId/weigh-in': {
      path: (f) => `/api/meets/${f.ids.dayMeet}/day/entries/${f.ids.dayEntry}/weigh-in`,
      invalidBody: { bodyweightKg: -1, version: 1 },
      validBody: () => ({ bodyweightKg: 62.5, version: 1 }),
      expect: staff(422),
    },
    'PUT /api/meets/:id/day/entries/:entryId/jumps': {
      path: (f) => `/api/meets/${f.ids.dayMeet}/day/entries/${f.ids.dayEntry}/jumps`,
      invalidBody: { jumps: { squat: [3, 5] } },
      validBody: () => ({ jumps: { squat: [10, 5], bench: [5, 2.5], deadlift: [10, 5] } }),
      expect: staff(422),
    },
    'POST /api/meets/:id/day/results': {
      path: (f) => `/api/meets/${f.ids.dayMeet}/day/results`,
      // The meet is in the future: coaches are told so (422) and nothing is written.
      expect: staff(422),
    },
  },
};
