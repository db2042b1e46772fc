// Logging top sets: validation with field errors, unit conversion, e1RM and record detection, and
// scoping (another athlete's or another team's plan entry is not found).
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createPlanEntry,
  publishAthleteWeek,
  createTeam,
  createTopSet,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const thisWeek = weekOfDate(new Date());
let team: TestTeam;
let other: TestTeam;
let athlete: request.Agent;
let variantId: number;
let entryId: number;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  variantId = await createVariant(db, team.teamId, { name: `Box squat ${Date.now()}`, scheme: 'triple' });
  entryId = await createPlanEntry(db, team.teamId, team.athleteId, variantId, { week: thisWeek });
  await publishAthleteWeek(db, team.teamId, team.athleteId, thisWeek);
  // Earlier history on the same variant: best e1RM 150 × (1 + 3/30) = 165, heaviest 155 × 1.
  await createTopSet(db, team.teamId, team.athleteId, variantId, {
    weightKg: 150,
    reps: 3,
    week: addWeeks(thisWeek, -4),
    performedOn: '2026-01-05',
  });
  await createTopSet(db, team.teamId, team.athleteId, variantId, {
    weightKg: 155,
    reps: 1,
    week: addWeeks(thisWeek, -2),
    performedOn: '2026-01-19',
  });
  athlete = await t.signIn(team.athleteUser.email);
});

describe('POST /api/top-sets', () => {
  it('answers every bad field at once, with the reason', async () => {
    const res = await athlete
      .post('/api/top-sets')
      .send({ planEntryId: 'x', unit: 'stone', weight: -5, reps: 0, rpe: 7.3, note: 'n'.repeat(501) });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['note', 'planEntryId', 'reps', 'rpe', 'unit', 'weight']);
  });

  it('refuses RPE outside 6–10 and reps beyond what an e1RM can be read from', async () => {
    const low = await athlete
      .post('/api/top-sets')
      .send({ planEntryId: entryId, unit: 'kg', weight: 100, reps: 3, rpe: 5.5 });
    expect(low.status).toBe(422);
    expect(low.body.error.fields.rpe[0]).toMatch(/6 to 10 in half steps/);
    const many = await athlete.post('/api/top-sets').send({ planEntryId: entryId, unit: 'kg', weight: 100, reps: 13 });
    expect(many.body.error.fields.reps[0]).toMatch(/At most 12 reps/);
    const toFailure = await athlete
      .post('/api/top-sets')
      .send({ planEntryId: entryId, unit: 'kg', weight: 100, reps: 10, rpe: 7 });
    expect(toFailure.body.error.fields.rpe[0]).toMatch(/at most 12/);
  });

  it('logs a set below the record without marking one, e1RM by Epley on reps done plus reps in reserve', async () => {
    const res = await athlete
      .post('/api/top-sets')
      .send({ planEntryId: entryId, unit: 'kg', weight: 140, reps: 3, rpe: 8 });
    expect(res.status).toBe(201);
    // RPE 8 leaves two reps (Zourdos et al., JSCR 2016), so 3 + 2 = 5 reps to failure (common practice);
    // Epley (1985): w × (1 + r/30) = 140 × (1 + 5/30) = 163.33.
    expect(res.body.topSet).toMatchObject({
      weightKg: 140,
      reps: 3,
      rpe: 8,
      e1rmKg: 163.33,
      week: thisWeek,
      variantId,
    });
    expect(res.body).toMatchObject({ newRecord: false, newHeaviest: false, firstOnVariant: false });
    expect(res.body.previousBest.e1rmKg).toBe(165);
  });

  it('marks a new record when the e1RM beats every earlier set on the variant', async () => {
    const res = await athlete.post('/api/top-sets').send({ planEntryId: entryId, unit: 'kg', weight: 152.5, reps: 3 });
    expect(res.status).toBe(201);
    expect(res.body.topSet.e1rmKg).toBe(167.75);
    expect(res.body).toMatchObject({ newRecord: true, newHeaviest: false });
    const week = await athlete.get('/api/my-week');
    const pick = week.body.picks.find((p: { planEntryId: number }) => p.planEntryId === entryId);
    expect(pick.record.bestE1rm.e1rmKg).toBe(167.75);
    expect(pick.record.heaviest.weightKg).toBe(155);
    expect(pick.lastTime.weightKg).toBe(155);
    expect(pick.logged).toHaveLength(2);
  });

  it('converts pounds to kilograms for storage (1 lb = 0.45359237 kg, by definition)', async () => {
    const res = await athlete.post('/api/top-sets').send({ planEntryId: entryId, unit: 'lb', weight: 345, reps: 1 });
    expect(res.status).toBe(201);
    // 345 lb × 0.45359237 = 156.489 kg → 156.49; heavier than the 155 kg single.
    expect(res.body.topSet.weightKg).toBe(156.49);
    expect(res.body.newHeaviest).toBe(true);
  });

  it('marks the first set on a variant as the first mark to beat', async () => {
    const db = t.ctx.database.db;
    const v = await createVariant(db, team.teamId);
    const e = await createPlanEntry(db, team.teamId, team.athleteId, v, { week: thisWeek, slotId: 'upper' });
    const res = await athlete.post('/api/top-sets').send({ planEntryId: e, unit: 'kg', weight: 80, reps: 5 });
    expect(res.body).toMatchObject({ firstOnVariant: true, newRecord: true, newHeaviest: true, previousBest: null });
  });

  it("answers 404 for another athlete's entry, of the same team or another", async () => {
    const db = t.ctx.database.db;
    const mate = await createAthlete(db, team.teamId);
    const mateEntry = await createPlanEntry(db, team.teamId, mate, variantId, { week: thisWeek });
    const otherVariant = await createVariant(db, other.teamId);
    const otherEntry = await createPlanEntry(db, other.teamId, other.athleteId, otherVariant, { week: thisWeek });
    for (const id of [mateEntry, otherEntry, 999_999_999]) {
      const res = await athlete.post('/api/top-sets').send({ planEntryId: id, unit: 'kg', weight: 100, reps: 1 });
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });

  it('refuses a week that has not started', async () => {
    const later = await createPlanEntry(t.ctx.database.db, team.teamId, team.athleteId, variantId, {
      week: addWeeks(thisWeek, 2),
    });
    const res = await athlete.post('/api/top-sets').send({ planEntryId: later, unit: 'kg', weight: 100, reps: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.planEntryId[0]).toMatch(/not started/);
  });
});

describe('GET /api/top-sets', () => {
  it('lists the athlete’s own sets per variant with total, limit, offset and sort', async () => {
    const res = await athlete.get(`/api/top-sets?variantId=${variantId}&sort=e1rm&limit=2`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(5);
    expect(res.body.items).toHaveLength(2);
    expect(res.body.items[0].e1rmKg).toBeGreaterThanOrEqual(res.body.items[1].e1rmKg);
    const page2 = await athlete.get(`/api/top-sets?variantId=${variantId}&sort=e1rm&limit=2&offset=2`);
    expect(page2.body.items.map((s: { id: number }) => s.id)).not.toContain(res.body.items[0].id);
  });

  it('lets a coach read an athlete of the team, names the missing athlete, and hides other teams', async () => {
    const coach = await t.signIn(team.coach.email);
    expect((await coach.get(`/api/top-sets?athleteId=${team.athleteId}`)).body.total).toBeGreaterThan(0);
    const missing = await coach.get('/api/top-sets');
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields['query.athleteId']).toBeDefined();
    expect((await coach.get(`/api/top-sets?athleteId=${other.athleteId}`)).status).toBe(404);
    expect((await athlete.get(`/api/top-sets?athleteId=${other.athleteId}`)).status).toBe(404);
  });
});

describe('GET /api/my-history', () => {
  it('gives records per variant and e1RM points per competition lift with the variant’s specificity', async () => {
    const res = await athlete.get('/api/my-history');
    expect(res.status).toBe(200);
    const v = res.body.variants.find((x: { variantId: number }) => x.variantId === variantId);
    expect(v.count).toBe(5);
    expect(v.record.bestE1rm.e1rmKg).toBe(167.75);
    expect(res.body.series.e1rm.squat.length).toBeGreaterThanOrEqual(5);
    expect(res.body.series.e1rm.squat[0]).toMatchObject({ specificity: 0.5, variantId });
    const dates = res.body.series.e1rm.squat.map((p: { performedOn: string }) => p.performedOn);
    expect(dates).toEqual([...dates].sort());
  });
});
