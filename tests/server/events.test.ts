// Live updates over server-sent events: a change reaches a subscribed client, scoped to the team and (for
// athletes) to their own athlete; a write on one app instance reaches a subscriber of another, since the
// fan-out goes through the database; streams end when the hub stops.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import type { LiveEvent } from '../../shared/schemas';
import { stopLiveEvents } from '../../server/modules/events/events.service';
import { TEST_PASSWORD, useTestApp, type TestApp } from '../support/app';
import { createAthlete, createTeam, createUser, createVariant, type TestTeam } from '../support/factories';

const one = useTestApp();
const two = useTestApp();
const week = weekOfDate(new Date());
let servers: Server[] = [];
const streams: { close(): void }[] = [];
let team: TestTeam;
let other: TestTeam;
let mateId: number;
let mateEmail: string;

function listen(t: TestApp): Promise<{ server: Server; base: string }> {
  return new Promise((resolve) => {
    const server = t.app.listen(0, '127.0.0.1', () => {
      servers.push(server);
      resolve({ server, base: `http://127.0.0.1:${(server.address() as AddressInfo).port}` });
    });
  });
}

async function cookieOf(t: TestApp, email: string): Promise<string> {
  const res = await request(t.app).post('/api/auth/login').send({ email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .map((c) => c.split(';')[0])
    .join('; ');
}

/** Opens /api/events as that user and collects the events' data as they come. */
async function subscribe(base: string, cookie: string) {
  const abort = new AbortController();
  const res = await fetch(`${base}/api/events`, {
    headers: { cookie, accept: 'text/event-stream' },
    signal: abort.signal,
  });
  const events: LiveEvent[] = [];
  let ended = false;
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  void (async () => {
    let buf = '';
    try {
      for (;;) {
        const { value, done } = await reader.read();
        if (done) break;
        buf += decoder.decode(value, { stream: true });
        for (let i = buf.indexOf('\n\n'); i >= 0; i = buf.indexOf('\n\n')) {
          const data = buf
            .slice(0, i)
            .split('\n')
            .find((l) => l.startsWith('data: '));
          buf = buf.slice(i + 2);
          if (data) events.push(JSON.parse(data.slice(6)) as LiveEvent);
        }
      }
    } catch {
      // Aborted by the test.
    }
    ended = true;
  })();
  const stream = { status: res.status, type: res.headers.get('content-type'), events, ended: () => ended };
  streams.push({ close: () => abort.abort() });
  return stream;
}

const about = (athleteId: number | null, topic: LiveEvent['topic']) => (e: LiveEvent) =>
  e.athleteId === athleteId && e.topic === topic;

let base1: string;
let base2: string;

beforeAll(async () => {
  const db = one.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  const mate = await createUser(db, team.teamId, 'athlete');
  mateEmail = mate.email;
  mateId = await createAthlete(db, team.teamId, { userId: mate.id });
  base1 = (await listen(one)).base;
  base2 = (await listen(two)).base;
});

afterAll(async () => {
  for (const s of streams) s.close();
  stopLiveEvents(one.ctx);
  stopLiveEvents(two.ctx);
  await Promise.all(servers.map((s) => new Promise((r) => s.close(r))));
  servers = [];
});

describe('GET /api/events', () => {
  it('needs a session', async () => {
    const res = await request(one.app).get('/api/events');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
    const agent = await one.signIn(team.coach.email);
    const plain = await agent.get('/api/events').set('Accept', 'application/json');
    expect(plain.status).toBe(406);
    expect(plain.body.error.code).toBe('not_acceptable');
  });

  it("a coach's reply reaches the athlete's open stream; the coaches get the athlete's notices", async () => {
    const athlete = await subscribe(base1, await cookieOf(one, team.athleteUser.email));
    const coach = await subscribe(base1, await cookieOf(one, team.coach.email));
    expect(athlete.status).toBe(200);
    expect(athlete.type).toMatch(/^text\/event-stream/);
    const coachAgent = await one.signIn(team.coach.email);
    await coachAgent
      .post(`/api/messages/threads/${team.athleteId}/${week}`)
      .send({ body: 'Swap done, see the board.' });
    await expect
      .poll(() => athlete.events.find(about(team.athleteId, 'messages')), { timeout: 5_000 })
      .toMatchObject({ weeks: [week] });
    const athleteAgent = await one.signIn(team.athleteUser.email);
    await athleteAgent.post(`/api/messages/threads/${team.athleteId}/${week}`).send({ body: 'Thanks!' });
    await expect.poll(() => coach.events.some(about(null, 'notices')), { timeout: 5_000 }).toBe(true);
    // Notices are for coaches only.
    expect(athlete.events.some((e) => e.topic === 'notices')).toBe(false);
  });

  it("a change reaches the board's coach; another team and another athlete of the team receive nothing", async () => {
    const outsider = await subscribe(base1, await cookieOf(one, other.headCoach.email));
    const mate = await subscribe(base1, await cookieOf(one, mateEmail));
    const coach = await subscribe(base1, await cookieOf(one, team.headCoach.email));
    const coachAgent = await one.signIn(team.coach.email);
    const variantId = await createVariant(one.ctx.database.db, team.teamId, { lift: 'bench' });
    const next = addWeeks(week, 1);
    const saved = await coachAgent
      .put(`/api/plans/${team.athleteId}/${next}/upper`)
      .send({ variantId, version: 0, reason: 'Live update test' });
    expect(saved.status, JSON.stringify(saved.body)).toBeLessThan(300);
    await expect
      .poll(() => coach.events.find(about(team.athleteId, 'plan')), { timeout: 5_000 })
      .toMatchObject({ weeks: [next] });
    // Then a change in the other team: once the outsider has it, the hub has passed the first one by.
    const otherAgent = await one.signIn(other.athleteUser.email);
    await otherAgent.post(`/api/messages/threads/${other.athleteId}/${week}`).send({ body: 'Hello coach' });
    await expect.poll(() => outsider.events.some(about(other.athleteId, 'messages')), { timeout: 5_000 }).toBe(true);
    expect(outsider.events.every((e) => e.athleteId !== team.athleteId)).toBe(true);
    expect(mate.events.filter((e) => e.athleteId !== mateId)).toEqual([]);
  });

  it("a plan run reaches the coaches' boards, and a training-week save (a deload) the athlete's page", async () => {
    const coach = await subscribe(base1, await cookieOf(one, team.headCoach.email));
    const athlete = await subscribe(base1, await cookieOf(one, team.athleteUser.email));
    const coachAgent = await one.signIn(team.coach.email);
    const db = one.ctx.database.db;
    for (const lift of ['squat', 'bench', 'deadlift'] as const) {
      for (let i = 0; i < 3; i++) await createVariant(db, team.teamId, { lift, family: `${lift} family ${i}` });
    }
    const run = await coachAgent.post('/api/plans/generate').send({ weeks: 'next', athleteIds: [team.athleteId] });
    expect(run.status, JSON.stringify(run.body)).toBe(200);
    expect(run.body.changes.length, JSON.stringify(run.body)).toBeGreaterThan(0);
    const next = addWeeks(week, 1);
    await expect
      .poll(() => coach.events.find((e) => about(team.athleteId, 'plan')(e) && e.weeks.includes(next)), {
        timeout: 5_000,
      })
      .toBeTruthy();
    const later = addWeeks(week, 2);
    const saved = await coachAgent
      .put(`/api/athletes/${team.athleteId}/weeks/${later}`)
      .send({ version: 0, deload: true, trainingMaxPct: 85, sessions: {} });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    await expect
      .poll(() => athlete.events.find((e) => about(team.athleteId, 'plan')(e) && e.weeks.includes(later)), {
        timeout: 5_000,
      })
      .toBeTruthy();
    // The deload's rest-week mark was written with the week.
    const rest = await coachAgent.get(`/api/athletes/${team.athleteId}/weeks/${later}`);
    expect(rest.body.deload).toBe(true);
  });

  it('a write on one app instance reaches a subscriber of another', async () => {
    const athleteOnTwo = await subscribe(base2, await cookieOf(two, team.athleteUser.email));
    const coachOnOne = await one.signIn(team.headCoach.email);
    const res = await coachOnOne
      .post(`/api/messages/threads/${team.athleteId}/${addWeeks(week, -1)}`)
      .send({ body: 'Written through the first instance.' });
    expect(res.status).toBe(201);
    await expect
      .poll(() => athleteOnTwo.events.find(about(team.athleteId, 'messages')), { timeout: 5_000 })
      .toMatchObject({ weeks: [addWeeks(week, -1)] });
  });

  it('stopping the hub ends the open streams', async () => {
    const s = await subscribe(base2, await cookieOf(two, team.coach.email));
    stopLiveEvents(two.ctx);
    await expect.poll(() => s.ended(), { timeout: 5_000 }).toBe(true);
  });
});
