// Authorization entry for the live event stream: any signed-in caller. The matrix does not ask for a
// stream, so allowed callers get 406; the stream's own scoping is tested in events.test.ts.
import { signedIn, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  cases: { 'GET /api/events': { path: () => '/api/events', expect: signedIn(406) } },
};
