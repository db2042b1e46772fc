// The stored planning facts: restrictions by joint, emphasis or family over a range of days, rest weeks,
// the athlete's risk ceiling, meet-phase variants and the team's comfort and balance rules — what the
// API accepts, what it refuses (nothing saved), and what the board snapshot hands to the request builder.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { addWeeks, mondayOf, weekOfDate } from '../../shared/engine/weeks';
import type { BoardData } from '../../shared/schemas';
import { restWeeks, restrictions, teamRules } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createAthlete, createRestriction, createTeam, createVariant, type TestTeam } from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);
const day = (week: string, offset = 0) =>
  new Date(mondayOf(week).getTime() + offset * 86_400_000).toISOString().slice(0, 10);

let team: TestTeam;
let other: TestTeam;
let coach: request.Agent;
let head: request.Agent;
let athleteAgent: request.Agent;
let otherCoach: request.Agent;
let athleteId: number;

beforeAll(async () => {
  team = await createTeam(db());
  other = await createTeam(db());
  athleteId = await createAthlete(db(), team.teamId, { name: 'Ines Planning', maxRisk: 2 });
  coach = await t.signIn(team.coach.email);
  head = await t.signIn(team.headCoach.email);
  athleteAgent = await t.signIn(team.athleteUser.email);
  otherCoach = await t.signIn(other.coach.email);
});

const restrictionCount = async () =>
  (await db().select().from(restrictions).where(eq(restrictions.athleteId, athleteId))).length;

describe('restrictions by joint, emphasis or family', () => {
  it('saves an emphasis and family restriction over a range of days, and names the weeks it covers', async () => {
    const res = await coach.post(`/api/athletes/${athleteId}/restrictions`).send({
      emphasis: ['lockout'],
      families: ['rack pull', 'rack pull', 'board press'],
      fromDate: day(wk(3), 2),
      toDate: day(wk(6), 4),
      note: 'No heavy lockout work for a month',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      joint: null,
      maxStress: null,
      emphasis: ['lockout'],
      families: ['rack pull', 'board press'],
      fromWeek: wk(3),
      toWeek: wk(6),
      note: 'No heavy lockout work for a month',
      active: false,
      version: 1,
    });
    const athlete = await coach.get(`/api/athletes/${athleteId}`);
    expect(athlete.body.restrictions.map((r: { id: number }) => r.id)).toContain(res.body.id);
  });

  it('refuses a restriction that restricts nothing, a cap without its joint and an end before the start', async () => {
    const before = await restrictionCount();
    const none = await coach
      .post(`/api/athletes/${athleteId}/restrictions`)
      .send({ fromDate: day(wk(1)), note: 'nothing' });
    expect(none.status).toBe(422);
    expect(none.body.error.fields.joint).toEqual(['Restrict a joint, an emphasis or a family']);

    const capOnly = await coach
      .post(`/api/athletes/${athleteId}/restrictions`)
      .send({ maxStress: 1, fromDate: day(wk(1)) });
    expect(capOnly.status).toBe(422);
    expect(capOnly.body.error.fields.joint).toEqual(['Pick the joint this cap is for']);

    const backwards = await coach
      .post(`/api/athletes/${athleteId}/restrictions`)
      .send({ emphasis: ['bottom'], fromDate: day(wk(4)), toDate: day(wk(2)) });
    expect(backwards.status).toBe(422);
    expect(backwards.body.error.fields.toDate).toEqual(['The end cannot be before the start']);

    const badEmphasis = await coach
      .post(`/api/athletes/${athleteId}/restrictions`)
      .send({ emphasis: ['sideways'], fromDate: day(wk(1)) });
    expect(badEmphasis.status).toBe(422);
    expect(Object.keys(badEmphasis.body.error.fields)).toEqual(['emphasis.0']);
    expect(await restrictionCount()).toBe(before);
  });

  it('judges an edit as the whole restriction it leaves, and refuses a stale version', async () => {
    const id = await createRestriction(db(), team.teamId, athleteId, { joint: 'knee', maxStress: 1 });
    // Taking the joint away leaves nothing restricted.
    const empty = await coach
      .patch(`/api/athletes/${athleteId}/restrictions/${id}`)
      .send({ joint: null, maxStress: null, version: 1 });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields.joint).toEqual(['Restrict a joint, an emphasis or a family']);
    // A new end before the stored start.
    const early = await coach
      .patch(`/api/athletes/${athleteId}/restrictions/${id}`)
      .send({ toDate: '2025-01-01', version: 1 });
    expect(early.status).toBe(422);
    expect(early.body.error.fields.toDate).toBeDefined();

    const swapped = await coach
      .patch(`/api/athletes/${athleteId}/restrictions/${id}`)
      .send({ joint: null, maxStress: null, emphasis: ['bottom'], version: 1 });
    expect(swapped.status).toBe(200);
    expect(swapped.body).toMatchObject({ joint: null, maxStress: null, emphasis: ['bottom'], version: 2 });

    const stale = await head
      .patch(`/api/athletes/${athleteId}/restrictions/${id}`)
      .send({ families: ['good morning'], version: 1 });
    expect(stale.status).toBe(409);
    const [row] = await db().select().from(restrictions).where(eq(restrictions.id, id));
    expect(row).toMatchObject({ emphasis: ['bottom'], families: [], version: 2 });
  });

  it('keeps another team out of the athlete’s restrictions', async () => {
    const res = await otherCoach
      .post(`/api/athletes/${athleteId}/restrictions`)
      .send({ emphasis: ['bottom'], fromDate: day(wk(1)) });
    expect(res.status).toBe(404);
  });
});

describe('rest weeks', () => {
  const path = (week: string, id = athleteId) => `/api/athletes/${id}/rest-weeks/${week}`;
  const marked = async (id = athleteId) =>
    (await db().select().from(restWeeks).where(eq(restWeeks.athleteId, id))).map((r) => r.week).sort();

  it('marks a week once (marking it again changes nothing) and unmarks it', async () => {
    const first = await coach.put(path(wk(2)));
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ athleteId, week: wk(2) });
    const again = await head.put(path(wk(2)));
    expect(again.status).toBe(200);
    expect(await marked()).toEqual([wk(2)]);

    const gone = await coach.delete(path(wk(2)));
    expect(gone.status).toBe(204);
    expect(await marked()).toEqual([]);
    const missing = await coach.delete(path(wk(2)));
    expect(missing.status).toBe(404);
  });

  it('refuses a malformed or past week by field, and keeps athletes and other teams out', async () => {
    const bad = await coach.put(path('2027-W60'));
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['params.week']);
    const past = await coach.put(path(wk(-1)));
    expect(past.status).toBe(422);
    expect(past.body.error.fields.week[0]).toMatch(/Past weeks are history/);

    expect((await athleteAgent.put(path(wk(3)))).status).toBe(403);
    expect((await otherCoach.put(path(wk(3)))).status).toBe(404);
    const theirs = await createAthlete(db(), other.teamId, { name: 'Their athlete' });
    expect((await coach.put(path(wk(3), theirs))).status).toBe(404);
    expect(await marked()).toEqual([]);
    expect(await marked(theirs)).toEqual([]);
  });

  it('hands rest weeks, the risk ceiling, dated restrictions and meet-phase tags to the board', async () => {
    await coach.put(path(wk(1))).expect(201);
    await createVariant(db(), team.teamId, { name: 'Opener single, planning', lift: 'squat', meetPhaseWeeks: 3 });
    const res = await coach.get(`/api/board?from=${thisWeek}&to=${wk(8)}`);
    expect(res.status).toBe(200);
    const board = res.body as BoardData;
    const ines = board.athletes.find((a) => a.id === athleteId)!;
    expect(ines.restWeeks).toEqual([wk(1)]);
    expect(ines.maxRisk).toBe(2);
    expect(ines.restrictions.some((r) => r.emphasis.includes('lockout') && r.families.includes('rack pull'))).toBe(
      true,
    );
    expect(board.variants.find((v) => v.name === 'Opener single, planning')!.meetPhaseWeeks).toBe(3);
    expect(board.rules).toMatchObject({ comfortRatio: 0.8, liftBalanceWeeks: 3 });
    await coach.delete(path(wk(1))).expect(204);
  });
});

describe('the heaviest risk allowed on the roster', () => {
  it('saves, clears and refuses a risk ceiling by field', async () => {
    const current = await coach.get(`/api/athletes/${athleteId}`);
    const set = await coach.patch(`/api/athletes/${athleteId}`).send({ maxRisk: 1, version: current.body.version });
    expect(set.status).toBe(200);
    expect(set.body.maxRisk).toBe(1);
    const cleared = await coach.patch(`/api/athletes/${athleteId}`).send({ maxRisk: null, version: set.body.version });
    expect(cleared.body.maxRisk).toBeNull();
    const bad = await coach.patch(`/api/athletes/${athleteId}`).send({ maxRisk: 4, version: cleared.body.version });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['maxRisk']);
    const stale = await coach.patch(`/api/athletes/${athleteId}`).send({ maxRisk: 2, version: set.body.version });
    expect(stale.status).toBe(409);
    await coach.patch(`/api/athletes/${athleteId}`).send({ maxRisk: 2, version: cleared.body.version }).expect(200);
  });
});

describe('team rules: comfort and lift balance', () => {
  it('saves the comfort share and the lift balance span, and refuses an unknown field with nothing saved', async () => {
    const doc = await head.get('/api/rules');
    expect(doc.body.rules).toMatchObject({ comfortRatio: 0.8, liftBalanceWeeks: 3 });
    const saved = await head.put('/api/rules').send({
      rules: { ...doc.body.rules, comfortRatio: 0.75, liftBalanceWeeks: 4 },
      equipment: doc.body.equipment,
      version: doc.body.version,
    });
    expect(saved.status).toBe(200);
    expect(saved.body.rules).toMatchObject({ comfortRatio: 0.75, liftBalanceWeeks: 4 });

    const unknown = await head.put('/api/rules').send({
      rules: { ...saved.body.rules, restWeekEvery: 4 },
      equipment: saved.body.equipment,
      version: saved.body.version,
    });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields).toHaveProperty('rules');
    const outOfRange = await head.put('/api/rules').send({
      rules: { ...saved.body.rules, comfortRatio: 1.4, liftBalanceWeeks: 1 },
      equipment: saved.body.equipment,
      version: saved.body.version,
    });
    expect(outOfRange.status).toBe(422);
    expect(Object.keys(outOfRange.body.error.fields).sort()).toEqual(['rules.comfortRatio', 'rules.liftBalanceWeeks']);
    const [row] = await db()
      .select()
      .from(teamRules)
      .where(and(eq(teamRules.teamId, team.teamId)));
    expect(row!.rules).toMatchObject({ comfortRatio: 0.75, liftBalanceWeeks: 4 });
    expect(row!.rules).not.toHaveProperty('restWeekEvery');
  });
});

describe('meet-phase variants in the library', () => {
  it('saves "only within N weeks of a meet", refuses it out of range, and carries it through the CSV', async () => {
    const created = await coach.post('/api/variants').send({
      name: 'Opener bench single',
      lift: 'bench',
      family: 'competition press',
      bar: 'straight',
      equipment: [],
      emphasis: 'midRange',
      stress: { shoulder: 2 },
      risk: 1,
      specificity: 1,
      scheme: 'single',
      meetPhaseWeeks: 3,
    });
    expect(created.status).toBe(201);
    expect(created.body.meetPhaseWeeks).toBe(3);
    const bad = await coach
      .patch(`/api/variants/${created.body.id}`)
      .send({ meetPhaseWeeks: 40, version: created.body.version });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['meetPhaseWeeks']);

    const csv = await coach.get('/api/variants/export');
    expect(csv.status).toBe(200);
    const [header, ...lines] = csv.text.trim().split(/\r?\n/);
    const col = header!.split(',').indexOf('meet_phase_weeks');
    expect(col).toBeGreaterThan(-1);
    const line = lines.find((l) => l.startsWith('Opener bench single'))!;
    expect(line.split(',')[col]).toBe('3');
  });
});
