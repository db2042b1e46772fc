// Doors between server modules, checked through the project's own ESLint configuration: a module reaches
// another only through its *.service.ts; repositories, routers and private files stay inside their module,
// and only server/modules/index.ts mounts routers.
import { describe, expect, it } from 'vitest';
import { ESLint } from 'eslint';
import { resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '../..');
const RULE = 'no-restricted-imports';

const eslint = new ESLint({ cwd: ROOT });

async function crossings(code: string, filePath: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: resolve(ROOT, filePath) });
  return result!.messages.filter((m) => m.ruleId === RULE).map((m) => m.message);
}

// ESLint loads the TypeScript parser and every plugin on first use, and the first test lints every server file:
// seconds on a busy machine.
describe('server module doors', { timeout: 120_000 }, () => {
  it('no module reaches into another today', async () => {
    const results = await eslint.lintFiles(['server/modules']);
    expect(results.length).toBeGreaterThan(50);
    const bad = results.flatMap((r) =>
      r.messages.filter((m) => m.ruleId === RULE).map((m) => `${r.filePath}:${m.line} ${m.message}`),
    );
    expect(bad).toEqual([]);
  }, 60_000);

  it("a planted import of another module's repository fails", async () => {
    const code = "import { findPlan } from '../fees/fees.repository';\nexport const x = findPlan;\n";
    expect(await crossings(code, 'server/modules/payments/x.ts')).toEqual([
      expect.stringContaining('only through its *.service.ts'),
    ]);
  });

  it("another module's router or private file fails too, however the path is spelled", async () => {
    const cases = [
      "import { page } from '../email/email.router';",
      "import { recordOf } from '../top-sets/records';",
      "import { findPlan } from '../../modules/fees/fees.repository';",
    ];
    for (const line of cases) {
      expect(await crossings(`${line}\nexport const x = 1;\n`, 'server/modules/payments/x.ts'), line).toHaveLength(1);
    }
  });

  it("another module's service passes, and so do the module's own files and shared server code", async () => {
    const code = [
      "import { feePlan } from '../fees/fees.service';",
      "import { recordsOf } from '../top-sets/history.service';",
      "import * as repo from './payments.repository';",
      "import { NotFoundError } from '../../lib/errors';",
      "import { containsPattern } from '../../db/patterns';",
      'export const x = [feePlan, recordsOf, repo, NotFoundError, containsPattern];',
      '',
    ].join('\n');
    expect(await crossings(code, 'server/modules/payments/x.ts')).toEqual([]);
  });

  it('only the module index mounts routers, and it mounts nothing else', async () => {
    const router = "import { feesRouter } from '../fees/fees.router';\nexport const x = feesRouter;\n";
    expect(await crossings(router, 'server/modules/payments/x.ts')).toHaveLength(1);
    const mounted = "import { feesRouter } from './fees/fees.router';\nexport const x = feesRouter;\n";
    expect(await crossings(mounted, 'server/modules/index.ts')).toEqual([]);
    const reached = "import { findPlan } from './fees/fees.repository';\nexport const x = findPlan;\n";
    expect(await crossings(reached, 'server/modules/index.ts')).toHaveLength(1);
  });

  it('the server still never imports client code', async () => {
    const code = "import { x } from '../../../src/lib/api-client';\nexport const y = x;\n";
    expect(await crossings(code, 'server/modules/payments/x.ts')).toHaveLength(1);
  });
});
