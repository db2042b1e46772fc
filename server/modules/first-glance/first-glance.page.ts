// The app's page for a signed-in athlete's navigation home (/ or /my-week): the built index.html with the
// first glance of the week in it, compressed per request and kept by no cache (it holds someone's data).
// Anything else (signed out, another role, a fetch that is not a page visit, any failure) goes to `plain`,
// the page exactly as the build wrote it: a visit never ends in an error because of the glance.
import { readFile, stat } from 'node:fs/promises';
import { promisify } from 'node:util';
import { brotliCompress, constants as zlib, gzip } from 'node:zlib';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../../context';
import { attachSession } from '../../middleware/auth';
import { firstGlancePage, requestedWeek } from './first-glance.service';

const brotli = promisify(brotliCompress);
const gzipped = promisify(gzip);

/** Paths whose page is the athlete's My week (the home page sends an athlete there). */
const HOME_PATHS = new Set(['/', '/my-week']);

/** The build's index.html, read again when the file changes (a new build under a running server). */
function templateReader(file: string): () => Promise<string> {
  let kept: { mtimeMs: number; text: string } | null = null;
  return async () => {
    const { mtimeMs } = await stat(file);
    if (kept?.mtimeMs !== mtimeMs) kept = { mtimeMs, text: await readFile(file, 'utf8') };
    return kept.text;
  };
}

async function encode(req: Request, html: string): Promise<{ body: Buffer; encoding: string | null }> {
  const text = Buffer.from(html, 'utf8');
  // A middling brotli level: a page drawn per request, where the last few per cent cost more than they save.
  if (req.acceptsEncodings('br'))
    return { body: await brotli(text, { params: { [zlib.BROTLI_PARAM_QUALITY]: 5 } }), encoding: 'br' };
  if (req.acceptsEncodings('gzip')) return { body: await gzipped(text), encoding: 'gzip' };
  return { body: text, encoding: null };
}

export function firstGlance(ctx: AppContext, indexFile: string, plain: RequestHandler): RequestHandler {
  const template = templateReader(indexFile);
  return (req: Request, res: Response, next: NextFunction) => {
    // A browser says what a fetch is for: only its own page visits (never the service worker's copy of the
    // app's page, which is shared by whoever signs in next) get someone's week.
    const dest = req.get('Sec-Fetch-Dest');
    if (!HOME_PATHS.has(req.path) || (dest !== undefined && dest !== 'document')) return plain(req, res, next);
    void (async () => {
      await attachSession(ctx, req, res);
      if (req.auth?.role !== 'athlete') return null;
      const html = await firstGlancePage(ctx, req.auth, await template(), requestedWeek(req.path, req.query));
      return html === null ? null : encode(req, html);
    })().then(
      (page) => {
        if (!page) return plain(req, res, next);
        res.status(200);
        res.setHeader('Content-Type', 'text/html; charset=utf-8');
        res.setHeader('Cache-Control', 'no-store, private');
        res.setHeader('Vary', 'Accept-Encoding, Cookie');
        if (page.encoding) res.setHeader('Content-Encoding', page.encoding);
        res.setHeader('Content-Length', page.body.length);
        res.end(page.body);
      },
      (err: unknown) => {
        ctx.logger.warn({ err, path: req.path }, 'first glance not drawn; the plain page is sent');
        plain(req, res, next);
      },
    );
  };
}
