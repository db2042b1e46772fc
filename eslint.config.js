// Lint rules, including the import boundaries: the client never imports the server, the server never
// imports the client, and shared/ stays pure (no imports outside shared/, no Node-only modules).
import js from '@eslint/js';
import { defineConfig } from 'eslint/config';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { builtinModules } from 'node:module';
import { dirname, relative, resolve, sep } from 'node:path';

const nodeOnly = [...builtinModules, ...builtinModules.map((m) => `node:${m}`)];

// The door of a client feature: a file in src/features/<x>/ imports only src/components/ui, src/lib,
// shared/, packages and src/features/<x>/ itself. Composing features is the job of src/app/; components/ and
// lib/ never import a feature or the app.
export function featureDoorViolation(cwd, filename, spec) {
  if (!spec.startsWith('.')) return null;
  const from = relative(cwd, filename).split(sep).join('/');
  const to = relative(cwd, resolve(dirname(filename), spec))
    .split(sep)
    .join('/');
  // The shared client pieces sit below every feature: they never reach up into a feature or the app.
  if (/^src\/(components|lib)\//.test(from)) return /^src\/(features|app)\//.test(`${to}/`) ? to : null;
  const own = /^src\/features\/([^/]+)\//.exec(from);
  if (!own) return null;
  const allowed = [`src/features/${own[1]}/`, 'src/components/ui/', 'src/lib/', 'shared/'];
  return allowed.some((dir) => `${to}/`.startsWith(dir)) ? null : to;
}

const featureDoors = {
  meta: {
    type: 'problem',
    schema: [],
    messages: {
      crossing:
        'A feature imports only src/components/ui, src/lib, shared/ and its own folder ({{target}} is outside). ' +
        'Share query keys through src/lib/query-keys.ts, widgets through src/components/ui, or compose in src/app/.',
    },
  },
  create(context) {
    const check = (node) => {
      if (!node.source || typeof node.source.value !== 'string') return;
      const target = featureDoorViolation(context.cwd, context.filename, node.source.value);
      if (target) context.report({ node: node.source, messageId: 'crossing', data: { target } });
    };
    return {
      ImportDeclaration: check,
      ExportNamedDeclaration: check,
      ExportAllDeclaration: check,
      ImportExpression: check,
    };
  },
};

export default defineConfig(
  { ignores: ['dist/**', '.data/**', '.tmp/**', 'node_modules/**', 'drizzle/**', 'coverage/**'] },
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' },
      ],
      '@typescript-eslint/no-empty-object-type': 'off',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks, rackturn: { rules: { 'feature-doors': featureDoors } } },
    languageOptions: { globals: globals.browser },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'rackturn/feature-doors': 'error',
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/server/**', '**/server'], message: 'The client never imports server code.' }] },
      ],
    },
  },
  {
    files: ['server/**/*.ts', 'scripts/**/*.{js,mjs,ts}', 'tests/**/*.{ts,tsx}', '*.{js,ts}'],
    languageOptions: { globals: globals.node },
  },
  {
    files: ['server/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/src/**', '**/src'], message: 'The server never imports client code.' }] },
      ],
    },
  },
  {
    files: ['shared/**/*.ts'],
    languageOptions: { globals: {} },
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: nodeOnly.map((name) => ({ name, message: 'shared/ runs in the browser too: no Node-only modules.' })),
          patterns: [
            {
              group: ['**/server/**', '**/src/**', '../../*', '../../**'],
              message: 'shared/ imports only from shared/.',
            },
          ],
        },
      ],
    },
  },
  // Doors between server modules: a module offers the rest of the server only its services (*.service.ts).
  // Another module's repository (its SQL), router and private files (scoping, DTO mapping, CSV, caches…)
  // stay inside it; routers are mounted from server/modules/index.ts alone. This block repeats the
  // server's src/ rule because a later no-restricted-imports replaces an earlier one.
  {
    files: ['server/modules/*/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/src/**', '**/src'], message: 'The server never imports client code.' },
            {
              regex: '^\\.\\./(?!\\.\\./)[^/]+/(?![^/]+\\.service$)',
              message:
                'Another module is reached only through its *.service.ts (not its repository, router or private files).',
            },
            {
              regex: '(^|/)modules/[^/]+/(?![^/]+\\.service$)',
              message:
                'Another module is reached only through its *.service.ts (not its repository, router or private files).',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/modules/index.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/src/**', '**/src'], message: 'The server never imports client code.' },
            { regex: '^\\./[^/]+/(?![^/]+\\.router$)', message: 'The module index mounts routers only.' },
          ],
        },
      ],
    },
  },
);
