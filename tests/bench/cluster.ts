// `npm run bench:cluster`: a mixed load through the topology `npm run cluster` starts — athletes opening
// My week and logging bodyweights, coaches reading the board (this block and weeks that are over) and the
// library and saving board cells, a coach running the plan for next week — with autocannon, for one
// instance and for two behind HAProxy, with the replica on and off. Prints one JSON object: throughput,
// p50/p99 per kind of request, and each set-up's throughput as a ratio of the one-instance, no-replica
// baseline measured in the same run. Stops by itself.
import { availableParallelism, loadavg } from 'node:os';
import autocannon, { type Request } from 'autocannon';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { startCluster, type Cluster } from '../../scripts/cluster-lib.mjs';
import { call } from '../support/topology';

const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
const SECONDS = num('BENCH_CLUSTER_SECONDS', 12);
const APP_PORT = num('BENCH_CLUSTER_APP_PORT', 3211);
const DEMO_PASSWORD = 'rackturn-demo';
const ATHLETES = ['athlete@rackturn.test', 'dario@rackturn.test', 'keisha@rackturn.test'];
const COACHES = ['coach@rackturn.test', 'coach2@rackturn.test'];

const limit = setTimeout(() => {
  process.stderr.write('bench:cluster: over its 15 min limit, stopping\n');
  process.exit(2);
}, 15 * 60_000);
limit.unref();

async function signIn(base: string, email: string): Promise<string> {
  const reply = await call(base, 'POST', '/api/auth/login', { body: { email, password: DEMO_PASSWORD } });
  if (reply.status !== 200 || !reply.cookie) throw new Error(`sign-in as ${email}: ${reply.status}`);
  return reply.cookie;
}

interface Cell {
  athleteId: number;
  week: string;
  slotId: string;
  variantId: number;
  version: number;
}

interface Fixture {
  athletes: string[];
  coaches: string[];
  cells: Cell[];
  week: string;
  /** The latest version of each cell the savers have seen. */
  versions: Map<string, number>;
}

/** Cookies of the demo people and the board cells a coach will save, read through `base`. */
async function fixture(base: string): Promise<Fixture> {
  const athletes = await Promise.all(ATHLETES.map((e) => signIn(base, e)));
  const coaches = await Promise.all(COACHES.map((e) => signIn(base, e)));
  const week = weekOfDate(new Date());
  // A plan for next week, so the board has cells to save.
  const run = await call(base, 'POST', '/api/plans/generate', {
    cookie: coaches[0],
    body: { weeks: 'next', reshuffle: false },
  });
  if (run.status !== 200) throw new Error(`plans/generate: ${run.status} ${JSON.stringify(run.body).slice(0, 200)}`);
  const next = addWeeks(week, 1);
  const board = await call(base, 'GET', `/api/board?from=${next}&to=${next}`, { cookie: coaches[0] });
  const entries = (board.body as { entries: (Cell & { variantId: number | null })[] }).entries;
  const cells = entries.filter((e): e is Cell => e.variantId !== null);
  if (cells.length === 0) throw new Error('the plan run left no board cells to save');
  return { athletes, coaches, cells, week, versions: new Map() };
}

const pick = <T>(xs: readonly T[]): T => xs[Math.floor(Math.random() * xs.length)]!;

interface Kind {
  name: string;
  connections: number;
  requests: Request[];
}

/** The mix: connections per kind of user, each connection repeating its kind's requests. */
function mix(f: Fixture): Kind[] {
  const today = new Date().toISOString().slice(0, 10);
  const key = (c: Cell) => `${c.athleteId}/${c.week}/${c.slotId}`;
  return [
    {
      name: 'athlete opens My week',
      connections: 6,
      requests: [
        {
          method: 'GET',
          path: '/api/my-week',
          setupRequest: (r) => ({ ...r, headers: { ...r.headers, cookie: pick(f.athletes) } }),
        },
      ],
    },
    {
      name: 'athlete logs a bodyweight',
      connections: 2,
      requests: [
        {
          method: 'PUT',
          path: `/api/bodyweights/${today}`,
          headers: { 'content-type': 'application/json' },
          setupRequest: (r) => ({
            ...r,
            headers: { ...r.headers, cookie: pick(f.athletes) },
            body: JSON.stringify({ unit: 'kg', weight: 60 + Math.round(Math.random() * 400) / 10 }),
          }),
        },
      ],
    },
    {
      name: 'coach reads the board and library',
      connections: 4,
      requests: [
        { method: 'GET', path: `/api/board?from=${f.week}&to=${addWeeks(f.week, 3)}` },
        { method: 'GET', path: `/api/board?from=${addWeeks(f.week, -8)}&to=${addWeeks(f.week, -1)}` },
        { method: 'GET', path: '/api/variants?limit=50' },
      ].map((r) => ({
        ...r,
        method: 'GET' as const,
        setupRequest: (req: Request) => ({ ...req, headers: { ...req.headers, cookie: pick(f.coaches) } }),
      })),
    },
    {
      name: 'coach saves a board cell',
      connections: 2,
      requests: [
        {
          method: 'PUT',
          headers: { 'content-type': 'application/json' },
          setupRequest: (r, context) => {
            const cell = pick(f.cells);
            (context as { cell?: Cell }).cell = cell;
            return {
              ...r,
              path: `/api/plans/${cell.athleteId}/${cell.week}/${cell.slotId}`,
              headers: { ...r.headers, cookie: f.coaches[0]! },
              body: JSON.stringify({ variantId: cell.variantId, version: f.versions.get(key(cell)) ?? cell.version }),
            };
          },
          // The saving coaches learn the version each answer names (a 409 names the current one), as the
          // board does in the browser; two of them on the same cells still meet a conflict now and then.
          onResponse: (status, body, context) => {
            const cell = (context as { cell?: Cell }).cell;
            if (!cell) return;
            try {
              const parsed = JSON.parse(body) as { version?: number; error?: { current?: { version?: number } } };
              const v = status < 300 ? parsed.version : parsed.error?.current?.version;
              if (typeof v === 'number') f.versions.set(key(cell), v);
            } catch {
              /* not JSON: nothing learnt */
            }
          },
        },
      ],
    },
    {
      name: 'coach runs the plan',
      connections: 1,
      requests: [
        {
          method: 'POST',
          path: '/api/plans/generate',
          headers: { 'content-type': 'application/json', cookie: f.coaches[0]! },
          // Weeks apart from the cells the saving coaches edit, as a head coach planning ahead would.
          body: JSON.stringify({ weeks: { from: addWeeks(f.week, 2), to: addWeeks(f.week, 3) }, reshuffle: true }),
        },
      ],
    },
  ];
}

interface KindResult {
  rps: number;
  p50Ms: number;
  p99Ms: number;
  non2xx: number;
  errors: number;
}

async function drive(base: string, f: Fixture): Promise<{ rps: number; kinds: Record<string, KindResult> }> {
  const kinds = mix(f);
  const results = await Promise.all(
    kinds.map((k) =>
      autocannon({ url: base, connections: k.connections, duration: SECONDS, requests: k.requests, timeout: 30 }),
    ),
  );
  const out: Record<string, KindResult> = {};
  let rps = 0;
  kinds.forEach((k, i) => {
    const r = results[i]!;
    rps += r.requests.total / SECONDS;
    out[k.name] = {
      rps: Math.round((r.requests.total / SECONDS) * 10) / 10,
      p50Ms: r.latency.p50,
      p99Ms: r.latency.p99,
      non2xx: r.non2xx,
      errors: r.errors + r.timeouts,
    };
  });
  return { rps: Math.round(rps * 10) / 10, kinds: out };
}

async function withCluster<T>(replica: boolean, body: (c: Cluster) => Promise<T>): Promise<T> {
  const cluster = await startCluster({
    name: 'bench-cluster',
    dbPort: num('BENCH_CLUSTER_DB_PORT', 3209),
    appPorts: [APP_PORT, APP_PORT + 1],
    balancerPort: num('BENCH_CLUSTER_PORT', APP_PORT + 2),
    standinBase: num('BENCH_CLUSTER_STANDIN_PORT_BASE', 4630),
    client: false,
    replica,
    appEnv: { LOG_LEVEL: 'warn', MAIL_SEND_INTERVAL_MS: '0', LOGIN_LIMIT_PER_IP: '100000' },
  });
  try {
    return await body(cluster);
  } finally {
    await cluster.stop();
  }
}

const runs: Record<string, Awaited<ReturnType<typeof drive>> & { target: string }> = {};
const started = Date.now();
for (const replica of [false, true]) {
  await withCluster(replica, async (cluster) => {
    const f = await fixture(cluster.balancerUrl);
    // A short warm-up of both instances (module loading, pools, kept answers), then the measured runs.
    await drive(cluster.balancerUrl, f);
    const tag = replica ? 'replica on' : 'replica off';
    runs[`one instance, ${tag}`] = { target: 'instance a directly', ...(await drive(cluster.apps[0]!.url, f)) };
    runs[`two instances, ${tag}`] = { target: 'HAProxy round-robin', ...(await drive(cluster.balancerUrl, f)) };
  });
}
const baseline = runs['one instance, replica off']!.rps;
const ratios = Object.fromEntries(
  Object.entries(runs).map(([k, v]) => [k, Math.round((v.rps / baseline) * 100) / 100]),
);
console.log(
  JSON.stringify(
    {
      machine: {
        cores: availableParallelism(),
        loadAverage1m: Math.round(loadavg()[0]! * 100) / 100,
        note: 'the instances, MariaDB primary and replica, HAProxy and the load generator all share these cores',
        node: process.version,
      },
      secondsPerRun: SECONDS,
      throughputRatioToOneInstanceNoReplica: ratios,
      runs,
      seconds: Math.round((Date.now() - started) / 1000),
    },
    null,
    2,
  ),
);
process.exit(0);
