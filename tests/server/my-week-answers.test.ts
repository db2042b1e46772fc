// The athlete's week, rebuilt on one query per concern, answers exactly as the earlier implementation
// (kept in tests/support as the reference) did, for every demo athlete over past, current and coming weeks;
// and what it keeps between requests (parsed rules, generated tissue work) never shows one athlete another's
// week or a stale one after a coach's change.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { DEFAULT_TEAM_RULES } from '../../shared/schemas/rules';
import { createDatabase, type Database } from '../../server/db/client';
import { athletes, planEntries, sessionLogs, teams, users } from '../../server/db/schema';
import { seedDemoIfEmpty } from '../../server/db/seed/demo';
import { myWeek } from '../../server/modules/my-week/my-week.service';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createPlanEntry,
  createTeam,
  createTopSet,
  publishAthleteWeek,
  createUser,
  createVariant,
  type TestTeam,
} from '../support/factories';
import { recreateDatabase } from '../support/integration-setup';
import { referenceMyWeek } from '../support/my-week-reference';

describe('my-week answers on the demo data', () => {
  let database: Database;
  const now = new Date();
  const thisWeek = weekOfDate(now);

  beforeAll(async () => {
    database = createDatabase(await recreateDatabase('rackturn_myweek_answers'), { connectionLimit: 8 });
    await seedDemoIfEmpty(database.db, now);
  }, 90_000);
  afterAll(() => database?.close());

  it('matches the reference for every athlete of the club over thirteen weeks, in either unit', async () => {
    const db = database.db;
    const [club] = await db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const roster = await db.select().from(athletes).where(eq(athletes.teamId, club!.id));
    expect(roster.length).toBeGreaterThanOrEqual(12);
    // A set logged this week too, so the week's own sets are compared, not only the history.
    const [entry] = await db.select().from(planEntries).where(eq(planEntries.week, thisWeek)).limit(1);
    await createTopSet(db, entry!.teamId, entry!.athleteId, entry!.variantId!, {
      planEntryId: entry!.id,
      week: thisWeek,
      performedOn: now.toISOString().slice(0, 10),
      weightKg: 182.5,
      reps: 2,
    });
    // A session logged this week, so the sessions' logs are compared too.
    await db.insert(sessionLogs).values({
      teamId: entry!.teamId,
      athleteId: entry!.athleteId,
      week: thisWeek,
      sessionId: 'upper-speed',
      speedSetsDone: 5,
      accessorySetsDone: [3],
      done: true,
    });
    const ctx = { database };
    const weeks = [undefined, ...[-12, -6, -2, -1, 0, 1, 2, 5].map((n) => addWeeks(thisWeek, n))];
    let compared = 0;
    for (const [i, a] of roster.entries()) {
      const who = { teamId: club!.id, athleteId: a.id, unit: i % 2 ? ('lb' as const) : ('kg' as const) };
      for (const week of weeks) {
        const reference = await referenceMyWeek(ctx, who, week, now);
        const rebuilt = await myWeek(ctx, who, week, now);
        expect(rebuilt, `${a.name}, ${week ?? 'this week'}`).toStrictEqual(reference);
        // Asked again, from what the service keeps between requests: still the same.
        expect(await myWeek(ctx, who, week, now)).toStrictEqual(reference);
        compared += 1;
      }
    }
    expect(compared).toBe(roster.length * weeks.length);
  }, 120_000);

  it('answers not found for an athlete of another team, as the reference does', async () => {
    const db = database.db;
    const [club] = await db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const [outsider] = await db
      .select()
      .from(athletes)
      .where(eq(athletes.teamId, club!.id + 1));
    const who = { teamId: club!.id, athleteId: outsider!.id, unit: 'kg' as const };
    await expect(referenceMyWeek({ database }, who, undefined)).rejects.toThrow(/roster entry/);
    await expect(myWeek({ database }, who, undefined)).rejects.toThrow(/roster entry/);
  });
});

describe('what my-week keeps between requests', () => {
  const t = useTestApp();
  const thisWeek = weekOfDate(new Date());
  let team: TestTeam;
  let other: TestTeam;
  let first: request.Agent;
  let second: request.Agent;
  let otherAthlete: request.Agent;
  let secondId: number;
  const variantsOf: Record<string, number> = {};

  beforeAll(async () => {
    const db = t.ctx.database.db;
    team = await createTeam(db);
    other = await createTeam(db);
    for (const name of ['Pin squat', 'Box squat', 'Deficit deadlift']) {
      const lift = name.includes('dead') ? 'deadlift' : 'squat';
      variantsOf[name] = await createVariant(db, team.teamId, { name: `${name} ${Date.now()}`, lift });
    }
    const secondUser = await createUser(db, team.teamId, 'athlete');
    secondId = await createAthlete(db, team.teamId, { userId: secondUser.id, name: 'Second Athlete' });
    await createPlanEntry(db, team.teamId, team.athleteId, variantsOf['Pin squat']!, { week: thisWeek });
    await createPlanEntry(db, team.teamId, secondId, variantsOf['Deficit deadlift']!, { week: thisWeek });
    const otherVariant = await createVariant(db, other.teamId, { name: `Anderson squat ${Date.now()}` });
    await createPlanEntry(db, other.teamId, other.athleteId, otherVariant, { week: thisWeek });
    // Athletes see a week once the coach has published it.
    await publishAthleteWeek(db, team.teamId, team.athleteId, thisWeek);
    await publishAthleteWeek(db, team.teamId, secondId, thisWeek);
    await publishAthleteWeek(db, other.teamId, other.athleteId, thisWeek);
    first = await t.signIn(team.athleteUser.email);
    second = await t.signIn(secondUser.email);
    otherAthlete = await t.signIn(other.athleteUser.email);
  });

  const pickIds = async (agent: request.Agent) => {
    const res = await agent.get('/api/my-week');
    expect(res.status).toBe(200);
    return {
      athlete: res.body.athlete.id as number,
      variants: (res.body.picks as { variant: { id: number } }[]).map((p) => p.variant.id),
      labels: (res.body.picks as { slotLabel: string }[]).map((p) => p.slotLabel),
      tissue: res.body.tissue,
    };
  };

  it('gives each athlete their own week however the requests interleave', async () => {
    for (let round = 0; round < 3; round++) {
      const answers = await Promise.all([pickIds(first), pickIds(second), pickIds(otherAthlete), pickIds(first)]);
      expect(answers[0]).toMatchObject({ athlete: team.athleteId, variants: [variantsOf['Pin squat']] });
      expect(answers[3]).toStrictEqual(answers[0]);
      expect(answers[1]).toMatchObject({ athlete: secondId, variants: [variantsOf['Deficit deadlift']] });
      expect(answers[2].athlete).toBe(other.athleteId);
      expect(answers[2].variants).not.toContain(variantsOf['Pin squat']);
    }
  });

  it('shows a coach’s new pick and the team’s new slot names on the very next request', async () => {
    expect((await pickIds(first)).variants).toEqual([variantsOf['Pin squat']]);
    const coach = await t.signIn(team.headCoach.email);
    const [cell] = await t.ctx.database.db
      .select()
      .from(planEntries)
      .where(and(eq(planEntries.athleteId, team.athleteId), eq(planEntries.week, thisWeek)));
    const moved = await coach
      .put(`/api/plans/${team.athleteId}/${thisWeek}/lower`)
      .send({ variantId: variantsOf['Box squat'], version: cell!.version });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect((await pickIds(first)).variants).toEqual([variantsOf['Box squat']]);

    const rules = await coach.get('/api/rules');
    const renamed = {
      ...rules.body.rules,
      slots: rules.body.rules.slots.map((s: { id: string; label: string }) =>
        s.id === 'lower' ? { ...s, label: 'Heavy day, lower' } : s,
      ),
    };
    const saved = await coach
      .put('/api/rules')
      .send({ rules: renamed, equipment: rules.body.equipment, version: rules.body.version });
    expect(saved.status).toBe(200);
    expect((await pickIds(first)).labels).toEqual(['Heavy day, lower']);
    // Another team's rules and page are untouched.
    const otherLabels = (await pickIds(otherAthlete)).labels;
    expect(otherLabels).toEqual([DEFAULT_TEAM_RULES.slots.find((s) => s.id === 'lower')!.label]);
  });

  it('shows the athlete’s own unit change at once', async () => {
    await t.ctx.database.db.update(users).set({ unit: 'lb' }).where(eq(users.id, team.athleteUser.id));
    // The unit is changed in the database directly here, so the signed-in session's own short cache is
    // dropped as a change of account would drop it; what is checked is that My week keeps no copy of it.
    t.ctx.sessions.forgetWhere((a) => a.userId === team.athleteUser.id);
    expect((await first.get('/api/my-week')).body.unit).toBe('lb');
  });
});
