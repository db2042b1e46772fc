// The training week API: sessions in the team rules, an athlete's week edited by coaches (speed work from
// the training max, accessories, deload as a max-effort rest week), and the athlete logging a session.
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { addWeeks, mondayOf, weekOfDate } from '../../shared/engine/weeks';
import { restWeeks, sessionLogs } from '../../server/db/schema';
import type { AthleteWeek, Session } from '../../shared/schemas';
import { useTestApp } from '../support/app';
import {
  createPlanEntry,
  createTeam,
  createTopSet,
  createVariant,
  publishAthleteWeek,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let head: request.Agent;
let coach: request.Agent;
let athlete: request.Agent;
const thisWeek = weekOfDate(new Date());
const nextWeek = addWeeks(thisWeek, 1);
const path = (athleteId: number, week = nextWeek) => `/api/athletes/${athleteId}/weeks/${week}`;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  head = await t.signIn(team.headCoach.email);
  coach = await t.signIn(team.coach.email);
  athlete = await t.signIn(team.athleteUser.email);
  // A competition bench triple at RPE 8 two weeks ago: e1RM by Epley at 3 + 2 reps (RIR scale, Zourdos et
  // al., JSCR 2016; common practice) = 150 × (1 + 5/30) = 175.
  const bench = await createVariant(db, team.teamId, { lift: 'bench', family: 'bench press', specificity: 1 });
  const twoWeeksAgo = addWeeks(thisWeek, -2);
  await createTopSet(db, team.teamId, team.athleteId, bench, {
    week: twoWeeksAgo,
    performedOn: mondayOf(twoWeeksAgo).toISOString().slice(0, 10),
    weightKg: 150,
    reps: 3,
    rpe: 8,
  });
});

const speedOf = (w: AthleteWeek, id: string) => w.sessions.find((s) => s.id === id)!.speed;

describe('sessions in the team rules', () => {
  it('come with a four-session week by default, and the head coach can change them', async () => {
    const current = (await head.get('/api/rules')).body;
    expect(current.rules.sessions.map((s: Session) => s.id)).toEqual([
      'lower-me',
      'upper-me',
      'lower-speed',
      'upper-speed',
    ]);
    const sessions = current.rules.sessions.map((s: Session) =>
      s.id === 'upper-speed' ? { ...s, name: 'Bench speed', weekday: 4 } : s,
    );
    const res = await head.put('/api/rules').send({ ...current, rules: { ...current.rules, sessions } });
    expect(res.status).toBe(200);
    expect(res.body.rules.sessions[3]).toMatchObject({ name: 'Bench speed', weekday: 4 });
    // The stale copy is refused with the current rules.
    const stale = await head.put('/api/rules').send({ ...current, rules: { ...current.rules, sessions } });
    expect(stale.status).toBe(409);
  });

  it('refuses a speed session without its lift, a max-effort session on an unknown slot, duplicate ids', async () => {
    const current = (await head.get('/api/rules')).body;
    const bad = [
      { id: 'a', name: 'Speed', weekday: 2, parts: ['speed'], slotId: null, speedLift: null },
      { id: 'b', name: 'Heavy', weekday: 3, parts: ['maxEffort'], slotId: 'nowhere', speedLift: null },
      { id: 'b', name: '', weekday: 9, parts: [], slotId: null, speedLift: null },
    ];
    const res = await head.put('/api/rules').send({ ...current, rules: { ...current.rules, sessions: bad } });
    expect(res.status).toBe(422);
    const f = res.body.error.fields;
    expect(f['rules.sessions.0.speedLift'][0]).toMatch(/lift of the speed work/);
    expect(f['rules.sessions.1.slotId'][0]).toMatch(/max-effort slots/);
    expect(f['rules.sessions.2.name'][0]).toMatch(/name/);
    expect(f['rules.sessions.2.weekday'][0]).toMatch(/day/);
    expect(f['rules.sessions.2.parts'][0]).toMatch(/at least one part/);
    expect((await head.get('/api/rules')).body.version).toBe(current.version);
  });
});

describe('GET /api/athletes/:athleteId/weeks/:week', () => {
  it('resolves the sessions in the order of the week with speed loads from the training max', async () => {
    const res = await coach.get(path(team.athleteId));
    expect(res.status).toBe(200);
    const w = res.body as AthleteWeek;
    expect(w).toMatchObject({ version: 0, deload: false, trainingMaxPct: 90 });
    expect(w.sessions.map((s) => s.weekday)).toEqual([...w.sessions.map((s) => s.weekday)].sort((a, b) => a - b));
    // Training max: 90 % of 175 (common practice) = 157.5.
    expect(w.maxes.bench).toEqual({ e1rmKg: 175, trainingMaxKg: 157.5 });
    expect(w.maxes.squat).toBeNull();
    const bench = speedOf(w, 'upper-speed')!;
    expect([50, 55, 60]).toContain(bench.pct);
    expect(bench).toMatchObject({ lift: 'bench', sets: 9, reps: 3, accommodation: 'none' });
    expect(bench.barKg).toBe(Math.floor((157.5 * bench.pct) / 100 / 2.5) * 2.5);
    // No squat estimate yet: the load is left open rather than guessed.
    expect(speedOf(w, 'lower-speed')!.barKg).toBeNull();
    expect(w.sessions.find((s) => s.id === 'lower-me')!.date).toBe(mondayOf(nextWeek).toISOString().slice(0, 10));
  });

  it('is not found for another team, refused to athletes, and checks its params', async () => {
    expect((await coach.get(path(other.athleteId))).status).toBe(404);
    expect((await athlete.get(path(team.athleteId))).status).toBe(403);
    const bad = await coach.get(`/api/athletes/${team.athleteId}/weeks/someday`);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['params.week']).toBeDefined();
  });
});

describe('PUT /api/athletes/:athleteId/weeks/:week', () => {
  const body = (version: number, over: Record<string, unknown> = {}) => ({
    version,
    deload: false,
    trainingMaxPct: 85,
    sessions: {
      'upper-speed': {
        speed: { pct: 60, sets: 8, reps: 3, accommodation: 'bands' },
        accessories: [
          { name: 'Chest-supported row', category: 'upperBack', sets: 4, reps: 10, loadKg: null, rpe: 8 },
          { name: 'Band pushdown', category: 'triceps', sets: 3, reps: 20, loadKg: null, rpe: null },
        ],
      },
    },
    ...over,
  });

  it('stores the week, computes bands speed loads, and answers 409 to a stale version', async () => {
    const res = await coach.put(path(team.athleteId)).send(body(0));
    expect(res.status).toBe(200);
    const w = res.body as AthleteWeek;
    expect(w.version).toBe(1);
    // 85 % of 175 = 148.75; 60 % of it = 89.25 planned at the top; bands take a fifth (value from memory,
    // common practice): bar 89.25 × 0.8 = 71.4 → 70 kg (2.5 kg steps), bands 19.25 kg.
    expect(speedOf(w, 'upper-speed')).toMatchObject({ pct: 60, sets: 8, barKg: 70, accommodationKg: 19.25 });
    expect(w.sessions.find((s) => s.id === 'upper-speed')!.accessories).toHaveLength(2);
    const stale = await head.put(path(team.athleteId)).send(body(0, { trainingMaxPct: 80 }));
    expect(stale.status).toBe(409);
    expect(stale.body.error.current.trainingMaxPct).toBe(85);
    const again = await head.put(path(team.athleteId)).send(body(1, { trainingMaxPct: 80 }));
    expect(again.body).toMatchObject({ version: 2, trainingMaxPct: 80 });
  });

  it('refuses percentages outside 30–100 %, reps below 1 and a training-max share over 100 %, saving nothing', async () => {
    const before = (await coach.get(path(team.athleteId))).body as AthleteWeek;
    const res = await coach.put(path(team.athleteId)).send(
      body(before.version, {
        trainingMaxPct: 101,
        sessions: {
          'upper-speed': {
            speed: { pct: 25, sets: 8, reps: 0, accommodation: 'none' },
            accessories: [{ name: 'Row', category: 'upperBack', sets: 3, reps: 0, loadKg: null, rpe: null }],
          },
          'lower-speed': { speed: { pct: 101, sets: 10, reps: 2, accommodation: 'none' }, accessories: [] },
        },
      }),
    );
    expect(res.status).toBe(422);
    const f = res.body.error.fields;
    expect(f.trainingMaxPct[0]).toMatch(/At most 100 %/);
    expect(f['sessions.upper-speed.speed.pct'][0]).toMatch(/30 to 100 %/);
    expect(f['sessions.lower-speed.speed.pct'][0]).toMatch(/30 to 100 %/);
    expect(f['sessions.upper-speed.speed.reps'][0]).toMatch(/At least 1 rep/);
    expect(f['sessions.upper-speed.accessories.0.reps'][0]).toMatch(/At least 1 rep/);
    expect((await coach.get(path(team.athleteId))).body).toEqual(before);
  });

  it('refuses work for a session the rules do not have or a part the session lacks', async () => {
    const before = (await coach.get(path(team.athleteId))).body as AthleteWeek;
    const res = await coach.put(path(team.athleteId)).send(
      body(before.version, {
        sessions: {
          nowhere: { speed: null, accessories: [] },
          'lower-me': { speed: { pct: 50, sets: 10, reps: 2, accommodation: 'none' }, accessories: [] },
        },
      }),
    );
    expect(res.status).toBe(422);
    expect(res.body.error.fields['sessions.nowhere'][0]).toMatch(/No such session/);
    expect(res.body.error.fields['sessions.lower-me.speed'][0]).toMatch(/no speed part/);
  });

  it('a deload week is a max-effort rest week with lighter speed and accessory work; undone with it', async () => {
    const db = t.ctx.database.db;
    const week = addWeeks(thisWeek, 2);
    const first = await coach.put(path(team.athleteId, week)).send(body(0, { deload: true }));
    expect(first.status).toBe(200);
    const w = first.body as AthleteWeek;
    // Common practice: 10 points lower and a third fewer sets; accessories one set fewer, RPE at most 7.
    expect(speedOf(w, 'upper-speed')).toMatchObject({ pct: 50, sets: 5 });
    expect(w.work['upper-speed']!.speed).toMatchObject({ pct: 60, sets: 8 });
    expect(w.sessions.find((s) => s.id === 'upper-speed')!.accessories[0]).toMatchObject({ sets: 3, rpe: 7 });
    const rest = () =>
      db
        .select()
        .from(restWeeks)
        .where(and(eq(restWeeks.athleteId, team.athleteId), eq(restWeeks.week, week)));
    expect(await rest()).toHaveLength(1);
    const undone = await coach.put(path(team.athleteId, week)).send(body(1, { deload: false }));
    expect(undone.status).toBe(200);
    expect(await rest()).toHaveLength(0);
  });

  it('another team answers 404 and nothing is written', async () => {
    const res = await coach.put(path(other.athleteId)).send(body(0));
    expect(res.status).toBe(404);
  });
});

describe('PUT /api/my-week/sessions/:sessionId', () => {
  const log = (version: number, done = false) => ({
    week: thisWeek,
    version,
    speedSetsDone: 6,
    accessorySetsDone: [4, 3],
    done,
  });

  it('logs what was done of a session; a stale version is 409 with the stored log', async () => {
    const res = await athlete.put('/api/my-week/sessions/upper-speed').send(log(0));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      sessionId: 'upper-speed',
      speedSetsDone: 6,
      accessorySetsDone: [4, 3],
      backOffDone: [],
      done: false,
      version: 1,
    });
    const done = await athlete.put('/api/my-week/sessions/upper-speed').send(log(1, true));
    expect(done.body).toMatchObject({ done: true, version: 2 });
    const stale = await athlete.put('/api/my-week/sessions/upper-speed').send(log(1));
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ done: true, version: 2 });
  });

  it('answers a repeat under one Idempotency-Key with the first answer, not a 409', async () => {
    const key = randomUUID();
    const first = await athlete.put('/api/my-week/sessions/lower-me').set('Idempotency-Key', key).send(log(0));
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ version: 1 });
    const again = await athlete.put('/api/my-week/sessions/lower-me').set('Idempotency-Key', key).send(log(0));
    expect(again.status).toBe(200);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    // Without the key the same stale log is the usual conflict.
    expect((await athlete.put('/api/my-week/sessions/lower-me').send(log(0))).status).toBe(409);
  });

  it('refuses an unknown session, a week not started, bad counts, and coaches', async () => {
    expect((await athlete.put('/api/my-week/sessions/nowhere').send(log(0))).status).toBe(404);
    const later = await athlete.put('/api/my-week/sessions/lower-me').send({ ...log(0), week: addWeeks(thisWeek, 1) });
    expect(later.status).toBe(422);
    expect(later.body.error.fields.week[0]).toMatch(/not started/);
    const bad = await athlete.put('/api/my-week/sessions/lower-me').send({ ...log(0), speedSetsDone: -1 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.speedSetsDone).toBeDefined();
    expect((await coach.put('/api/my-week/sessions/lower-me').send(log(0))).status).toBe(403);
  });
});

describe('GET /api/my-week with sessions', () => {
  it('shows a published week’s sessions in the order of the week with what was logged', async () => {
    await publishAthleteWeek(t.ctx.database.db, team.teamId, team.athleteId, thisWeek);
    const res = await athlete.get('/api/my-week');
    expect(res.status).toBe(200);
    expect(res.body.deload).toBe(false);
    const ids = res.body.sessions.map((s: { id: string }) => s.id);
    expect(ids).toEqual(['lower-me', 'upper-me', 'upper-speed', 'lower-speed']); // Bench speed moved to Thursday
    const speed = res.body.sessions.find((s: { id: string }) => s.id === 'upper-speed');
    expect(speed.log).toMatchObject({ done: true, speedSetsDone: 6 });
    expect(speed.speed.barKg).toBeGreaterThan(0);
  });

  it('suggests an opening range for a never-done variant from the competition lift, marked as an estimate', async () => {
    const db = t.ctx.database.db;
    const fresh = await createVariant(db, team.teamId, {
      lift: 'bench',
      family: 'floor press',
      name: 'Fresh floor press',
    });
    await createPlanEntry(db, team.teamId, team.athleteId, fresh, { week: thisWeek, slotId: 'upper' });
    const res = await athlete.get('/api/my-week');
    const pick = res.body.picks.find((p: { variant: { id: number } }) => p.variant.id === fresh);
    // Bench e1RM 175 (above); a single: 75 % = 131.25 → 130, 85 % = 148.75 → 147.5 in 2.5 kg steps
    // (common practice, no published source).
    expect(pick.opening).toEqual({ low: 130, high: 147.5, estimate: true, basedOn: 1 });
  });

  it('a draft week has no sessions', async () => {
    const res = await athlete.get(`/api/my-week?week=${addWeeks(thisWeek, 3)}`);
    expect(res.body).toMatchObject({ published: false, sessions: [] });
  });
});

describe('back-off sets after the max-effort top set', () => {
  let bo: TestTeam;
  let boAthlete: request.Agent;
  let boCoach: request.Agent;
  let boHead: request.Agent;
  let otherAthlete: request.Agent;
  const tick = (version: number, backOffDone?: boolean[], over: Record<string, unknown> = {}) => ({
    week: thisWeek,
    version,
    speedSetsDone: 0,
    accessorySetsDone: [2],
    ...(backOffDone ? { backOffDone } : {}),
    done: false,
    ...over,
  });
  const storedLog = async (teamId: number, sessionId: string) =>
    (
      await t.ctx.database.db
        .select()
        .from(sessionLogs)
        .where(
          and(eq(sessionLogs.teamId, teamId), eq(sessionLogs.week, thisWeek), eq(sessionLogs.sessionId, sessionId)),
        )
    )[0];

  beforeAll(async () => {
    const db = t.ctx.database.db;
    bo = await createTeam(db);
    boAthlete = await t.signIn(bo.athleteUser.email);
    boCoach = await t.signIn(bo.coach.email);
    boHead = await t.signIn(bo.headCoach.email);
    otherAthlete = await t.signIn(other.athleteUser.email);
    const squat = await createVariant(db, bo.teamId, { lift: 'squat', family: 'box squat', name: 'Low box squat' });
    await createPlanEntry(db, bo.teamId, bo.athleteId, squat, { week: thisWeek, slotId: 'lower' });
    await publishAthleteWeek(db, bo.teamId, bo.athleteId, thisWeek);
  });

  it('the athlete ticks each back-off set; a log without ticks keeps them; a stale version is 409', async () => {
    const first = await boAthlete.put('/api/my-week/sessions/lower-me').send(tick(0, [true, false]));
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ backOffDone: [true, false], version: 1 });
    // The session card saves its other sets without the ticks: they stay.
    const other = await boAthlete
      .put('/api/my-week/sessions/lower-me')
      .send(tick(1, undefined, { accessorySetsDone: [3] }));
    expect(other.body).toMatchObject({ backOffDone: [true, false], accessorySetsDone: [3], version: 2 });
    const stale = await boAthlete.put('/api/my-week/sessions/lower-me').send(tick(1, [true, true]));
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ backOffDone: [true, false], version: 2 });
    // The ticks alone: the counts stay.
    const both = await boAthlete
      .put('/api/my-week/sessions/lower-me')
      .send({ week: thisWeek, version: 2, backOffDone: [true, true] });
    expect(both.body).toMatchObject({ backOffDone: [true, true], accessorySetsDone: [3], version: 3 });
  });

  it('refuses ticks on a session without max effort and more ticks than sets may be, saving nothing', async () => {
    const none = await boAthlete.put('/api/my-week/sessions/upper-speed').send(tick(0, [true]));
    expect(none.status).toBe(422);
    expect(none.body.error.fields.backOffDone[0]).toMatch(/no max-effort part/);
    const many = await boAthlete.put('/api/my-week/sessions/lower-me').send(tick(3, Array(6).fill(true)));
    expect(many.status).toBe(422);
    expect(many.body.error.fields.backOffDone).toEqual(['At most 5 back-off sets']);
    const wrong = await boAthlete.put('/api/my-week/sessions/lower-me').send(tick(3, ['yes'] as unknown as boolean[]));
    expect(wrong.body.error.fields['backOffDone.0']).toBeDefined();
    expect(await storedLog(bo.teamId, 'upper-speed')).toBeUndefined();
    expect((await storedLog(bo.teamId, 'lower-me'))!).toMatchObject({ backOffDone: [true, true], version: 3 });
    expect((await boCoach.put('/api/my-week/sessions/lower-me').send(tick(3, [true]))).status).toBe(403);
  });

  it('another team’s athlete logging the same session touches only their own log', async () => {
    const res = await otherAthlete.put('/api/my-week/sessions/lower-me').send(tick(0, [false, true]));
    expect(res.status).toBe(200);
    expect((await storedLog(bo.teamId, 'lower-me'))!).toMatchObject({ backOffDone: [true, true], version: 3 });
    expect((await storedLog(other.teamId, 'lower-me'))!).toMatchObject({ backOffDone: [false, true] });
  });

  it('the coach sees the ticks with the week’s other session logs; another team’s athlete is not found', async () => {
    const res = await boCoach.get(`/api/athletes/${bo.athleteId}/weeks/${thisWeek}`);
    expect(res.status).toBe(200);
    expect((res.body as AthleteWeek).logs).toEqual([
      {
        sessionId: 'lower-me',
        speedSetsDone: 0,
        accessorySetsDone: [3],
        backOffDone: [true, true],
        done: false,
        version: 3,
      },
    ]);
    expect((await boCoach.get(`/api/athletes/${other.athleteId}/weeks/${thisWeek}`)).status).toBe(404);
  });

  it('My week carries the team’s back-off rule with the pick, and none with 0 sets', async () => {
    const week = (await boAthlete.get('/api/my-week')).body;
    expect(week.picks).toHaveLength(1);
    expect(week.backOff).toEqual({ sets: 2, dropPct: 10 });
    expect(week.sessions.find((s: { id: string }) => s.id === 'lower-me').log.backOffDone).toEqual([true, true]);
    const rules = (await boHead.get('/api/rules')).body;
    const saved = await boHead
      .put('/api/rules')
      .send({ ...rules, rules: { ...rules.rules, backOff: { sets: 0, dropPct: 10 } } });
    expect(saved.status).toBe(200);
    expect((await boAthlete.get('/api/my-week')).body.backOff).toBeNull();
    const back = await boHead.put('/api/rules').send({ ...rules, version: saved.body.version });
    expect(back.body.rules.backOff).toEqual({ sets: 2, dropPct: 10 });
    expect((await boAthlete.get('/api/my-week')).body.backOff).toEqual({ sets: 2, dropPct: 10 });
  });

  it('a rest week or a deload week has no back-off sets', async () => {
    const db = t.ctx.database.db;
    await db.insert(restWeeks).values({ teamId: bo.teamId, athleteId: bo.athleteId, week: thisWeek });
    expect((await boAthlete.get('/api/my-week')).body.backOff).toBeNull();
    await db.delete(restWeeks).where(and(eq(restWeeks.athleteId, bo.athleteId), eq(restWeeks.week, thisWeek)));
    expect((await boAthlete.get('/api/my-week')).body.backOff).toEqual({ sets: 2, dropPct: 10 });
    const week = addWeeks(thisWeek, 1);
    await publishAthleteWeek(db, bo.teamId, bo.athleteId, week);
    const deload = await boCoach
      .put(`/api/athletes/${bo.athleteId}/weeks/${week}`)
      .send({ version: 0, deload: true, trainingMaxPct: 90, sessions: {} });
    expect(deload.status).toBe(200);
    const next = (await boAthlete.get(`/api/my-week?week=${week}`)).body;
    expect(next).toMatchObject({ published: true, deload: true, backOff: null });
  });
});
