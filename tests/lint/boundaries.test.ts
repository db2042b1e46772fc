// Import boundaries, checked on every test run (the linter checks the same): the client never
// imports the server, the server never imports the client, shared/ imports only shared/ code and
// browser-safe packages — never a Node-only module — and a client feature imports only
// src/components/ui, src/lib, shared/, packages and its own folder.
import { ESLint } from 'eslint';
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

  it('a client feature imports only components/ui, lib, shared/, packages and itself', () => {
    const FEATURE_DOORS = ['src/components/ui/', 'src/lib/', 'shared/'];
    const bad = files('src/features').flatMap((f) => {
      const own = `src/features/${f.split('/')[2]}/`;
      return importsOf(f)
        .filter((s) => s.startsWith('.'))
        .filter((s) => {
          const to = `${relative(ROOT, resolve(join(ROOT, dirname(f)), s))}/`;
          return ![own, ...FEATURE_DOORS].some((door) => to.startsWith(door));
        })
        .map((s) => `${f} → ${s}`);
    });
    expect(bad).toEqual([]);
    expect(files('src/features').length).toBeGreaterThan(50);
  });

  it('src/lib and src/components never import a feature or the app', () => {
    const bad = [...files('src/lib'), ...files('src/components')].flatMap((f) =>
      importsOf(f)
        .filter((s) => s.startsWith('.'))
        .filter((s) => /^src\/(features|app)\//.test(`${relative(ROOT, resolve(join(ROOT, dirname(f)), s))}/`))
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

// ESLint loads the TypeScript parser and every plugin on first use: seconds on a busy machine.
describe('the linter guards the doors of client features', { timeout: 60_000 }, () => {
  const eslint = new ESLint({ cwd: ROOT });
  const messagesOf = async (code: string, filePath: string) => {
    const [result] = await eslint.lintText(code, { filePath: join(ROOT, filePath) });
    return result!.messages.filter((m) => m.ruleId === 'rackturn/feature-doors');
  };

  it('reports a feature importing another feature', async () => {
    const found = await messagesOf(
      "import { athleteListOptions } from '../../roster/api/queries';\nexport const x = athleteListOptions;\n",
      'src/features/library/api/x.ts',
    );
    expect(found).toHaveLength(1);
    expect(found[0]!.severity).toBe(2);
    expect(found[0]!.message).toContain('src/features/roster/api/queries');
  });

  it('reports a feature reaching into src/app, and a re-export or dynamic import across', async () => {
    const found = await messagesOf(
      [
        "import { guards } from '../../../app/guards';",
        "export { meetKeys } from '../../meets/api/queries';",
        "export const later = () => import('../../history/components/lift-charts');",
        'export const y = guards;',
        '',
      ].join('\n'),
      'src/features/library/components/x.ts',
    );
    expect(found.map((m) => m.line)).toEqual([1, 2, 3]);
  });

  it('lets a feature import its own files, components/ui, lib, shared/ and packages', async () => {
    const found = await messagesOf(
      [
        "import { useQuery } from '@tanstack/react-query';",
        "import { Button } from '../../../components/ui/button';",
        "import { athleteKeys } from '../../../lib/query-keys';",
        "import { LIFT_LABEL } from '../../../../shared/labels';",
        "import { variantKeys } from '../api/queries';",
        'export const all = [useQuery, Button, athleteKeys, LIFT_LABEL, variantKeys];',
        '',
      ].join('\n'),
      'src/features/library/components/x.ts',
    );
    expect(found).toEqual([]);
  });

  it('reports src/lib or components/ui reaching up into a feature or the app', async () => {
    const fromLib = await messagesOf(
      "import { myWeekKeys } from '../features/my-week/api/queries';\nexport const x = myWeekKeys;\n",
      'src/lib/x.ts',
    );
    const fromUi = await messagesOf(
      "import { guards } from '../../app/guards';\nexport const y = guards;\n",
      'src/components/ui/x.tsx',
    );
    expect(fromLib.map((m) => m.message)).toEqual([expect.stringContaining('src/features/my-week/api/queries')]);
    expect(fromUi).toHaveLength(1);
    const allowed = await messagesOf(
      "import { api } from './api-client';\nimport { Button } from '../components/ui/button';\nexport const z = [api, Button];\n",
      'src/lib/x.ts',
    );
    expect(allowed).toEqual([]);
  });

  it('lets src/app compose features', async () => {
    const found = await messagesOf(
      "import { athleteListOptions } from '../../features/roster/api/queries';\nexport const x = athleteListOptions;\n",
      'src/app/routes/x.tsx',
    );
    expect(found).toEqual([]);
  });
});
