// API benchmark: GET /api/my-week (demo athlete) and GET /api/board (40 athletes × 13 weeks) side by side
// with bare Express + mysql2 endpoints answering the same rows, under autocannon; and the plan run for the
// demo club's next week (12 athletes). Also counts the database round trips of one my-week answer.
import autocannon from 'autocannon';
import mysql from 'mysql2/promise';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { EMAIL as BOARD_COACH, PASSWORD as BOARD_PASSWORD } from './board';
import { signIn, type SpeedStack } from './speed-stack';

const DEMO_PASSWORD = 'rackturn-demo';
const SECONDS = Number(process.env.BENCH_API_SECONDS ?? 6);

interface Load {
  rps: number;
  /** CPU time of the serving process per answer (app and baseline run one at a time). */
  cpuMsPerRequest: number;
  p50Ms: number;
  p99Ms: number;
  errors: number;
  non2xx: number;
}

let cpuUrl = '';
const cpuMs = async () => ((await (await fetch(cpuUrl)).json()) as { ms: number }).ms;

async function load(url: string, connections: number, headers: Record<string, string>, duration = SECONDS) {
  const cpu0 = await cpuMs();
  const r = await autocannon({ url, connections, duration, headers });
  const cpu = (await cpuMs()) - cpu0;
  const out: Load = {
    rps: Math.round(r.requests.average),
    cpuMsPerRequest: Math.round((cpu / Math.max(1, r.requests.total)) * 100) / 100,
    p50Ms: r.latency.p50,
    p99Ms: r.latency.p99,
    errors: r.errors + r.timeouts,
    non2xx: r.non2xx,
  };
  return out;
}

const ratio = (a: number, b: number) => Math.round((a / b) * 1000) / 1000;

/** Throughput at 20 connections and p99 at 50, app and baseline alternating so both see the same machine. */
async function sideBySide(app: { url: string; headers: Record<string, string> }, bare: { url: string }) {
  await load(app.url, 10, app.headers, 2);
  await load(bare.url, 10, {}, 2);
  const app20 = await load(app.url, 20, app.headers);
  const bare20 = await load(bare.url, 20, {});
  const app50 = await load(app.url, 50, app.headers);
  const bare50 = await load(bare.url, 50, {});
  return {
    app: { at20: app20, at50: app50 },
    bare: { at20: bare20, at50: bare50 },
    throughputRatio: ratio(app20.rps, bare20.rps),
    throughputRatioAt50: ratio(app50.rps, bare50.rps),
    p99RatioAt50: ratio(app50.p99Ms, bare50.p99Ms),
    /** Bare CPU per answer ÷ the app's: the throughput ratio the app would reach where Node is the limit. */
    cpuRatio: ratio(bare20.cpuMsPerRequest + bare50.cpuMsPerRequest, app20.cpuMsPerRequest + app50.cpuMsPerRequest),
  };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1]!;
};

export async function runApiBench(stack: SpeedStack) {
  cpuUrl = `${stack.bareOrigin}/__cpu`;
  const db = await mysql.createConnection({ uri: stack.databaseUrl });
  const [[athlete]] = (await db.query(
    `SELECT a.id, a.team_id AS teamId FROM athletes a JOIN users u ON u.id = a.user_id WHERE u.email = ?`,
    ['athlete@rackturn.test'],
  )) as unknown as [{ id: number; teamId: number }[]];
  const [[boardTeam]] = (await db.query(
    `SELECT m.team_id AS teamId FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email = ?`,
    [BOARD_COACH],
  )) as unknown as [{ teamId: number }[]];
  const week = weekOfDate(new Date());

  const athleteCookie = await signIn(stack.origin, 'athlete@rackturn.test', DEMO_PASSWORD);
  const myWeekUrl = `${stack.origin}/api/my-week`;
  const first = await fetch(myWeekUrl, { headers: { cookie: athleteCookie } });
  if (first.status !== 200) throw new Error(`my-week: ${first.status}`);

  // Round trips of one answer, read from the server's own counter (nothing else uses this database now).
  const questions = async () => {
    const [[row]] = (await db.query(`SHOW GLOBAL STATUS LIKE 'Questions'`)) as unknown as [{ Value: string }[]];
    return Number(row!.Value);
  };
  const before = await questions();
  for (let i = 0; i < 10; i++) await fetch(myWeekUrl, { headers: { cookie: athleteCookie } });
  const queriesPerMyWeek = Math.round(((await questions()) - before - 1) / 10);

  const myWeek = await sideBySide(
    { url: myWeekUrl, headers: { cookie: athleteCookie } },
    { url: `${stack.bareOrigin}/my-week?athleteId=${athlete!.id}&teamId=${athlete!.teamId}&week=${week}` },
  );

  const coachCookie = await signIn(stack.origin, BOARD_COACH, BOARD_PASSWORD);
  const boardUrl = `${stack.origin}/api/board?from=${addWeeks(week, -4)}&to=${addWeeks(week, 8)}`;
  const board = await sideBySide(
    { url: boardUrl, headers: { cookie: coachCookie } },
    { url: `${stack.bareOrigin}/board?teamId=${boardTeam!.teamId}` },
  );

  // The plan run: fill next week for the whole demo club (a dozen athletes), re-picking every engine pick.
  const headCoach = await signIn(stack.origin, 'coach@rackturn.test', DEMO_PASSWORD);
  const runs: number[] = [];
  const [[club]] = (await db.query(`SELECT count(*) AS n FROM athletes WHERE team_id = ? AND archived_at IS NULL`, [
    athlete!.teamId,
  ])) as unknown as [{ n: number }[]];
  for (let i = 0; i < 12; i++) {
    const t0 = performance.now();
    const res = await fetch(`${stack.origin}/api/plans/generate`, {
      method: 'POST',
      headers: { cookie: headCoach, origin: stack.origin, 'content-type': 'application/json' },
      body: JSON.stringify({ weeks: 'next', reshuffle: true }),
    });
    const body = (await res.json()) as { changes?: unknown[] };
    if (res.status !== 200) throw new Error(`plans/generate: ${res.status} ${JSON.stringify(body)}`);
    if (i === 0) continue; // the first run also warms the engine's code
    runs.push(Math.round((performance.now() - t0) * 10) / 10);
  }
  await db.end();

  return {
    seconds: SECONDS,
    myWeek: { ...myWeek, queriesPerRequest: queriesPerMyWeek },
    board: { athletes: 40, weeks: 13, ...board },
    planRun: { athletes: Number(club!.n), weeks: 1, p50Ms: median(runs), maxMs: Math.max(...runs), runs },
    budgets: { throughputRatio: 0.3, p99RatioAt50: 3, planRunP50Ms: 150 },
  };
}
