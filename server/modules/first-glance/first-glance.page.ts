// The app's page for a signed-in athlete's navigation home (/ or /my-week): the built index.html with the
// first glance of the week in it, compressed per request and kept by no cache (it holds someone's data).
// Anything else (signed out, another role, a fetch that is not a page visit, any failure) goes to `plain`,
// the page exactly as the build wrote it: a visit never ends in an error because of the glance.
import { createHash } from 'node:crypto';
import { readFile, stat } from 'node:fs/promises';
import { dirname, join } from 'node:path';
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

/** A file of the build, read again when it changes (a new build under a running server). */
function fileReader(): (file: string) => Promise<string> {
  const kept = new Map<string, { mtimeMs: number; text: string }>();
  return async (file) => {
    const { mtimeMs } = await stat(file);
    let entry = kept.get(file);
    if (entry?.mtimeMs !== mtimeMs) kept.set(file, (entry = { mtimeMs, text: await readFile(file, 'utf8') }));
    return entry.text;
  };
}

/** The build's one stylesheet link, as Vite writes it into index.html. */
const STYLESHEET = /<link rel="stylesheet"(?: crossorigin)? href="\/assets\/([\w.-]+\.css)"\s*\/?>/g;
const STYLE_SRC = "style-src 'self'";

/**
 * The page with its stylesheet inside it, and the Content-Security-Policy that allows exactly that text (by
 * its SHA-256): the glance can be painted when the page arrives, without waiting for one more file on a slow
 * network. The page as it was when there is not exactly one stylesheet, the text could close its element,
 * or the policy has no style-src to extend.
 */
export async function inlineStylesheet(
  html: string,
  policy: string | undefined,
  readAsset: (name: string) => Promise<string>,
): Promise<{ html: string; policy: string | undefined }> {
  const links = [...html.matchAll(STYLESHEET)];
  if (links.length !== 1 || !policy?.includes(STYLE_SRC)) return { html, policy };
  const css = await readAsset(links[0]![1]!);
  if (/<\/style/i.test(css)) return { html, policy };
  const hash = createHash('sha256').update(css, 'utf8').digest('base64');
  return {
    html: html.replace(links[0]![0], () => `<style>${css}</style>`),
    policy: policy.replace(STYLE_SRC, `${STYLE_SRC} 'sha256-${hash}'`),
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
  const read = fileReader();
  const template = () => read(indexFile);
  const readAsset = (name: string) => read(join(dirname(indexFile), 'assets', name));
  return (req: Request, res: Response, next: NextFunction) => {
    // A browser says what a fetch is for: only its own page visits (never the service worker's copy of the
    // app's page, which is shared by whoever signs in next) get someone's week.
    const dest = req.get('Sec-Fetch-Dest');
    if (!HOME_PATHS.has(req.path) || (dest !== undefined && dest !== 'document')) return plain(req, res, next);
    void (async () => {
      await attachSession(ctx, req, res);
      if (req.auth?.role !== 'athlete') return null;
      const drawn = await firstGlancePage(ctx, req.auth, await template(), requestedWeek(req.path, req.query));
      if (drawn === null) return null;
      const { html, policy } = await inlineStylesheet(
        drawn,
        res.getHeader('Content-Security-Policy')?.toString(),
        readAsset,
      );
      return { ...(await encode(req, html)), policy };
    })().then(
      (page) => {
        if (!page) return plain(req, res, next);
        res.status(200);
        res.setHeader('Content-Type', 'text/html; charset=utf-8');
        res.setHeader('Cache-Control', 'no-store, private');
        res.setHeader('Vary', 'Accept-Encoding, Cookie');
        if (page.policy) res.setHeader('Content-Security-Policy', page.policy);
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
