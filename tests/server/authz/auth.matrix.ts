import { all, signedIn, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  cases: {
    'GET /api/health': { path: () => '/api/health', expect: all(200) },
    'POST /api/auth/login': { path: () => '/api/auth/login', invalidBody: {}, expect: all(400) },
    'POST /api/auth/logout': { path: () => '/api/auth/logout', expect: all(200), signsOut: true },
    'GET /api/auth/me': { path: () => '/api/auth/me', expect: signedIn(200) },
  },
};
