// Bounded fuzzing of every API route, read from the router itself (so routes added later are covered),
// as four kinds of caller. Inputs come from fast-check with a fixed seed: odd ids, junk strings, broken
// JSON, random objects, broken multipart. The report counts answers by status class; the bar is no 5xx.
import fc from 'fast-check';
import request from 'supertest';
import type { Express } from 'express';
import { listRoutes } from '../../server/lib/routes';

export type FuzzCaller = 'anonymous' | 'athlete' | 'coach' | 'headCoach';
export const FUZZ_CALLERS: FuzzCaller[] = ['anonymous', 'athlete', 'coach', 'headCoach'];

export interface FuzzOptions {
  app: Express;
  /** Signs in as that caller and returns the cookie header; called again when a route signed it out. */
  signIn: (caller: Exclude<FuzzCaller, 'anonymous'>) => Promise<string>;
  /** Requests per route and caller. */
  perRoute: number;
  seed: number;
  /** Ids worth trying in paths besides random ones (rows of the caller's team and of another team). */
  knownIds: number[];
  /** Sent as X-Forwarded-For (the app trusts one proxy), so sign-in counters stay apart from other callers. */
  address: string;
  /** Only routes whose "METHOD /path" matches (to chase one failure). */
  only?: RegExp;
}

export interface FuzzReport {
  routes: number;
  requests: number;
  classes: Record<'2xx' | '3xx' | '4xx' | '5xx' | 'no answer', number>;
  byCaller: Record<FuzzCaller, Record<string, number>>;
  /** Every 5xx or unanswered request, for the log. */
  failures: {
    caller: FuzzCaller;
    method: string;
    route: string;
    path: string;
    query: Record<string, string>;
    status: number | string;
  }[];
}

const junkText = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom("' OR 1=1 --", '%00', '../../etc/passwd', '<script>', 'NaN', '-1', '1e309', '😀', ' ', '0x10'),
  fc.string({ minLength: 300, maxLength: 600 }),
);

function pathValue(name: string, knownIds: number[]) {
  const ids = fc.oneof(
    fc.constantFrom(...knownIds, 0, 1, -1, 2 ** 31, 2 ** 53, 999_999_999),
    fc.integer({ min: 1, max: 5000 }),
  );
  const week = fc.oneof(
    fc.constantFrom('2026-W01', '2026-W53', '2027-W60', '2026-W1', 'W10'),
    fc.date({ noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)),
  );
  const byName = /week/i.test(name) ? week : ids;
  return fc.oneof({ weight: 4, arbitrary: byName.map(String) }, { weight: 1, arbitrary: junkText });
}

const queryArb = fc.dictionary(
  fc.constantFrom('limit', 'offset', 'sort', 'status', 'role', 'q', 'week', 'from', 'to', 'lift', 'token', 'risk'),
  fc.oneof(junkText, fc.integer({ min: -5, max: 100_000 }).map(String)),
  { maxKeys: 4 },
);

type Body = { kind: 'json'; value: unknown } | { kind: 'raw'; type: string; text: string } | { kind: 'none' };

const bodyArb: fc.Arbitrary<Body> = fc.oneof(
  { weight: 5, arbitrary: fc.anything({ maxDepth: 3 }).map((value) => ({ kind: 'json' as const, value })) },
  {
    weight: 3,
    arbitrary: fc
      .dictionary(
        fc.constantFrom('email', 'password', 'name', 'role', 'version', 'week', 'athleteId', 'token', 'body', 'id'),
        fc.oneof(junkText, fc.integer(), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 })),
        { maxKeys: 5 },
      )
      .map((value) => ({ kind: 'json' as const, value })),
  },
  {
    weight: 1,
    arbitrary: fc.constantFrom<Body>(
      { kind: 'raw', type: 'application/json', text: '{"a":' },
      { kind: 'raw', type: 'multipart/form-data', text: '--x\r\n\r\nabc' },
      {
        kind: 'raw',
        type: 'multipart/form-data; boundary=zz',
        text: '--zz\r\nContent-Disposition: form-data; name="file"; filename="a"\r\n\r\nab',
      },
      { kind: 'raw', type: 'text/plain', text: 'hello' },
      { kind: 'none' },
    ),
  },
);

function classOf(status: number): keyof FuzzReport['classes'] {
  if (status >= 500) return '5xx';
  if (status >= 400) return '4xx';
  if (status >= 300) return '3xx';
  return '2xx';
}

export async function fuzzRoutes(opts: FuzzOptions): Promise<FuzzReport> {
  const routes = listRoutes(opts.app.locals.apiRouter).filter(
    (r) => !opts.only || opts.only.test(`${r.method} ${r.path}`),
  );
  const report: FuzzReport = {
    routes: routes.length,
    requests: 0,
    classes: { '2xx': 0, '3xx': 0, '4xx': 0, '5xx': 0, 'no answer': 0 },
    byCaller: { anonymous: {}, athlete: {}, coach: {}, headCoach: {} },
    failures: [],
  };
  const cookies = new Map<FuzzCaller, string>();
  for (const c of FUZZ_CALLERS) if (c !== 'anonymous') cookies.set(c, await opts.signIn(c));

  let seed = opts.seed;
  for (const route of routes) {
    const names = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
    for (const caller of FUZZ_CALLERS) {
      const cases = fc.sample(
        fc.record({
          params: fc.tuple(...names.map((n) => pathValue(n, opts.knownIds))),
          query: queryArb,
          body: bodyArb,
        }),
        { seed: seed++, numRuns: opts.perRoute },
      );
      for (const c of cases) {
        let i = 0;
        const path = route.path.replace(/:(\w+)/g, () => encodeURIComponent(String(c.params[i++])));
        const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        let req = request(opts.app)[method](path).query(c.query).set('X-Forwarded-For', opts.address).timeout(15_000);
        const cookie = cookies.get(caller);
        if (cookie) req = req.set('Cookie', cookie);
        if (method !== 'get') {
          if (c.body.kind === 'json')
            req = req.set('Content-Type', 'application/json').send(JSON.stringify(c.body.value ?? null));
          else if (c.body.kind === 'raw') req = req.set('Content-Type', c.body.type).send(c.body.text);
        }
        let status: number | 'no answer';
        try {
          status = (await req).status;
        } catch (err) {
          const s = (err as { status?: number }).status;
          status = typeof s === 'number' ? s : 'no answer';
        }
        report.requests++;
        const cls = status === 'no answer' ? 'no answer' : classOf(status);
        report.classes[cls]++;
        report.byCaller[caller][cls] = (report.byCaller[caller][cls] ?? 0) + 1;
        if (cls === '5xx' || cls === 'no answer')
          report.failures.push({ caller, method: route.method, route: route.path, path, query: c.query, status });
      }
      // A route that ends sessions (sign out, sign out everywhere…) is followed by a fresh sign-in.
      if (caller !== 'anonymous' && route.path.startsWith('/api/auth/')) {
        const me = await request(opts.app).get('/api/auth/me').set('Cookie', cookies.get(caller)!);
        if (me.status !== 200) cookies.set(caller, await opts.signIn(caller));
      }
    }
  }
  return report;
}
