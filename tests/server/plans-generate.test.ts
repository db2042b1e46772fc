// Plan generation: Fill next week, Plan to meet and Reshuffle write engine picks with history rows in one
// transaction, keep pinned and still-valid picks, report swaps and unfillable cells, and repeat exactly.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq, inArray, sql } from 'drizzle-orm';
import { checkPlan } from '../../shared/engine';
import { addWeeks, mondayOf, weekOfDate, weekRange } from '../../shared/engine/weeks';
import { engineRules, engineSlots } from '../../shared/planning';
import { DEFAULT_TEAM_RULES } from '../../shared/schemas/rules';
import type { GenerateResult } from '../../shared/schemas';
import {
  meetEntries,
  meets,
  planEntries,
  planEntryHistory,
  restrictions,
  teamRules,
  variants,
} from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createAthlete, createPlanEntry, createPlanLibrary, createTeam, createVariant } from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);

async function freshTeam(athletes = 3) {
  const team = await createTeam(db());
  const lib = await createPlanLibrary(db(), team.teamId);
  const ids = [team.athleteId];
  for (let i = 1; i < athletes; i++) ids.push(await createAthlete(db(), team.teamId, { name: `Gen ${i}` }));
  const coach = await t.signIn(team.coach.email);
  return { team, lib, ids, coach };
}

async function entriesOf(athleteIds: number[]) {
  return db()
    .select()
    .from(planEntries)
    .where(inArray(planEntries.athleteId, athleteIds))
    .orderBy(planEntries.athleteId, planEntries.week, planEntries.slotId);
}

async function historyCount(athleteIds: number[]) {
  const [row] = await db()
    .select({ n: sql<number>`count(*)` })
    .from(planEntryHistory)
    .where(inArray(planEntryHistory.athleteId, athleteIds));
  return Number(row!.n);
}

async function addMeet(teamId: number, athleteId: number, week: string) {
  const date = new Date(mondayOf(week).getTime() + 5 * 86_400_000).toISOString().slice(0, 10);
  const [m] = await db()
    .insert(meets)
    .values({ teamId, name: `Meet ${athleteId}`, date })
    .$returningId();
  await db().insert(meetEntries).values({ teamId, meetId: m!.id, athleteId, attempts: {} });
}

const generate = (agent: request.Agent, body: object) => agent.post('/api/plans/generate').send(body);

describe('POST /api/plans/generate', () => {
  let g: Awaited<ReturnType<typeof freshTeam>>;
  let first: GenerateResult;

  beforeAll(async () => {
    g = await freshTeam(3);
  });

  it('fills next week for every athlete and slot, as engine picks with history rows', async () => {
    const res = await generate(g.coach, { weeks: 'next' });
    expect(res.status).toBe(200);
    first = res.body;
    expect(first.weeks).toEqual([wk(1)]);
    expect(first.unfilled).toEqual([]);
    expect(first.changes).toHaveLength(6);
    for (const c of first.changes) {
      expect(c.entry).toMatchObject({ week: wk(1), source: 'engine', pinned: false, version: 1 });
      expect(c.entry.reasons.length).toBeGreaterThan(0);
      expect(c.previous).toBeNull();
    }
    const rows = await entriesOf(g.ids);
    expect(rows.map((r) => `${r.athleteId}|${r.slotId}`).sort()).toEqual(
      g.ids.flatMap((id) => [`${id}|lower`, `${id}|upper`]).sort(),
    );
    expect(await historyCount(g.ids)).toBe(6);
    const lower = new Set([...g.lib.squat, ...g.lib.deadlift]);
    for (const r of rows)
      expect(r.slotId === 'lower' ? lower.has(r.variantId!) : g.lib.bench.includes(r.variantId!)).toBe(true);
  });

  it('gives the same plan a second time and writes nothing', async () => {
    const before = await entriesOf(g.ids);
    const res = await generate(g.coach, { weeks: 'next' });
    expect(res.status).toBe(200);
    expect(res.body.changes).toEqual([]);
    expect(res.body.kept).toBe(6);
    const after = await entriesOf(g.ids);
    expect(after.map((r) => [r.id, r.variantId, r.version])).toEqual(before.map((r) => [r.id, r.variantId, r.version]));
    expect(await historyCount(g.ids)).toBe(6);
  });

  it('plans each athlete up to their meet, and leaves out athletes with no meet ahead', async () => {
    const h = await freshTeam(2);
    await addMeet(h.team.teamId, h.ids[0]!, wk(4));
    const res = await generate(h.coach, { weeks: 'toMeet' });
    expect(res.status).toBe(200);
    expect(res.body.weeks).toEqual(weekRange(wk(1), wk(4)));
    expect(res.body.skipped).toEqual([{ athleteId: h.ids[1], reason: 'no meet ahead' }]);
    const rows = await entriesOf(h.ids);
    expect(new Set(rows.map((r) => r.athleteId))).toEqual(new Set([h.ids[0]]));
    expect(rows.map((r) => r.week)).toEqual(weekRange(wk(1), wk(4)).flatMap((w) => [w, w]));
    // The planned weeks obey every rule, history included, judged by the engine itself.
    const vrows = await db().select().from(variants).where(eq(variants.teamId, h.team.teamId));
    const violations = checkPlan(
      {
        variants: vrows.map((v) => ({
          id: String(v.id),
          name: v.name,
          lift: v.lift,
          family: v.family,
          risk: v.risk as 1,
          specificity: Number(v.specificity),
          stress: v.stress,
          equipment: v.equipment,
        })),
        slots: engineSlots(DEFAULT_TEAM_RULES.slots),
        athletes: [
          {
            id: String(h.ids[0]),
            equipment: ['box', 'bands', 'rack pins', 'boards'],
            restrictions: [],
            meetWeek: wk(4),
            history: [],
          },
        ],
        rules: engineRules(DEFAULT_TEAM_RULES, 'x'),
        weeks: weekRange(wk(1), wk(4)),
      },
      rows.map((r) => ({
        athleteId: String(r.athleteId),
        week: r.week,
        slotId: r.slotId,
        variantId: String(r.variantId),
      })),
    );
    expect(violations).toEqual([]);
  });

  it('keeps pinned picks, replaces an unpinned pick that now breaks a rule, and says why', async () => {
    const h = await freshTeam(1);
    const athleteId = h.ids[0]!;
    const heavy = await createVariant(db(), h.team.teamId, {
      name: `Heavy elbow ${athleteId}`,
      lift: 'bench',
      family: 'heavy elbow',
      stress: { elbow: 3 },
    });
    const pinnedPick = await createVariant(db(), h.team.teamId, {
      name: `Pinned elbow ${athleteId}`,
      lift: 'squat',
      family: 'pinned',
      stress: { elbow: 3 },
    });
    await createPlanEntry(db(), h.team.teamId, athleteId, heavy, { week: wk(1), slotId: 'upper', source: 'coach' });
    await createPlanEntry(db(), h.team.teamId, athleteId, pinnedPick, {
      week: wk(1),
      slotId: 'lower',
      source: 'coach',
      pinned: true,
      reason: 'coach call',
    });
    await db()
      .insert(restrictions)
      .values({ teamId: h.team.teamId, athleteId, joint: 'elbow', maxStress: 1, fromDate: '2020-01-06' });
    const res = await generate(h.coach, { weeks: 'next' });
    expect(res.status).toBe(200);
    expect(res.body.kept).toBe(1);
    expect(res.body.changes).toHaveLength(1);
    const [change] = res.body.changes;
    expect(change.swap).toEqual({ from: heavy, rule: 'restriction' });
    expect(change.previous).toMatchObject({ variantId: heavy, source: 'coach' });
    expect(change.entry).toMatchObject({ slotId: 'upper', source: 'engine', version: 2 });
    expect(change.entry.reasons[0]).toMatch(/^replaces Heavy elbow/);
    const [lower] = await db()
      .select()
      .from(planEntries)
      .where(and(eq(planEntries.athleteId, athleteId), eq(planEntries.slotId, 'lower')));
    expect(lower).toMatchObject({ variantId: pinnedPick, pinned: true, version: 1 });
  });

  it('reports a cell nothing can fill, with the rules that ruled everything out', async () => {
    const team = await createTeam(db());
    await createVariant(db(), team.teamId, { lift: 'bench', family: 'only bench', stress: { elbow: 3 } });
    await createVariant(db(), team.teamId, { lift: 'squat', family: 'only squat', stress: { knee: 1 } });
    await db()
      .insert(restrictions)
      .values({ teamId: team.teamId, athleteId: team.athleteId, joint: 'elbow', maxStress: 1, fromDate: '2020-01-06' });
    const coach = await t.signIn(team.headCoach.email);
    const res = await generate(coach, { weeks: 'next' });
    expect(res.status).toBe(200);
    expect(res.body.unfilled).toEqual([
      { athleteId: team.athleteId, week: wk(1), slotId: 'upper', blockedBy: ['restriction'], dropped: null },
    ]);
    expect(res.body.changes.map((c: { entry: { slotId: string } }) => c.entry.slotId)).toEqual(['lower']);
  });

  it('reshuffles with a new seed stored as a new rules version, re-picking engine picks only', async () => {
    const h = await freshTeam(2);
    await generate(h.coach, { weeks: { from: wk(1), to: wk(3) } });
    const [before] = await db().select().from(teamRules).where(eq(teamRules.teamId, h.team.teamId));
    const rows = await entriesOf(h.ids);
    const used = new Set(rows.filter((r) => r.athleteId === h.ids[1]).map((r) => r.variantId));
    const coachPick = [...h.lib.squat, ...h.lib.deadlift].find((v) => !used.has(v))!;
    const target = rows.find((r) => r.week === wk(3) && r.slotId === 'lower' && r.athleteId === h.ids[1])!;
    await h.coach.put(`/api/plans/${h.ids[1]}/${wk(3)}/lower`).send({ variantId: coachPick, version: target.version });
    const pickAfterCoach = (await entriesOf(h.ids)).find((r) => r.id === target.id)!;

    const res = await generate(h.coach, { weeks: 'ahead', reshuffle: true });
    expect(res.status).toBe(200);
    expect(res.body.weeks).toEqual(weekRange(wk(1), wk(3)));
    const [after] = await db().select().from(teamRules).where(eq(teamRules.teamId, h.team.teamId));
    expect(after!.seed).not.toBe(before!.seed);
    expect(after!.version).toBe(before!.version + 1);
    expect(res.body.seed).toBe(after!.seed);
    // A valid coach pick stays; the engine's own picks were drawn again (and each change is logged).
    const now = (await entriesOf(h.ids)).find((r) => r.id === target.id)!;
    expect(now).toMatchObject({ variantId: coachPick, version: pickAfterCoach.version, source: 'coach' });
    expect(res.body.unfilled).toEqual([]);
    expect(res.body.kept + res.body.changes.length).toBe(12);
    // Filling again with the new seed changes nothing.
    const again = await generate(h.coach, { weeks: 'ahead' });
    expect(again.body.changes).toEqual([]);
  });

  it('writes everything or nothing', async () => {
    const h = await freshTeam(2);
    const last = h.ids[1]!;
    await db().execute(
      sql.raw(`CREATE TRIGGER plans_gen_fail_${last} BEFORE INSERT ON plan_entry_history FOR EACH ROW
        BEGIN IF NEW.athlete_id = ${last} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'injected failure'; END IF; END`),
    );
    try {
      const res = await generate(h.coach, { weeks: 'next' });
      expect(res.status).toBe(500);
    } finally {
      await db().execute(sql.raw(`DROP TRIGGER plans_gen_fail_${last}`));
    }
    expect(await entriesOf(h.ids)).toEqual([]);
    const [rules] = await db().select().from(teamRules).where(eq(teamRules.teamId, h.team.teamId));
    expect(rules!.version).toBe(1);
  });

  it('refuses past weeks, too many weeks and unknown modes by field', async () => {
    const past = await generate(g.coach, { weeks: { from: wk(-2), to: wk(1) } });
    expect(past.status).toBe(422);
    expect(past.body.error.fields).toHaveProperty(['weeks.from']);
    const long = await generate(g.coach, { weeks: { from: wk(1), to: wk(40) } });
    expect(long.status).toBe(422);
    const mode = await generate(g.coach, { weeks: 'someday', reshuffle: 'yes' });
    expect(mode.status).toBe(422);
    expect(Object.keys(mode.body.error.fields)).toEqual(expect.arrayContaining(['weeks', 'reshuffle']));
  });

  it("answers 404 for another team's athletes and changes nothing there", async () => {
    const other = await createTeam(db());
    const agent = await t.signIn(other.headCoach.email);
    const before = await historyCount(g.ids);
    const res = await generate(agent, { weeks: 'next', athleteIds: [g.ids[0]] });
    expect(res.status).toBe(404);
    expect(await historyCount(g.ids)).toBe(before);
  });

  it('fills only the athletes asked for', async () => {
    const h = await freshTeam(2);
    const res = await generate(h.coach, { weeks: 'next', athleteIds: [h.ids[1]] });
    expect(res.status).toBe(200);
    expect(new Set((await entriesOf(h.ids)).map((r) => r.athleteId))).toEqual(new Set([h.ids[1]]));
  });
});
