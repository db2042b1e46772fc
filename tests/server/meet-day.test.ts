// Meet day API: marks saved once per key and once per attempt (409 for a second coach), the federation's
// attempt rules and class limits refusing bad input with nothing saved, team scoping, roles, and the
// results written into the athletes' histories once.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createMeet,
  createMeetEntry,
  createTeam,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let coach: request.Agent;
let headCoach: request.Agent;
let athlete: request.Agent;
let otherCoach: request.Agent;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  coach = await t.signIn(team.coach.email);
  headCoach = await t.signIn(team.headCoach.email);
  athlete = await t.signIn(team.athleteUser.email);
  otherCoach = await t.signIn(other.headCoach.email);
});

let n = 0;
const key = () => `test-mark-${Date.now()}-${++n}`;

async function meetWithEntry(opts: { date?: string; weightClass?: string | null } = {}) {
  const db = t.ctx.database.db;
  const meetId = await createMeet(db, team.teamId, { date: opts.date ?? '2026-01-10' });
  const athleteId = await createAthlete(db, team.teamId, { sex: 'M', birthYear: 1982 });
  const entryId = await createMeetEntry(db, team.teamId, meetId, athleteId, {
    weightClass: opts.weightClass === undefined ? '93' : opts.weightClass,
    attempts: { squat: [200, 210, 217.5] },
  });
  return { meetId, athleteId, entryId };
}

describe('meet day marks', () => {
  it('shows every entered athlete with age group, plan, default jumps and no attempts yet', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const res = await coach.get(`/api/meets/${meetId}/day`);
    expect(res.status).toBe(200);
    expect(res.body.entries).toHaveLength(1);
    // Born 1982, meet in 2026: 44 in the meet's year, masters 1 (40–49; federation age categories, memory).
    expect(res.body.entries[0]).toMatchObject({
      entryId,
      ageGroup: 'masters1',
      weightClass: '93',
      weighInKg: null,
      flight: 'A',
      plan: { squat: [200, 210, 217.5] },
      jumps: { squat: [10, 7.5] },
      jumpsVersion: null,
      attempts: { squat: [], bench: [], deadlift: [] },
    });
  });

  it('saves a mark once per key: a resend returns the stored result and counts nothing twice', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const body = { key: key(), entryId, lift: 'squat', attemptNo: 1, weightKg: 200, result: 'good' };
    const first = await coach.post(`/api/meets/${meetId}/day/marks`).send(body);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ replay: false, attempt: { weightKg: 200, result: 'good', attemptNo: 1 } });
    const again = await coach.post(`/api/meets/${meetId}/day/marks`).send(body);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ replay: true, attempt: { id: first.body.attempt.id } });
    // Many resends at once (a flaky connection flushing its queue): still one attempt.
    const burst = await Promise.all([1, 2, 3, 4].map(() => coach.post(`/api/meets/${meetId}/day/marks`).send(body)));
    expect(burst.map((r) => r.status)).toEqual([200, 200, 200, 200]);
    const day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0].attempts.squat).toHaveLength(1);
  });

  it('gives one result when two coaches mark the same attempt, and a clear 409 to the second', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const mark = (agent: request.Agent, result: string) =>
      agent
        .post(`/api/meets/${meetId}/day/marks`)
        .send({ key: key(), entryId, lift: 'squat', attemptNo: 1, weightKg: 200, result });
    const [a, b] = await Promise.all([mark(coach, 'good'), mark(headCoach, 'missed')]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const lost = a.status === 409 ? a : b;
    const won = a.status === 201 ? a : b;
    expect(lost.body.error.code).toBe('version_conflict');
    expect(lost.body.error.message).toMatch(/first squat attempt was already marked (good|missed) at 200 kg/);
    expect(lost.body.error.current).toMatchObject({ id: won.body.attempt.id });
    const day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0].attempts.squat).toEqual([expect.objectContaining({ result: won.body.attempt.result })]);
  });

  it('refuses marks that break the federation’s attempt rules, naming the rule, and saves nothing', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const post = (attemptNo: number, weightKg: number, result = 'good', record = false) =>
      coach
        .post(`/api/meets/${meetId}/day/marks`)
        .send({ key: key(), entryId, lift: 'squat', attemptNo, weightKg, result, record });
    // Technical rules (memory): multiples of 2.5 kg; a record attempt may go in 0.5 kg steps if loadable.
    const offGrid = await post(1, 201);
    expect(offGrid.status).toBe(422);
    expect(offGrid.body.error.fields.weightKg[0]).toMatch(/multiple of 2\.5 kg/);
    const unloadable = await post(1, 200.5, 'good', true);
    expect(unloadable.status).toBe(422);
    expect(unloadable.body.error.message).toMatch(/cannot be loaded/);
    const skipped = await post(2, 210);
    expect(skipped.status).toBe(422);
    expect(skipped.body.error.message).toMatch(/Mark the first squat attempt first/);
    expect((await post(1, 200, 'good')).status).toBe(201);
    // After a good lift at least 2.5 kg more.
    const same = await post(2, 200);
    expect(same.status).toBe(422);
    expect(same.body.error.message).toMatch(/at least 2\.5 kg heavier: at least 202\.5 kg/);
    expect((await post(2, 210, 'missed')).status).toBe(201);
    // After a miss, never lower; the same weight again is fine.
    const lower = await post(3, 207.5);
    expect(lower.status).toBe(422);
    expect(lower.body.error.message).toMatch(/never lowered: at least 210 kg/);
    const day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0].attempts.squat.map((a: { weightKg: number }) => a.weightKg)).toEqual([200, 210]);
    expect((await post(3, 210, 'good')).status).toBe(201);
    expect((await post(3, 215)).status).toBe(409); // the third is taken
  });

  it('takes back only the latest mark of a lift, with its version', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const post = (attemptNo: number, weightKg: number) =>
      coach
        .post(`/api/meets/${meetId}/day/marks`)
        .send({ key: key(), entryId, lift: 'bench', attemptNo, weightKg, result: 'good' });
    const one = (await post(1, 100)).body.attempt;
    const two = (await post(2, 105)).body.attempt;
    expect((await coach.delete(`/api/meets/${meetId}/day/marks/${one.id}?version=1`)).status).toBe(409);
    expect((await coach.delete(`/api/meets/${meetId}/day/marks/${two.id}?version=7`)).status).toBe(409);
    expect((await coach.delete(`/api/meets/${meetId}/day/marks/${two.id}?version=1`)).status).toBe(204);
    const day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0].attempts.bench).toHaveLength(1);
  });

  it('keeps other teams and athletes out', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const body = { key: key(), entryId, lift: 'squat', attemptNo: 1, weightKg: 200, result: 'good' };
    expect((await otherCoach.get(`/api/meets/${meetId}/day`)).status).toBe(404);
    expect((await otherCoach.post(`/api/meets/${meetId}/day/marks`).send(body)).status).toBe(404);
    expect((await athlete.post(`/api/meets/${meetId}/day/marks`).send(body)).status).toBe(403);
    // An entry of another meet (or team) under this meet's path is not found either.
    const elsewhere = await meetWithEntry();
    const cross = await coach
      .post(`/api/meets/${meetId}/day/marks`)
      .send({ ...body, key: key(), entryId: elsewhere.entryId });
    expect(cross.status).toBe(404);
    const day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0].attempts.squat).toEqual([]);
  });
});

describe('weigh-in and jumps', () => {
  it('records the weigh-in within the class limit and refuses a bodyweight over it, saving nothing', async () => {
    const { meetId, entryId } = await meetWithEntry({ weightClass: '83' });
    // Federation men's classes (secondary/text): 74 < bodyweight ≤ 83 is the 83 kg class.
    const over = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/weigh-in`)
      .send({ bodyweightKg: 83.4, version: 1 });
    expect(over.status).toBe(422);
    expect(over.body.error.fields.bodyweightKg[0]).toMatch(/Over the 83 kg class limit: 83\.4 kg.*93 kg class/);
    const light = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/weigh-in`)
      .send({ bodyweightKg: 72, version: 1 });
    expect(light.status).toBe(422);
    expect(light.body.error.message).toMatch(/falls in the 74 kg class, not 83/);
    let day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0]).toMatchObject({ weighInKg: null, version: 1 });

    const ok = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/weigh-in`)
      .send({ bodyweightKg: 82.95, flight: 'B', lot: 7, version: 1 });
    expect(ok.status).toBe(200);
    expect(ok.body.entries[0]).toMatchObject({ weighInKg: 82.95, weightClass: '83', flight: 'B', lot: 7, version: 2 });
    const stale = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/weigh-in`)
      .send({ bodyweightKg: 82, version: 1 });
    expect(stale.status).toBe(409);
    day = await coach.get(`/api/meets/${meetId}/day`);
    expect(day.body.entries[0].weighInKg).toBe(82.95);
  });

  it('stores the athlete’s usual jumps with a version', async () => {
    const { meetId, entryId } = await meetWithEntry();
    const jumps = { squat: [12.5, 5], bench: [5, 2.5], deadlift: [15, 10] };
    const made = await coach.put(`/api/meets/${meetId}/day/entries/${entryId}/jumps`).send({ jumps });
    expect(made.status).toBe(200);
    expect(made.body.entries[0]).toMatchObject({ jumps, jumpsVersion: 1 });
    expect((await coach.put(`/api/meets/${meetId}/day/entries/${entryId}/jumps`).send({ jumps })).status).toBe(409);
    const edit = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/jumps`)
      .send({ jumps: { ...jumps, squat: [10, 5] }, version: 1 });
    expect(edit.body.entries[0]).toMatchObject({ jumps: { squat: [10, 5] }, jumpsVersion: 2 });
    const bad = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/jumps`)
      .send({ jumps: { ...jumps, bench: [3, 2.5] }, version: 2 });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body.error.fields)).toMatch(/2\.5 kg steps/);
  });
});

describe('results into history', () => {
  it('writes each best good lift as a top set on the competition variant, once', async () => {
    const db = t.ctx.database.db;
    const squat = await createVariant(db, team.teamId, {
      name: `Competition squat ${Date.now()}`,
      lift: 'squat',
      specificity: 1,
    });
    await createVariant(db, team.teamId, {
      name: `Competition squat with chains ${Date.now()}`,
      lift: 'squat',
      specificity: 1,
      equipment: ['chains'],
      risk: 3,
    });
    const { meetId, entryId, athleteId } = await meetWithEntry({ date: '2025-11-08' });
    const post = (attemptNo: number, weightKg: number, result: string) =>
      coach
        .post(`/api/meets/${meetId}/day/marks`)
        .send({ key: key(), entryId, lift: 'squat', attemptNo, weightKg, result });
    await post(1, 200, 'good');
    await post(2, 210, 'good');
    await post(3, 215, 'missed');
    const saved = await coach.post(`/api/meets/${meetId}/day/results`);
    expect(saved.status).toBe(200);
    expect(saved.body.saved).toBe(1);
    expect(saved.body.meet.meet.resultsSavedAt).not.toBeNull();
    const history = await coach.get(`/api/top-sets?athleteId=${athleteId}`);
    expect(history.status).toBe(200);
    const items = history.body.items as { variantId: number; weightKg: number; reps: number; performedOn: string }[];
    expect(items).toEqual([
      expect.objectContaining({ variantId: squat, weightKg: 210, reps: 1, performedOn: '2025-11-08' }),
    ]);
    // Twice is refused; marks are closed once the results are in.
    expect((await coach.post(`/api/meets/${meetId}/day/results`)).status).toBe(409);
    expect((await post(3, 215, 'good')).status).toBe(409);
    const late = await coach
      .put(`/api/meets/${meetId}/day/entries/${entryId}/weigh-in`)
      .send({ bodyweightKg: 90, version: 1 });
    expect(late.status).toBe(409);
  });

  it('refuses a meet that has not happened yet', async () => {
    const { meetId } = await meetWithEntry({ date: '2031-01-01' });
    const res = await coach.post(`/api/meets/${meetId}/day/results`);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/not taken place yet/);
  });
});
