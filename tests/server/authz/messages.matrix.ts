// Authorization entries for message threads: any signed-in member of the team, athletes only their own
// athlete's threads (the linked athlete of team A here), and nothing of team A for the other team.
import { signedIn, type MatrixModule } from './types';

const thread = (f: { team: { athleteId: number } }) => `/api/messages/threads/${f.team.athleteId}/2026-W10`;

export const matrix: MatrixModule = {
  cases: {
    'GET /api/messages/threads': { path: () => '/api/messages/threads', expect: signedIn(200) },
    'GET /api/messages/threads/:athleteId/:week': { path: thread, expect: signedIn(200, 404) },
    'POST /api/messages/threads/:athleteId/:week': {
      path: thread,
      invalidBody: { body: '' },
      validBody: () => ({ body: 'Can I swap the pin press this week?' }),
      expect: signedIn(422, 404),
    },
    'PUT /api/messages/threads/:athleteId/:week/read': { path: (f) => `${thread(f)}/read`, expect: signedIn(200, 404) },
  },
};
