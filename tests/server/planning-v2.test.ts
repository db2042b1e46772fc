// Stored planning facts judged by the engine's version-2 rules through the API: dated restrictions apply
// only in their weeks, rest weeks stay empty after Fill, archived, meet-phase and risk-ceiling variants are
// refused with their own rules, and the board's live check agrees with the server for a dated restriction.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { addWeeks, mondayOf, weekOfDate } from '../../shared/engine/weeks';
import type { BoardData } from '../../shared/schemas';
import { planEntries } from '../../server/db/schema';
import { buildBoardModel, cellKey, prepareRatings } from '../../src/features/board/model/board-model';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createPlanEntry,
  createPlanLibrary,
  createRestriction,
  createTeam,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);
const day = (week: string, offset = 0) =>
  new Date(mondayOf(week).getTime() + offset * 86_400_000).toISOString().slice(0, 10);

let team: TestTeam;
let coach: request.Agent;

beforeAll(async () => {
  team = await createTeam(db());
  await createPlanLibrary(db(), team.teamId);
  coach = await t.signIn(team.coach.email);
});

const picksOf = async (athleteId: number) =>
  db()
    .select()
    .from(planEntries)
    .where(and(eq(planEntries.teamId, team.teamId), eq(planEntries.athleteId, athleteId)));

describe('version-2 rules through the API', () => {
  it('a restriction dated W+3..W+6 leaves W+1 free in save and in the board, and holds in W+4', async () => {
    const athleteId = await createAthlete(db(), team.teamId, { name: 'Dated Lockout' });
    const lockout = await createVariant(db(), team.teamId, {
      name: 'Dated lockout squat',
      family: 'dated lockout',
      emphasis: 'lockout',
    });
    await createRestriction(db(), team.teamId, athleteId, {
      joint: null,
      maxStress: null,
      emphasis: ['lockout'],
      fromDate: day(wk(3)),
      toDate: day(wk(6), 6),
    });
    const board = (await coach.get(`/api/board?from=${thisWeek}&to=${wk(8)}`)).body as BoardData;
    const ratings = prepareRatings(buildBoardModel(board), { kind: 'library', variantId: lockout });
    expect(ratings.get(cellKey(athleteId, wk(1), 'lower'))!.breaks).toEqual([]);
    expect(ratings.get(cellKey(athleteId, wk(4), 'lower'))!.breaks.length).toBeGreaterThan(0);

    const free = await coach.put(`/api/plans/${athleteId}/${wk(1)}/lower`).send({ variantId: lockout });
    expect(free.status).toBe(201);
    const held = await coach.put(`/api/plans/${athleteId}/${wk(4)}/lower`).send({ variantId: lockout });
    expect(held.status).toBe(422);
    expect(held.body.error.violations[0].rule).toBe('restriction');
  });

  it('a rest week stays empty after Fill, and an unpinned pick there is cleared', async () => {
    const athleteId = await createAthlete(db(), team.teamId, { name: 'Rest Week' });
    const squat = await createVariant(db(), team.teamId, { name: 'Rest week squat', family: 'rest week' });
    await createPlanEntry(db(), team.teamId, athleteId, squat, { week: wk(1) });
    await coach.put(`/api/athletes/${athleteId}/rest-weeks/${wk(1)}`).expect(201);
    const res = await coach.post('/api/plans/generate').send({ weeks: 'next', athleteIds: [athleteId] });
    expect(res.status).toBe(200);
    expect(res.body.unfilled).toEqual([]);
    const picks = (await picksOf(athleteId)).filter((p) => p.week === wk(1));
    expect(picks.every((p) => p.variantId === null)).toBe(true);
    expect(picks.some((p) => p.reasons.some((r) => r.includes('rest week')))).toBe(true);
  });

  it('never picks an archived variant, and refuses a risk above the athlete’s ceiling with its own rule', async () => {
    const athleteId = await createAthlete(db(), team.teamId, { name: 'Ceiling Two', maxRisk: 2 });
    const archived = await createVariant(db(), team.teamId, {
      name: 'Archived favourite',
      family: 'archived favourite',
      specificity: 1,
      archivedAt: new Date(),
    });
    const risky = await createVariant(db(), team.teamId, { name: 'Risk three squat', family: 'risk three', risk: 3 });
    const res = await coach
      .post('/api/plans/generate')
      .send({ weeks: { from: wk(1), to: wk(8) }, athleteIds: [athleteId] });
    expect(res.status).toBe(200);
    const picked = (await picksOf(athleteId)).map((p) => p.variantId);
    expect(picked).not.toContain(archived);
    expect(picked).not.toContain(risky);
    const refused = await coach.put(`/api/plans/${athleteId}/${wk(10)}/lower`).send({ variantId: risky });
    expect(refused.status).toBe(422);
    expect(refused.body.error.violations.map((v: { rule: string }) => v.rule)).toContain('riskCeiling');
  });

  it('keeps a meet-phase variant out of weeks far from the meet', async () => {
    const athleteId = await createAthlete(db(), team.teamId, { name: 'Far From Meet' });
    const opener = await createVariant(db(), team.teamId, {
      name: 'Opener single, far',
      family: 'opener far',
      specificity: 1,
      meetPhaseWeeks: 3,
    });
    const refused = await coach.put(`/api/plans/${athleteId}/${wk(2)}/lower`).send({ variantId: opener });
    expect(refused.status).toBe(422);
    expect(refused.body.error.violations.map((v: { rule: string }) => v.rule)).toContain('meetPhase');
  });
});
