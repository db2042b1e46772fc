// createApp(): middleware, routers and error handling, without listen() so tests can drive it.
import express, { type Express, type RequestHandler } from 'express';
import cookieParser from 'cookie-parser';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { existsSync } from 'node:fs';
import type { ServerResponse } from 'node:http';
import { join } from 'node:path';
import { allowedOrigins } from './config/env';
import type { AppContext } from './context';
import { loadSession } from './middleware/auth';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { originCheck } from './middleware/origin-check';
import { firstGlance } from './modules/first-glance/first-glance.page';
import { healthRouter } from './modules/health/health.router';
import { apiModules } from './modules';

/** Paths that authenticate by signature, not cookie (payment webhooks), and so skip the Origin check. */
export const ORIGIN_EXEMPT = ['/webhooks/'];

export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  if (ctx.env.TRUST_PROXY > 0) app.set('trust proxy', ctx.env.TRUST_PROXY);
  const https = new URL(ctx.env.APP_ORIGIN).protocol === 'https:';

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          mediaSrc: ["'self'", 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          ...(https ? { upgradeInsecureRequests: [] } : {}),
        },
      },
      strictTransportSecurity: https,
    }),
  );
  app.use(
    pinoHttp({
      logger: ctx.logger,
      // Only method, path and status: no query strings (tokens), headers or bodies.
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, path: req.url.split('?')[0] }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' || (req.url ?? '').startsWith('/assets/') },
    }),
  );
  app.use(cookieParser());

  const api = express.Router();
  // Answers are for this caller at this moment: no browser or proxy may keep them.
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // Signature-checked webhooks read their raw body themselves: the signature covers the exact bytes.
  const json = express.json({ limit: '1mb' });
  api.use((req, res, next) => (ORIGIN_EXEMPT.some((p) => req.path.startsWith(p)) ? next() : json(req, res, next)));
  api.use(originCheck(allowedOrigins(ctx.env), ORIGIN_EXEMPT));
  api.use(healthRouter(ctx));
  api.use(loadSession(ctx));
  for (const makeRouter of apiModules) api.use(makeRouter(ctx));
  api.use(apiNotFound);
  app.use('/api', api);
  app.locals.apiRouter = api;

  const dist = ctx.env.CLIENT_DIST;
  if (dist && existsSync(join(dist, 'index.html'))) {
    // The build writes .br and .gz beside each file; the smallest one the browser accepts is sent.
    const compressed = (root: string, serveStatic: expressStaticGzip.ExpressStaticGzipOptions['serveStatic']) =>
      expressStaticGzip(root, { enableBrotli: true, orderPreference: ['br', 'gzip'], index: false, serveStatic });
    // Hashed names: a changed file is a new URL, so the browser may keep each one for good.
    app.use('/assets', compressed(join(dist, 'assets'), { immutable: true, maxAge: '1y', fallthrough: false }));
    app.use(compressed(dist, { index: false }));
    // The page itself is checked every time, so a new build reaches the browser at once.
    const page = compressed(dist, {
      index: false,
      cacheControl: false,
      setHeaders: (res: ServerResponse) => res.setHeader('Cache-Control', 'no-cache'),
    });
    const plainPage: RequestHandler = (req, res, next) => {
      req.url = '/index.html';
      page(req, res, next);
    };
    // A signed-in athlete's visit home gets the page with the first glance of the week drawn in.
    app.get('/{*splat}', firstGlance(ctx, join(dist, 'index.html'), plainPage));
  }

  app.use(errorHandler(ctx.logger));
  return app;
}
