// Checks of the running topology (two app instances, a primary and a GTID replica), shared by the short
// test in `npm test` and the full run in `npm run soak`. Each check builds its own team on the primary,
// talks to the instances over HTTP as a browser would, and throws with a readable message when the
// topology misbehaves.
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { and, isNull, like, sql } from 'drizzle-orm';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import type { Database } from '../../server/db/client';
import { outbox } from '../../server/db/schema';
import { queueMail } from '../../server/services/mail/outbox.repository';
import { inboxClient } from '../../server/standins/smtp';
import { replicationStatus, rootSql, startCluster, type Cluster } from '../../scripts/cluster-lib.mjs';
import { TEST_PASSWORD } from './app';
import { createPlanLibrary, createTeam, createVariant } from './factories';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Session cache of the instances under test: how long a sign-out elsewhere may take to hold. */
export const TOPOLOGY_SESSION_CACHE_MS = 1_000;
/** Failed sign-ins for one account from one address before the hold. */
export const TOPOLOGY_FREE_FAILURES = 4;

/** The cluster as the checks want it: API only, own stand-ins, quick mail sender, short session cache. */
export function startTopology(ports: { name: string; dbPort: number; appPort: number; standinBase: number }) {
  return startCluster({
    name: ports.name,
    dbPort: ports.dbPort,
    appPorts: [ports.appPort, ports.appPort + 1],
    balancerPort: ports.appPort + 2,
    standins: 'own',
    standinBase: ports.standinBase,
    client: false,
    seedDemo: false,
    appEnv: {
      NODE_ENV: 'test',
      LOG_LEVEL: 'info',
      MAIL_SEND_INTERVAL_MS: '150',
      SESSION_CACHE_MS: String(TOPOLOGY_SESSION_CACHE_MS),
      LOGIN_LIMIT_PER_ACCOUNT: String(TOPOLOGY_FREE_FAILURES),
    },
  });
}

export interface Reply {
  status: number;
  body: unknown;
  cookie?: string;
}

/** One request as a browser on the balancer's origin would send it; `from` sets the client's address. */
export async function call(
  base: string,
  method: string,
  path: string,
  opts: { cookie?: string; body?: unknown; from?: string } = {},
): Promise<Reply> {
  const headers: Record<string, string> = { accept: 'application/json' };
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.body !== undefined) headers['content-type'] = 'application/json';
  if (opts.from) headers['x-forwarded-for'] = opts.from;
  const res = await fetch(`${base}${path}`, {
    method,
    headers,
    body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
  });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    /* not JSON */
  }
  const set = res.headers.getSetCookie()[0];
  return { status: res.status, body, cookie: set ? set.split(';')[0] : undefined };
}

function expectStatus(reply: Reply, status: number, what: string): void {
  if (reply.status !== status) {
    throw new Error(`${what}: expected ${status}, got ${reply.status} ${JSON.stringify(reply.body).slice(0, 300)}`);
  }
}

export async function signIn(base: string, email: string, from = '127.0.0.1'): Promise<string> {
  const reply = await call(base, 'POST', '/api/auth/login', { body: { email, password: TEST_PASSWORD }, from });
  expectStatus(reply, 200, `sign-in as ${email} on ${base}`);
  if (!reply.cookie) throw new Error(`sign-in on ${base} set no cookie`);
  return reply.cookie;
}

const [A, B] = [0, 1];

/** A coach's save through instance A is in the next read through instance B. */
export async function writeOnAReadOnB(cluster: Cluster, database: Database): Promise<{ checked: number }> {
  const team = await createTeam(database.db);
  const lib = await createPlanLibrary(database.db, team.teamId);
  const cookie = await signIn(cluster.apps[A]!.url, team.coach.email);
  const week = addWeeks(weekOfDate(new Date()), 1);
  let checked = 0;
  let version: number | undefined;
  for (const [i, variantId] of lib.squat.slice(0, 3).entries()) {
    // Each save names the version the previous one (through the other instance) answered with.
    const saved = await call(cluster.apps[i % 2]!.url, 'PUT', `/api/plans/${team.athleteId}/${week}/lower`, {
      cookie,
      body: { variantId, ...(version === undefined ? {} : { version }) },
    });
    if (saved.status !== 200 && saved.status !== 201) expectStatus(saved, 200, 'saving a board cell');
    version = (saved.body as { version: number }).version;
    const other = cluster.apps[(i + 1) % 2]!.url;
    const board = await call(other, 'GET', `/api/board?from=${week}&to=${week}`, { cookie });
    expectStatus(board, 200, 'reading the board on the other instance');
    const entry = (board.body as { entries: { athleteId: number; variantId: number | null }[] }).entries.find(
      (e) => e.athleteId === team.athleteId,
    );
    if (entry?.variantId !== variantId) {
      throw new Error(
        `the save through one instance was not in the next read through the other (saw ${entry?.variantId})`,
      );
    }
    checked++;
  }
  return { checked };
}

/** A session ended on A is refused on B once B's short session cache has passed. */
export async function signOutOnARefusedOnB(cluster: Cluster, database: Database, cacheMs: number) {
  const team = await createTeam(database.db);
  const [a, b] = [cluster.apps[A]!.url, cluster.apps[B]!.url];
  const cookie = await signIn(a, team.coach.email);
  expectStatus(await call(b, 'GET', '/api/auth/me', { cookie }), 200, 'the session on the other instance');
  expectStatus(await call(a, 'POST', '/api/auth/logout', { cookie }), 200, 'signing out');
  const ended = Date.now();
  expectStatus(await call(a, 'GET', '/api/auth/me', { cookie }), 401, 'the ended session where it ended');
  for (;;) {
    const reply = await call(b, 'GET', '/api/auth/me', { cookie });
    if (reply.status === 401) break;
    if (Date.now() - ended > cacheMs + 1_500) {
      throw new Error(
        `a session ended on A was still accepted on B ${Date.now() - ended} ms later (cache ${cacheMs} ms)`,
      );
    }
    await sleep(100);
  }
  return { refusedAfterMs: Date.now() - ended };
}

/** Failed sign-ins alternate between the instances; the hold comes after the shared count, not per instance. */
export async function rateLimitAcrossInstances(cluster: Cluster, database: Database, freeFailures: number) {
  const team = await createTeam(database.db);
  const from = `10.77.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
  for (let i = 0; i < freeFailures; i++) {
    const reply = await call(cluster.apps[i % 2]!.url, 'POST', '/api/auth/login', {
      body: { email: team.coach.email, password: 'not-the-password' },
      from,
    });
    expectStatus(reply, 401, `failed sign-in ${i + 1}`);
  }
  // Each instance alone has seen about half the failures; together they have used up the free ones.
  const next = await call(cluster.apps[freeFailures % 2]!.url, 'POST', '/api/auth/login', {
    body: { email: team.coach.email, password: TEST_PASSWORD },
    from,
  });
  expectStatus(next, 429, 'the sign-in after the free failures, on the instance that saw fewer of them');
  return { heldAfter: freeFailures };
}

/** How many messages each instance's sender reports having sent, from its log. */
function sentPerInstance(cluster: Cluster): number[] {
  return cluster.apps.map((app) =>
    readFileSync(app.logFile, 'utf8')
      .split('\n')
      .filter((l) => l.includes('"outbox pass"'))
      .reduce((sum, l) => sum + Number((JSON.parse(l) as { sent?: number }).sent ?? 0), 0),
  );
}

/** `count` queued messages, both instances' senders running: every one arrives exactly once. */
export async function outboxExactlyOnce(cluster: Cluster, database: Database, count: number, timeoutMs = 60_000) {
  const tag = randomUUID().slice(0, 8);
  const to = `outbox-${tag}@example.test`;
  const before = sentPerInstance(cluster);
  const now = new Date();
  for (let i = 0; i < count; i++) {
    await queueMail(
      database.db,
      {
        kind: 'weekly_plan',
        dedupeKey: `topology-${tag}-${i}`,
        to,
        subject: `Topology ${tag} #${i}`,
        text: `message ${i}`,
        html: `<p>message ${i}</p>`,
      },
      now,
    );
  }
  const mine = and(like(outbox.dedupeKey, `topology-${tag}-%`), isNull(outbox.sentAt));
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const [row] = await database.db
      .select({ n: sql<number>`count(*)` })
      .from(outbox)
      .where(mine);
    if (Number(row?.n) === 0) break;
    if (Date.now() > deadline)
      throw new Error(`${row?.n} of ${count} messages were still unsent after ${timeoutMs} ms`);
    await sleep(200);
  }
  const inbox = inboxClient(cluster.serviceEnv.MAIL_INBOX_URL);
  const received = await inbox.list({ to });
  const seen = new Map<string, number>();
  for (const m of received) seen.set(m.subject, (seen.get(m.subject) ?? 0) + 1);
  const twice = [...seen].filter(([, n]) => n > 1).map(([s]) => s);
  const missing = Array.from({ length: count }, (_, i) => `Topology ${tag} #${i}`).filter((s) => !seen.has(s));
  if (twice.length || missing.length || received.length !== count) {
    throw new Error(
      `outbox: ${received.length} received for ${count} queued; sent twice: ${twice.slice(0, 5).join(', ') || 'none'}; ` +
        `missing: ${missing.slice(0, 5).join(', ') || 'none'}`,
    );
  }
  // Each sender logs its pass just after marking the last row sent: give the lines a moment to land.
  let perInstance = sentPerInstance(cluster).map((n, i) => n - before[i]!);
  for (let i = 0; i < 50 && perInstance.reduce((a, b) => a + b, 0) < count; i++) {
    await sleep(100);
    perInstance = sentPerInstance(cluster).map((n, j) => n - before[j]!);
  }
  return { queued: count, delivered: received.length, sentPerInstance: perInstance };
}

async function healthOf(url: string): Promise<{ ok: boolean; replica: string }> {
  return (await call(url, 'GET', '/api/health')).body as { ok: boolean; replica: string };
}

async function waitForReplicaState(cluster: Cluster, state: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const states = await Promise.all(cluster.apps.map(async (a) => (await healthOf(a.url)).replica));
    if (states.every((s) => s === state)) return;
    if (Date.now() > deadline) throw new Error(`the instances did not see the replica ${state}: ${states.join(', ')}`);
    await sleep(200);
  }
}

/** With the replica's server stopped, reads meant for it are answered from the primary; then it returns. */
export async function replicaStoppedFallsBack(cluster: Cluster, database: Database) {
  const team = await createTeam(database.db);
  const name = `Fallback ${randomUUID().slice(0, 6)}`;
  await createVariant(database.db, team.teamId, { name });
  const cookie = await signIn(cluster.apps[A]!.url, team.coach.email);
  const libraryHas = async (url: string) => {
    const reply = await call(url, 'GET', '/api/variants?limit=100', { cookie });
    expectStatus(reply, 200, `the library list on ${url}`);
    return (reply.body as { items: { name: string }[] }).items.some((v) => v.name === name);
  };
  await sleep(300);
  await cluster.stopReplica();
  const started = Date.now();
  let answered = 0;
  try {
    for (let round = 0; round < 3; round++) {
      for (const app of cluster.apps) {
        if (!(await libraryHas(app.url))) throw new Error('a library read after the replica stopped missed a variant');
        answered++;
      }
    }
    await waitForReplicaState(cluster, 'down', 5_000);
    const board = await call(cluster.apps[B]!.url, 'GET', '/api/board?from=2026-W01&to=2026-W02', { cookie });
    expectStatus(board, 200, 'a past board span with the replica stopped');
  } finally {
    await cluster.startReplica();
  }
  const downMs = Date.now() - started;
  await waitForReplicaState(cluster, 'up', 20_000);
  if (!(await libraryHas(cluster.apps[A]!.url)))
    throw new Error('the library read after the replica came back missed a variant');
  return { readsWhileDown: answered, replicaDownMs: downMs };
}

/**
 * The replica applies nothing (its SQL thread stopped): a coach's save is still in their next read of
 * the board, while the library list (which may lag) shows the replica is really behind.
 */
export async function saveVisibleWhileReplicaLags(cluster: Cluster, database: Database) {
  const team = await createTeam(database.db);
  const lib = await createPlanLibrary(database.db, team.teamId);
  const cookie = await signIn(cluster.apps[A]!.url, team.coach.email);
  const week = addWeeks(weekOfDate(new Date()), 2);
  rootSql(cluster.replica, 'STOP SLAVE SQL_THREAD');
  try {
    const lagging = `Lagging ${randomUUID().slice(0, 6)}`;
    await createVariant(database.db, team.teamId, { name: lagging });
    const saved = await call(cluster.apps[A]!.url, 'PUT', `/api/plans/${team.athleteId}/${week}/lower`, {
      cookie,
      body: { variantId: lib.squat[0] },
    });
    if (saved.status !== 201 && saved.status !== 200) expectStatus(saved, 201, 'saving a board cell');
    for (const app of cluster.apps) {
      const board = await call(app.url, 'GET', `/api/board?from=${week}&to=${week}`, { cookie });
      expectStatus(board, 200, 'the board after the save');
      const entries = (board.body as { entries: { athleteId: number; variantId: number | null }[] }).entries;
      if (!entries.some((e) => e.athleteId === team.athleteId && e.variantId === lib.squat[0])) {
        throw new Error(`the coach's save was missing from their next board read on instance ${app.label}`);
      }
      const list = await call(app.url, 'GET', '/api/variants?limit=100', { cookie });
      if ((list.body as { items: { name: string }[] }).items.some((v) => v.name === lagging)) {
        throw new Error('the library list saw a row the stopped replica cannot have: it did not read the replica');
      }
    }
  } finally {
    rootSql(cluster.replica, 'START SLAVE SQL_THREAD');
  }
  const status = replicationStatus(cluster.replica);
  if (!status.sql) throw new Error(`the replica's SQL thread did not start again: ${status.lastError}`);
  return { saveSeenOn: cluster.apps.length };
}
