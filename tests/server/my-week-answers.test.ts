// The athlete's week, rebuilt on one query per concern, answers exactly as the earlier implementation
// (kept in tests/support as the reference) did, for every demo athlete over past, current and coming weeks;
// and what it keeps between requests (parsed rules, generated tissue work, whole answers checked against the
// fingerprint of their rows) never shows one athlete another's week, or a stale one after any write an
// athlete or coach makes, even when the write goes through another app instance on the same database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import type { MyWeek } from '../../shared/schemas';
import { DEFAULT_TEAM_RULES } from '../../shared/schemas/rules';
import { createDatabase, type Database } from '../../server/db/client';
import * as schema from '../../server/db/schema';
import { athletes, planEntries, sessionLogs, teams, users } from '../../server/db/schema';
import { seedDemoIfEmpty } from '../../server/db/seed/demo';
import { FINGERPRINT_TABLES } from '../../server/modules/my-week/my-week.repository';
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

/** A pin squat, a box squat and a deficit deadlift in the team's library, by name. */
async function threeVariants(db: Database['db'], teamId: number) {
  const ids: Record<string, number> = {};
  for (const name of ['Pin squat', 'Box squat', 'Deficit deadlift']) {
    const lift = name.includes('dead') ? 'deadlift' : 'squat';
    ids[name] = await createVariant(db, teamId, { name: `${name} ${Date.now()}`, lift });
  }
  return ids;
}

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
    Object.assign(variantsOf, await threeVariants(db, team.teamId));
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

describe('kept answers across two app instances on one database', () => {
  // Two instances, each with its own pool and its own kept answers: the athlete reads through the first,
  // every write goes through the second, and the first must show it on the very next request.
  const reader = useTestApp();
  const writer = useTestApp();
  const thisWeek = weekOfDate(new Date());
  const nextWeek = addWeeks(thisWeek, 1);
  let team: TestTeam;
  let athlete: request.Agent;
  let athleteThere: request.Agent;
  let coachThere: request.Agent;
  let lowerEntry: number;
  const variantsOf: Record<string, number> = {};

  beforeAll(async () => {
    const db = reader.ctx.database.db;
    team = await createTeam(db);
    Object.assign(variantsOf, await threeVariants(db, team.teamId));
    lowerEntry = await createPlanEntry(db, team.teamId, team.athleteId, variantsOf['Pin squat']!, { week: thisWeek });
    await createPlanEntry(db, team.teamId, team.athleteId, variantsOf['Deficit deadlift']!, {
      week: nextWeek,
      slotId: 'lower',
    });
    await publishAthleteWeek(db, team.teamId, team.athleteId, thisWeek);
    athlete = await reader.signIn(team.athleteUser.email);
    athleteThere = await writer.signIn(team.athleteUser.email);
    coachThere = await writer.signIn(team.headCoach.email);
  });

  /** The page through the first instance, checked against a fresh read that keeps nothing. */
  const page = async (week?: string) => {
    const res = await athlete.get(week ? `/api/my-week?week=${week}` : '/api/my-week');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const who = { teamId: team.teamId, athleteId: team.athleteId, unit: res.body.unit as 'kg' | 'lb' };
    const fresh = JSON.parse(JSON.stringify(await myWeek(reader.ctx, who, week))) as unknown;
    expect(res.body).toStrictEqual(fresh);
    return res.body as MyWeek;
  };

  /** Reads the page (so the first instance keeps it), writes through the second, reads again. */
  async function afterWrite(write: () => Promise<{ status: number; body: unknown }>, week?: string) {
    const before = await page(week);
    expect(await page(week)).toStrictEqual(before);
    const res = await write();
    expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
    const after = await page(week);
    expect(after).not.toStrictEqual(before);
    return after;
  }

  it('shows a coach’s changed pick, renamed variant and renamed slot', async () => {
    const [cell] = await reader.ctx.database.db.select().from(planEntries).where(eq(planEntries.id, lowerEntry));
    let after = await afterWrite(() =>
      coachThere
        .put(`/api/plans/${team.athleteId}/${thisWeek}/lower`)
        .send({ variantId: variantsOf['Box squat'], version: cell!.version, reason: 'Coach’s call this week' }),
    );
    expect(after.picks.map((p) => p.variant.id)).toEqual([variantsOf['Box squat']]);

    const variant = await coachThere.get(`/api/variants/${variantsOf['Box squat']}`);
    after = await afterWrite(() =>
      coachThere
        .patch(`/api/variants/${variantsOf['Box squat']}`)
        .send({ name: 'Box squat, high box', version: variant.body.version }),
    );
    expect(after.picks[0]!.variant.name).toBe('Box squat, high box');

    const rules = await coachThere.get('/api/rules');
    const renamed = {
      ...rules.body.rules,
      slots: rules.body.rules.slots.map((s: { id: string; label: string }) =>
        s.id === 'lower' ? { ...s, label: 'Heavy lower' } : s,
      ),
    };
    after = await afterWrite(() =>
      coachThere
        .put('/api/rules')
        .send({ rules: renamed, equipment: rules.body.equipment, version: rules.body.version }),
    );
    expect(after.picks[0]!.slotLabel).toBe('Heavy lower');
  });

  it('shows the athlete’s renamed roster entry and a week the coach publishes', async () => {
    const entry = await coachThere.get(`/api/athletes/${team.athleteId}`);
    const after = await afterWrite(() =>
      coachThere.patch(`/api/athletes/${team.athleteId}`).send({ name: 'Renamed Lifter', version: entry.body.version }),
    );
    expect(after.athlete.name).toBe('Renamed Lifter');

    const draft = await page(nextWeek);
    expect(draft).toMatchObject({ published: false, picks: [] });
    const published = await afterWrite(() => coachThere.post(`/api/weeks/${nextWeek}/publish`).send({}), nextWeek);
    expect(published.published).toBe(true);
    expect(published.picks.map((p) => p.variant.id)).toEqual([variantsOf['Deficit deadlift']]);
  });

  it('shows the athlete’s own top set, check-in and bodyweights, written on the other instance', async () => {
    let after = await afterWrite(() =>
      athleteThere.post('/api/top-sets').send({ planEntryId: lowerEntry, unit: 'kg', weight: 140, reps: 3, rpe: 8 }),
    );
    expect(after.picks[0]!.logged.map((s) => s.weightKg)).toEqual([140]);

    after = await afterWrite(() =>
      athleteThere.post('/api/tissue/checkins').send({ week: thisWeek, soreness: 3, painJoints: ['knee'] }),
    );
    expect(after.checkins[0]!.done.map((c) => c.soreness)).toEqual([3]);

    const today = new Date().toISOString().slice(0, 10);
    after = await afterWrite(() => athleteThere.put(`/api/bodyweights/${today}`).send({ unit: 'kg', weight: 81.5 }));
    expect(after.bodyweight.latest?.weightKg).toBe(81.5);
    // The same day again replaces the reading in place: same row, new weight.
    after = await afterWrite(() => athleteThere.put(`/api/bodyweights/${today}`).send({ unit: 'kg', weight: 82.25 }));
    expect(after.bodyweight.latest?.weightKg).toBe(82.25);
  });

  it('shows a meet the athlete is entered in, its new name and the entry taken away', async () => {
    const date = new Date(Date.now() + 40 * 86_400_000).toISOString().slice(0, 10);
    const made = await coachThere.post('/api/meets').send({ name: 'Autumn Open', date });
    expect(made.status).toBe(201);
    let after = await afterWrite(() =>
      coachThere.post(`/api/meets/${made.body.id}/entries`).send({ athleteId: team.athleteId, weightClass: '76' }),
    );
    expect(after.meet?.name).toBe('Autumn Open');
    expect(after.bodyweight.enteredClass).toBe('76');

    after = await afterWrite(() =>
      coachThere.patch(`/api/meets/${made.body.id}`).send({ name: 'Autumn Open II', version: made.body.version }),
    );
    expect(after.meet?.name).toBe('Autumn Open II');

    const meet = await coachThere.get(`/api/meets/${made.body.id}`);
    const entryId = (meet.body.entries as { id: number; athlete: { id: number } }[]).find(
      (e) => e.athlete.id === team.athleteId,
    )!.id;
    after = await afterWrite(() => coachThere.delete(`/api/meets/${made.body.id}/entries/${entryId}`));
    expect(after.meet).toBeNull();
  });

  it('shows a session the athlete logs and the deload week the coach sets, written on the other instance', async () => {
    let after = await afterWrite(() =>
      athleteThere
        .put('/api/my-week/sessions/upper-speed')
        .send({ week: thisWeek, version: 0, speedSetsDone: 5, accessorySetsDone: [3], done: true }),
    );
    expect(after.sessions.find((s) => s.id === 'upper-speed')?.log).toMatchObject({ speedSetsDone: 5, done: true });

    const week = await coachThere.get(`/api/athletes/${team.athleteId}/weeks/${thisWeek}`);
    expect(week.status).toBe(200);
    after = await afterWrite(() =>
      coachThere.put(`/api/athletes/${team.athleteId}/weeks/${thisWeek}`).send({
        version: week.body.version,
        deload: !week.body.deload,
        trainingMaxPct: week.body.trainingMaxPct,
        sessions: week.body.work,
      }),
    );
    expect(after.deload).toBe(!week.body.deload);
  });

  it('reads only tables its kept answers are checked against', async () => {
    // Every query the page runs, logged: a table read here but left out of the fingerprint would let a
    // kept answer go stale after a write to it.
    const read = new Set<string>();
    const db = drizzle(reader.ctx.database.pool, {
      schema,
      mode: 'planetscale',
      logger: {
        logQuery: (query) => {
          for (const m of query.matchAll(/(?<!key )\b(?:from|join|into|update)\s+`(\w+)`/gi)) read.add(m[1]!);
        },
      },
    });
    const ctx = { database: { ...reader.ctx.database, db } };
    const who = { teamId: team.teamId, athleteId: team.athleteId, unit: 'kg' as const };
    for (const week of [undefined, addWeeks(thisWeek, -1), nextWeek, addWeeks(thisWeek, 2)])
      await myWeek(ctx, who, week);
    expect(read.size).toBeGreaterThanOrEqual(8);
    expect([...read].filter((table) => !FINGERPRINT_TABLES.includes(table))).toEqual([]);
  });
});
