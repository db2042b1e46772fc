// The built client as the app serves it: the precompressed copy the browser accepts (brotli before gzip),
// hashed assets cached for good, and the page itself revalidated every time so a new build shows at once.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/lib/logger';
import { SessionKeys } from '../../server/lib/session';
import { createServices, stopServices } from '../../server/services';
import { createDatabase } from '../../server/db/client';
import { testEnv } from '../support/app';

const dist = mkdtempSync(join(tmpdir(), 'rackturn-dist-'));
const page = '<!doctype html><html><head><title>Rackturn</title></head><body><div id="root"></div></body></html>';
const script = `export const week = ${JSON.stringify('x'.repeat(2000))};\n`;
mkdirSync(join(dist, 'assets'));
for (const [file, text] of [
  ['index.html', page],
  ['assets/index-Ab12Cd34.js', script],
] as const) {
  writeFileSync(join(dist, file), text);
  writeFileSync(join(dist, `${file}.br`), brotliCompressSync(text));
  writeFileSync(join(dist, `${file}.gz`), gzipSync(text));
}

const env = testEnv({ CLIENT_DIST: dist });
const database = createDatabase(env.DATABASE_URL, { connectionLimit: 1 });
const logger = createLogger('silent');
const services = createServices(env, logger);
const app = createApp({ env, database, logger, sessions: new SessionKeys(env.SESSION_SECRET), services });
afterAll(async () => {
  await stopServices(services);
  await database.close();
  rmSync(dist, { recursive: true, force: true });
});

/** The body as the browser sees it after decoding (supertest decodes br and gzip by the header). */
const raw = (res: request.Response) => res.body as Buffer;
const binary = (req: request.Test) =>
  req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

describe('static files', () => {
  it('sends the brotli copy of an asset when the browser takes brotli, cached immutably by its hash', async () => {
    const res = await binary(request(app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'gzip, deflate, br'));
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(raw(res).toString()).toBe(script);
  });

  it('falls back to gzip, and to the plain file for a client that takes neither', async () => {
    const gz = await binary(request(app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'gzip'));
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(raw(gz).toString()).toBe(script);
    const plain = await binary(request(app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'identity'));
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(raw(plain).toString()).toBe(script);
  });

  it('answers a missing asset 404 instead of the page', async () => {
    const res = await request(app).get('/assets/index-gone.js').set('Accept-Encoding', 'br');
    expect(res.status).toBe(404);
  });

  it('serves the page for any app path, compressed and revalidated on every visit', async () => {
    for (const path of ['/', '/my-week', '/board?from=2026-W01']) {
      const res = await binary(request(app).get(path).set('Accept-Encoding', 'br, gzip'));
      expect(res.status, path).toBe(200);
      expect(res.headers['content-encoding']).toBe('br');
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(raw(res).toString()).toBe(page);
    }
  });

  it('leaves the API alone: JSON errors, never the page', async () => {
    const res = await request(app).get('/api/no-such-route').set('Accept-Encoding', 'br');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBeDefined();
  });
});
