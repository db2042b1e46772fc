// The coach's review of one athlete: records, series, videos and check-ins of that athlete only.
import { beforeAll, describe, expect, it } from 'vitest';
import { weekOfDate } from '../../shared/engine/weeks';
import { bodyweights } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createAthlete, createTeam, createTopSet, createVariant, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  const deadlift = await createVariant(db, team.teamId, { lift: 'deadlift', specificity: 0.9 });
  await createTopSet(db, team.teamId, team.athleteId, deadlift, { weightKg: 180, reps: 3, performedOn: '2026-02-02' });
  await createTopSet(db, team.teamId, team.athleteId, deadlift, { weightKg: 190, reps: 1, performedOn: '2026-02-16' });
  await db.insert(bodyweights).values([
    { teamId: team.teamId, athleteId: team.athleteId, measuredOn: '2026-02-01', weightKg: 70.2 },
    { teamId: team.teamId, athleteId: team.athleteId, measuredOn: '2026-02-08', weightKg: 70.6 },
  ]);
  // A team-mate's rows must not show up.
  const mate = await createAthlete(db, team.teamId);
  await createTopSet(db, team.teamId, mate, deadlift, { weightKg: 250, reps: 1 });
});

describe('GET /api/athletes/:id/review', () => {
  it('gives a coach the athlete’s records and series', async () => {
    const coach = await t.signIn(team.headCoach.email);
    const res = await coach.get(`/api/athletes/${team.athleteId}/review`);
    expect(res.status).toBe(200);
    expect(res.body.week).toBe(weekOfDate(new Date()));
    expect(res.body.athlete.id).toBe(team.athleteId);
    // Epley: 180 × (1 + 3/30) = 198 beats the 190 single as the best estimate; 190 is the heaviest.
    expect(res.body.variants[0].record.bestE1rm.e1rmKg).toBe(198);
    expect(res.body.variants[0].record.heaviest.weightKg).toBe(190);
    expect(res.body.series.e1rm.deadlift.map((p: { e1rmKg: number }) => p.e1rmKg)).toEqual([198, 190]);
    expect(res.body.series.e1rm.squat).toEqual([]);
    expect(res.body.series.bodyweight.map((b: { weightKg: number }) => b.weightKg)).toEqual([70.2, 70.6]);
    expect(res.body).toMatchObject({ suggestions: [], checkins: [], videos: [] });
  });

  it('answers 404 for an unknown id or another team’s athlete', async () => {
    const coach = await t.signIn(team.coach.email);
    expect((await coach.get(`/api/athletes/${other.athleteId}/review`)).status).toBe(404);
    expect((await coach.get('/api/athletes/999999999/review')).status).toBe(404);
    const bad = await coach.get('/api/athletes/abc/review');
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['params.id']).toBeDefined();
  });
});
