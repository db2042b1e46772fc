// The demo scenario: seeded once into an empty database, consistent with the team's own rules.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, gte, lt } from 'drizzle-orm';
import {
  addWeeks,
  checkPlan,
  generatePlan,
  weekOfDate,
  weekRange,
  type PlanEntry,
  type Variant,
} from '../../shared/engine';
import { readTeamRules, toEngineRules, toEngineSlots } from '../../shared/schemas/rules';
import { toEngineVariant } from '../../shared/schemas/plans';
import { createDatabase, type Database } from '../../server/db/client';
import {
  athletes,
  bodyweights,
  meetAttempts,
  meetEntries,
  meets,
  planEntries,
  restrictions,
  teamRules,
  teams,
  topSets,
  users,
  variants,
} from '../../server/db/schema';
import { seedDemoIfEmpty } from '../../server/db/seed/demo';
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
    const joints = (await database.db.select().from(restrictions).where(eq(restrictions.teamId, club!.id))).map(
      (r) => r.joint,
    );
    expect(joints.sort()).toEqual(['elbow', 'lowerBack']);
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
    const lib = await database.db.select().from(variants).where(eq(variants.teamId, club!.id));
    const roster = await database.db.select().from(athletes).where(eq(athletes.teamId, club!.id));
    const rows = await database.db.select().from(planEntries).where(eq(planEntries.teamId, club!.id));
    const limits = await database.db.select().from(restrictions).where(eq(restrictions.teamId, club!.id));

    const weeks = Array.from({ length: 13 }, (_, i) => addWeeks(thisWeek, i - 12));
    expect([...new Set(rows.map((r) => r.week))].sort()).toEqual(weeks);
    expect(rows.length).toBe(roster.length * weeks.length * rules.slots.length);

    const entries: PlanEntry[] = rows.map((r) => ({
      athleteId: String(r.athleteId),
      week: r.week,
      slotId: r.slotId,
      variantId: String(r.variantId),
    }));
    const engineVariants: Variant[] = lib.map((v) =>
      toEngineVariant({ ...v, risk: v.risk as 1 | 2 | 3, archived: false }),
    );
    const violations = checkPlan(
      {
        variants: engineVariants,
        slots: toEngineSlots(rules),
        rules: toEngineRules(rules, stored!.seed),
        weeks,
        athletes: roster.map((a) => ({
          id: String(a.id),
          equipment: a.equipment,
          restrictions: limits
            .filter((l) => l.athleteId === a.id)
            .map((l) => ({ joint: l.joint, maxStress: l.maxStress })),
          history: [],
        })),
      },
      entries,
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
    const lib = await database.db.select().from(variants).where(eq(variants.teamId, club!.id));
    const rows = await database.db.select().from(planEntries).where(eq(planEntries.teamId, club!.id));
    const entered = await database.db
      .select({ athleteId: meetEntries.athleteId, date: meets.date })
      .from(meetEntries)
      .innerJoin(meets, eq(meets.id, meetEntries.meetId))
      .where(and(eq(meets.teamId, club!.id), gte(meets.date, today.toISOString().slice(0, 10))));
    expect(entered.length).toBe(2);
    const roster = await database.db.select().from(athletes).where(eq(athletes.teamId, club!.id));
    for (const entry of entered) {
      const a = roster.find((r) => r.id === entry.athleteId)!;
      const meetWeek = weekOfDate(new Date(`${entry.date}T12:00:00Z`));
      const weeks = weekRange(addWeeks(thisWeek, 1), meetWeek);
      const plan = generatePlan({
        variants: lib.map((v) => toEngineVariant({ ...v, risk: v.risk as 1 | 2 | 3, archived: false })),
        slots: toEngineSlots(rules),
        rules: toEngineRules(rules, stored!.seed),
        weeks,
        athletes: [
          {
            id: String(a.id),
            equipment: a.equipment,
            restrictions: [],
            meetWeek,
            history: rows
              .filter((r) => r.athleteId === a.id)
              .map((r) => ({
                athleteId: String(r.athleteId),
                week: r.week,
                slotId: r.slotId,
                variantId: String(r.variantId),
              })),
          },
        ],
      });
      expect(plan.unfilled, a.name).toEqual([]);
      expect(plan.entries.length).toBe(weeks.length * rules.slots.length);
    }
  });
});
