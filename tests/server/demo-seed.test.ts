// The demo scenario: seeded once into an empty database, consistent with the team's own rules.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, gte, lt } from 'drizzle-orm';
import {
  addWeeks,
  checkPlan,
  generatePlan,
  mondayOf,
  weekOfDate,
  weekRange,
  type PlanEntry,
} from '../../shared/engine';
import { buildAthleteRequest, buildPlanRequests } from '../../shared/planning';
import { readTeamRules } from '../../shared/schemas/rules';
import { createDatabase, type Database } from '../../server/db/client';
import {
  athleteWeeks,
  athletes,
  bodyweights,
  meetAttempts,
  meetEntries,
  meets,
  planEntries,
  restWeeks,
  restrictions,
  teamRules,
  teams,
  topSets,
  users,
  variants,
} from '../../server/db/schema';
import { seedDemoIfEmpty } from '../../server/db/seed/demo';
import { myWeek } from '../../server/modules/my-week/my-week.service';
import { loadPlanning, today as todayOf } from '../../server/modules/plans/plans.context';
import { verifyPassword } from '../../server/lib/passwords';
import { recreateDatabase } from '../support/integration-setup';

let database: Database;
const today = new Date();
const thisWeek = weekOfDate(today);

beforeAll(async () => {
  database = createDatabase(await recreateDatabase('rackturn_seedcheck'), { connectionLimit: 3 });
}, 60_000);
afterAll(() => database?.close());

describe('demo seed', () => {
  it('seeds an empty database once, and never twice', async () => {
    expect(await seedDemoIfEmpty(database.db, today)).toBe(true);
    expect(await seedDemoIfEmpty(database.db, today)).toBe(false);
    const all = await database.db.select().from(teams);
    expect(all.map((t) => t.name).sort()).toEqual(['Copperkettle Barbell Club', 'Quillmoor Strength Co.']);
  }, 60_000);

  it('has speed days, accessories and one deload week, in step with the rest week', async () => {
    const rows = await database.db.select().from(athleteWeeks);
    expect(rows.length).toBeGreaterThanOrEqual(12 * 3);
    const deloads = rows.filter((r) => r.deload);
    expect(deloads).toHaveLength(1);
    const rest = await database.db
      .select()
      .from(restWeeks)
      .where(and(eq(restWeeks.athleteId, deloads[0]!.athleteId), eq(restWeeks.week, deloads[0]!.week)));
    expect(rest).toHaveLength(1);
    for (const r of rows.filter((x) => x.week === thisWeek)) {
      expect(Object.values(r.work).every((w) => w.accessories.length > 0)).toBe(true);
    }
    const [club] = await database.db.select().from(teamRules);
    const sessions = readTeamRules(club!.rules).sessions;
    expect(sessions.filter((s) => s.parts.includes('speed'))).toHaveLength(2);
  });

  it('shows the demo athlete back-off sets under this week’s top sets', async () => {
    const [row] = await database.db
      .select({ teamId: athletes.teamId, athleteId: athletes.id })
      .from(athletes)
      .innerJoin(users, eq(users.id, athletes.userId))
      .where(eq(users.email, 'athlete@rackturn.test'));
    const week = await myWeek({ database }, { ...row!, unit: 'kg' }, undefined, today);
    expect(week.picks.length).toBeGreaterThan(0);
    expect(week.backOff).toEqual({ sets: 2, dropPct: 10 });
    // Each pick's slot is held by a session of the week, where the ticks are kept.
    for (const p of week.picks)
      expect(week.sessions.some((s) => s.parts.includes('maxEffort') && s.slotId === p.slotId)).toBe(true);
  });

  it('has the demo accounts with the documented password', async () => {
    for (const email of [
      'coach@rackturn.test',
      'coach2@rackturn.test',
      'athlete@rackturn.test',
      'other@rackturn.test',
    ]) {
      const [u] = await database.db.select().from(users).where(eq(users.email, email));
      expect(u, email).toBeDefined();
      expect(await verifyPassword('rackturn-demo', u!.passwordHash)).toBe(true);
    }
  });

  it('gives the club about a dozen athletes, a 60+ variant library, restrictions and meets', async () => {
    const [club] = await database.db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const roster = await database.db.select().from(athletes).where(eq(athletes.teamId, club!.id));
    expect(roster.length).toBeGreaterThanOrEqual(10);
    const library = await database.db.select().from(variants).where(eq(variants.teamId, club!.id));
    expect(library.length).toBeGreaterThanOrEqual(60);
    const limits = await database.db.select().from(restrictions).where(eq(restrictions.teamId, club!.id));
    const joints = limits.map((r) => r.joint).filter((j) => j !== null);
    expect(joints.sort()).toEqual(['elbow', 'lowerBack']);
    // A restriction by emphasis and family over a range of weeks, so the Athlete page and the board show one.
    const dated = limits.find((r) => r.joint === null)!;
    expect(dated).toMatchObject({ emphasis: ['bottom'], families: ['good morning'] });
    expect(dated.toDate).not.toBeNull();
    // A newer lifter with a ceiling of risk 2, and a planned rest week.
    expect(roster.filter((a) => a.maxRisk === 2).length).toBeGreaterThan(0);
    const rests = await database.db.select().from(restWeeks).where(eq(restWeeks.teamId, club!.id));
    expect(rests.map((r) => r.week)).toEqual([addWeeks(thisWeek, 2)]);
  });

  it('has a past meet with nine judged attempts per entrant, its results in their histories, and upcoming meets', async () => {
    const [club] = await database.db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const day = today.toISOString().slice(0, 10);
    const past = await database.db
      .select()
      .from(meets)
      .where(and(eq(meets.teamId, club!.id), lt(meets.date, day)));
    expect(past).toHaveLength(1);
    expect(past[0]!.resultsSavedAt).not.toBeNull();
    const upcoming = await database.db
      .select()
      .from(meets)
      .where(and(eq(meets.teamId, club!.id), gte(meets.date, day)));
    expect(upcoming.length).toBeGreaterThanOrEqual(1);
    const entries = await database.db.select().from(meetEntries).where(eq(meetEntries.meetId, past[0]!.id));
    expect(entries).toHaveLength(2);
    const judged = await database.db.select().from(meetAttempts).where(eq(meetAttempts.meetId, past[0]!.id));
    expect(judged).toHaveLength(18);
    const results = await database.db
      .select()
      .from(topSets)
      .where(and(eq(topSets.teamId, club!.id), eq(topSets.performedOn, past[0]!.date)));
    expect(results.filter((r) => r.reps === 1 && r.note?.includes(past[0]!.name))).toHaveLength(6);
  });

  it('plans twelve past weeks and the current one for everyone, within the rules', async () => {
    const [club] = await database.db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const [stored] = await database.db.select().from(teamRules).where(eq(teamRules.teamId, club!.id));
    const rules = readTeamRules(stored!.rules);
    const roster = await database.db.select().from(athletes).where(eq(athletes.teamId, club!.id));
    const rows = await database.db.select().from(planEntries).where(eq(planEntries.teamId, club!.id));

    const weeks = Array.from({ length: 13 }, (_, i) => addWeeks(thisWeek, i - 12));
    expect([...new Set(rows.map((r) => r.week))].sort()).toEqual(weeks);
    expect(rows.length).toBe(roster.length * weeks.length * rules.slots.length);

    const entries: PlanEntry[] = rows.map((r) => ({
      athleteId: String(r.athleteId),
      week: r.week,
      slotId: r.slotId,
      variantId: String(r.variantId),
    }));
    // The stored facts, read and turned into requests the way the plan services do.
    // Restrictions from the history's first week on (the services read them from this week on).
    const planning = await loadPlanning(database.db, club!.id, { today: todayOf(new Date(mondayOf(weeks[0]!))) });
    const violations = buildPlanRequests(planning, { weeks, entries: [] }).flatMap((g) =>
      checkPlan(
        g.request,
        entries.filter((e) => g.athleteIds.includes(Number(e.athleteId))),
      ),
    );
    expect(violations).toEqual([]);
  });

  it('logs top sets for the past weeks only, and bodyweights up to now', async () => {
    const [club] = await database.db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const sets = await database.db.select().from(topSets).where(eq(topSets.teamId, club!.id));
    const setWeeks = new Set(sets.map((s) => s.week));
    expect(setWeeks.size).toBe(12);
    expect(setWeeks.has(thisWeek)).toBe(false);
    for (const s of sets) expect(s.e1rmKg).toBeGreaterThanOrEqual(s.weightKg);
    const weights = await database.db.select().from(bodyweights).where(eq(bodyweights.teamId, club!.id));
    expect(weights.length).toBeGreaterThan(12 * 2 * 10);
    const latest = weights
      .map((w) => w.measuredOn)
      .sort()
      .at(-1)!;
    expect(latest < today.toISOString().slice(0, 10)).toBe(true);
  });

  it('lets the coach plan each meet athlete all the way to the meet with every cell filled', async () => {
    const [club] = await database.db.select().from(teams).where(eq(teams.name, 'Copperkettle Barbell Club'));
    const [stored] = await database.db.select().from(teamRules).where(eq(teamRules.teamId, club!.id));
    const rules = readTeamRules(stored!.rules);
    const rows = await database.db.select().from(planEntries).where(eq(planEntries.teamId, club!.id));
    const entered = await database.db
      .select({ athleteId: meetEntries.athleteId, date: meets.date })
      .from(meetEntries)
      .innerJoin(meets, eq(meets.id, meetEntries.meetId))
      .where(and(eq(meets.teamId, club!.id), gte(meets.date, today.toISOString().slice(0, 10))));
    expect(entered.length).toBe(2);
    for (const entry of entered) {
      const meetWeek = weekOfDate(new Date(`${entry.date}T12:00:00Z`));
      const weeks = weekRange(addWeeks(thisWeek, 1), meetWeek);
      const planning = await loadPlanning(database.db, club!.id, { today: todayOf(today) });
      const request = buildAthleteRequest(planning, entry.athleteId, {
        weeks,
        entries: rows.filter((r) => r.athleteId === entry.athleteId),
      })!;
      expect(request.athletes[0]!.meetWeek).toBe(meetWeek);
      const plan = generatePlan(request);
      expect(plan.unfilled, String(entry.athleteId)).toEqual([]);
      expect(plan.entries.length).toBe(weeks.length * rules.slots.length);
    }
  });
});
