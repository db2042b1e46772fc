// The engine runs in the browser as well as on the server: no Node-only modules or globals, no
// imports from outside shared/ but the seeded generator, and a small share of a client bundle.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';

const DIR = join(__dirname, '../../../shared/engine');
// The rotation engine's own modules, its rule registry included (the connective-tissue module has its own tests).
const files = readdirSync(DIR, { recursive: true, encoding: 'utf8' }).filter(
  (f) => f.endsWith('.ts') && !f.endsWith('.d.ts') && !f.startsWith('tissue'),
);

describe('engine portability', () => {
  it('imports only its own modules and seedrandom', () => {
    for (const f of files) {
      const src = readFileSync(join(DIR, f), 'utf8');
      const specs = [...src.matchAll(/(?:import|export)[^'"]*from\s*'([^']+)'/g)].map((m) => m[1]!);
      // Rule modules reach the engine's core one folder up, never further.
      const ok = (s: string) =>
        s.startsWith('./') || s.startsWith('seedrandom') || (f.includes('/') && /^\.\.\/[a-z-]+$/.test(s));
      for (const s of specs) expect(ok(s), `${f}: ${s}`).toBe(true);
      expect(src, f).not.toMatch(/\b(process|Buffer|require|__dirname|globalThis\.crypto)\b/);
    }
  });

  // 15 KB for version 1; version 2 adds the rule registry, the soft goals, input checks and spelled-out
  // property names (a minifier keeps those), so its budget is 17 KB.
  it('adds at most 17 KB gzip to a client bundle', async () => {
    const out = await build({
      entryPoints: [join(DIR, 'index.ts')],
      bundle: true,
      minify: true,
      format: 'esm',
      write: false,
    });
    const size = gzipSync(out.outputFiles[0]!.contents).length;
    expect(size).toBeLessThanOrEqual(17 * 1024);
  });
});
