// Import boundaries, checked on every test run (the linter checks the same): the client never
// imports the server, the server never imports the client, and shared/ imports only shared/ code and
// browser-safe packages — never a Node-only module.
import { describe, expect, it } from 'vitest';
import { builtinModules } from 'node:module';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '../..');
const SHARED_PACKAGES = new Set(['zod', 'seedrandom']);
const NODE_ONLY = new Set([...builtinModules, ...builtinModules.map((m) => `node:${m}`)]);

function files(dir: string): string[] {
  return readdirSync(join(ROOT, dir)).flatMap((name) => {
    const rel = join(dir, name);
    return statSync(join(ROOT, rel)).isDirectory() ? files(rel) : /\.(ts|tsx)$/.test(name) ? [rel] : [];
  });
}

const SPEC =
  /(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|^\s*import\s+['"]([^'"]+)['"]/gm;

export function importsOf(file: string): string[] {
  const text = readFileSync(join(ROOT, file), 'utf8');
  return [...text.matchAll(SPEC)].map((m) => m[1] ?? m[2] ?? m[3]!).filter(Boolean);
}

function topFolder(file: string, spec: string): string | null {
  if (!spec.startsWith('.')) return null;
  return relative(ROOT, resolve(join(ROOT, dirname(file)), spec)).split('/')[0] ?? null;
}

describe('import boundaries', () => {
  it('src/ never imports server/', () => {
    const bad = files('src').flatMap((f) =>
      importsOf(f)
        .filter((s) => topFolder(f, s) === 'server')
        .map((s) => `${f} → ${s}`),
    );
    expect(bad).toEqual([]);
  });

  it('server/ never imports src/', () => {
    const bad = files('server').flatMap((f) =>
      importsOf(f)
        .filter((s) => topFolder(f, s) === 'src')
        .map((s) => `${f} → ${s}`),
    );
    expect(bad).toEqual([]);
  });

  it('shared/ imports only shared/ and browser-safe packages, and no Node-only module', () => {
    const bad = files('shared').flatMap((f) =>
      importsOf(f)
        .filter((s) => {
          if (s.startsWith('.')) return topFolder(f, s) !== 'shared';
          if (NODE_ONLY.has(s)) return true;
          const pkg = s.startsWith('@') ? s.split('/').slice(0, 2).join('/') : s.split('/')[0]!;
          return !SHARED_PACKAGES.has(pkg);
        })
        .map((s) => `${f} → ${s}`),
    );
    expect(bad).toEqual([]);
  });

  it('the checker itself sees imports of each form', () => {
    // Guards against a regex that silently matches nothing.
    expect(importsOf('tests/lint/boundaries.test.ts')).toEqual(
      expect.arrayContaining(['vitest', 'node:module', 'node:fs']),
    );
    expect(files('shared').length).toBeGreaterThan(5);
  });
});
