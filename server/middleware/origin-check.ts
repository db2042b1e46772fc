// Cross-site request protection for cookie-authenticated writes: a write must come from our own
// origin (SameSite=Lax cookies are the second line of defence).
import type { RequestHandler } from 'express';
import { ForbiddenError } from '../lib/errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

export function originCheck(allowed: Set<string>, exemptPaths: string[] = []): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method) || exemptPaths.some((p) => req.path.startsWith(p))) return next();
    const origin = req.get('origin');
    const own = `${req.protocol}://${req.get('host') ?? ''}`;
    if (origin !== undefined) {
      if (origin === own || allowed.has(origin)) return next();
      return next(new ForbiddenError('This request came from another site and was refused.'));
    }
    // No Origin (non-browser clients, some same-origin navigations): refuse only what the browser
    // itself marks as cross-site.
    if (req.get('sec-fetch-site') === 'cross-site') {
      return next(new ForbiddenError('This request came from another site and was refused.'));
    }
    next();
  };
}
