// The athlete's week page: picks in slot order with their scheme, last time and record, the unit the
// athlete chose, tissue work with its cautions, and the check-in weeks.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { eq } from 'drizzle-orm';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { TISSUE_CAUTION } from '../../shared/engine/tissue';
import { users } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import {
  createPlanEntry,
  publishAthleteWeek,
  createTeam,
  createTopSet,
  createUser,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const thisWeek = weekOfDate(new Date());
let team: TestTeam;
let athlete: request.Agent;
let squat: number;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  await db.update(users).set({ unit: 'lb' }).where(eq(users.id, team.athleteUser.id));
  squat = await createVariant(db, team.teamId, { name: `Safety-bar box squat ${Date.now()}`, scheme: 'five' });
  const bench = await createVariant(db, team.teamId, {
    lift: 'bench',
    name: `Floor press ${Date.now()}`,
    scheme: 'triple',
  });
  // Inserted upper first: the page must still follow the team's slot order (lower, then upper).
  await createPlanEntry(db, team.teamId, team.athleteId, bench, { week: thisWeek, slotId: 'upper' });
  await createPlanEntry(db, team.teamId, team.athleteId, squat, { week: thisWeek, slotId: 'lower' });
  await publishAthleteWeek(db, team.teamId, team.athleteId, thisWeek);
  await createTopSet(db, team.teamId, team.athleteId, squat, {
    weightKg: 140,
    reps: 5,
    week: addWeeks(thisWeek, -6),
    performedOn: '2026-01-01',
  });
  await createTopSet(db, team.teamId, team.athleteId, squat, {
    weightKg: 135,
    reps: 5,
    week: addWeeks(thisWeek, -3),
    performedOn: '2026-01-22',
  });
  athlete = await t.signIn(team.athleteUser.email);
});

describe('GET /api/my-week', () => {
  it('lists the picks with scheme, last time and record, in the athlete’s unit', async () => {
    const res = await athlete.get('/api/my-week');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ week: thisWeek, unit: 'lb', athlete: { id: team.athleteId, sex: 'F' } });
    expect(res.body.picks.map((p: { slotId: string }) => p.slotId)).toEqual(['lower', 'upper']);
    const [lower, upper] = res.body.picks;
    expect(lower).toMatchObject({
      slotLabel: 'Lower max effort',
      scheme: 'five',
      schemeReps: 5,
      variant: { id: squat, lift: 'squat' },
    });
    expect(lower.lastTime).toMatchObject({ weightKg: 135, reps: 5 });
    expect(lower.record.bestE1rm).toMatchObject({ weightKg: 140 });
    expect(upper).toMatchObject({
      scheme: 'triple',
      schemeReps: 3,
      lastTime: null,
      record: { bestE1rm: null, heaviest: null },
    });
  });

  it('carries the week’s tissue work with the usual cautions, and this and last week’s check-ins', async () => {
    const res = await athlete.get('/api/my-week');
    expect(res.body.tissue.items.length).toBeGreaterThan(0);
    expect(res.body.tissue.items[0].instructions.length).toBeGreaterThan(0);
    expect(res.body.tissue.notes).toEqual(expect.arrayContaining([...TISSUE_CAUTION]));
    expect(res.body.checkins.map((c: { week: string }) => c.week)).toEqual([thisWeek, addWeeks(thisWeek, -1)]);
    expect(res.body.checkins[1].kind).toBeNull(); // nothing was prescribed last week
  });

  it('reads another week when asked, and checks the week', async () => {
    const next = await athlete.get(`/api/my-week?week=${addWeeks(thisWeek, 1)}`);
    expect(next.body.picks).toEqual([]);
    const bad = await athlete.get('/api/my-week?week=2027-13');
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['query.week']).toBeDefined();
  });

  it('answers 404 for an athlete account with no roster entry', async () => {
    const lone = await createUser(t.ctx.database.db, team.teamId, 'athlete');
    const agent = await t.signIn(lone.email);
    const res = await agent.get('/api/my-week');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/roster entry/);
  });
});
