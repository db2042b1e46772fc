import { all, signedIn, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  cases: {
    'GET /api/health': { path: () => '/api/health', expect: all(200) },
    'POST /api/auth/login': { path: () => '/api/auth/login', invalidBody: {}, expect: all(422) },
    'POST /api/auth/logout': { path: () => '/api/auth/logout', expect: all(200), signsOut: true },
    'GET /api/auth/me': { path: () => '/api/auth/me', expect: signedIn(200) },
    'POST /api/auth/logout-everywhere': {
      path: () => '/api/auth/logout-everywhere',
      expect: signedIn(200),
      signsOut: true,
    },
    'GET /api/auth/sessions': { path: () => '/api/auth/sessions', expect: signedIn(200) },
    // Only one's own sessions can be ended; any other id is not found.
    'DELETE /api/auth/sessions/:id': { path: () => '/api/auth/sessions/999999999', expect: signedIn(404) },
  },
};
