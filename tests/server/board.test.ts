// The board's snapshot: athletes with equipment, restrictions in force and next meet; the whole library,
// rules and slots; entries of the asked weeks in full and every other entry as engine input.
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { addWeeks, mondayOf, weekOfDate, weekRange } from '../../shared/engine/weeks';
import type { BoardData } from '../../shared/schemas';
import { athletes, meetEntries, meets, restrictions, teamRules } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createAthlete, createPlanEntry, createTeam, createVariant, type TestTeam } from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);
const day = (week: string, offset = 0) =>
  new Date(mondayOf(week).getTime() + offset * 86_400_000).toISOString().slice(0, 10);

let team: TestTeam;
let board: BoardData;
let ids: { second: number; archivedAthlete: number; squat: number; old: number; bench: number };

beforeAll(async () => {
  team = await createTeam(db());
  const other = await createTeam(db());
  await createAthlete(db(), other.teamId, { name: 'Other Team Athlete' });
  const squat = await createVariant(db(), team.teamId, { name: 'Board squat', lift: 'squat', stress: { knee: 2 } });
  const old = await createVariant(db(), team.teamId, { name: 'Old squat', archivedAt: new Date() });
  const bench = await createVariant(db(), team.teamId, { name: 'Board bench', lift: 'bench' });
  const second = await createAthlete(db(), team.teamId, {
    name: 'Ada Second',
    equipment: ['box', 'chains', 'bands'],
    ruleOverrides: { repeatWindowWeeks: 3, jointBudget: { knee: 4 } },
  });
  const archivedAthlete = await createAthlete(db(), team.teamId, { name: 'Gone Athlete', archivedAt: new Date() });
  ids = { second, archivedAthlete, squat, old, bench };
  // In force now, ended last month, and one that starts after the board's last week.
  await db()
    .insert(restrictions)
    .values([
      { teamId: team.teamId, athleteId: second, joint: 'knee', maxStress: 1, fromDate: day(wk(-2)), note: 'sore knee' },
      {
        teamId: team.teamId,
        athleteId: second,
        joint: 'elbow',
        maxStress: 0,
        fromDate: day(wk(-9)),
        toDate: day(wk(-5)),
      },
      { teamId: team.teamId, athleteId: second, joint: 'wrist', maxStress: 0, fromDate: day(wk(30)) },
    ]);
  const [past] = await db()
    .insert(meets)
    .values({ teamId: team.teamId, name: 'Past meet', date: day(wk(-3), 5) })
    .$returningId();
  const [soon] = await db()
    .insert(meets)
    .values({ teamId: team.teamId, name: 'Soon meet', date: day(wk(5), 5) })
    .$returningId();
  const [late] = await db()
    .insert(meets)
    .values({ teamId: team.teamId, name: 'Late meet', date: day(wk(12), 5) })
    .$returningId();
  for (const m of [past!, soon!, late!]) {
    await db().insert(meetEntries).values({ teamId: team.teamId, meetId: m.id, athleteId: second, attempts: {} });
  }
  await createPlanEntry(db(), team.teamId, second, old, { week: wk(-20) });
  await createPlanEntry(db(), team.teamId, second, squat, { week: wk(-1) });
  await createPlanEntry(db(), team.teamId, second, bench, {
    week: wk(1),
    slotId: 'upper',
    source: 'coach',
    pinned: true,
    reason: 'why not',
  });
  await createPlanEntry(db(), team.teamId, second, squat, { week: wk(20), pinned: true });
  await createPlanEntry(db(), team.teamId, team.athleteId, squat, { week: wk(2), variantId: null });

  const coach = await t.signIn(team.coach.email);
  const res = await coach.get(`/api/board?from=${wk(-4)}&to=${wk(8)}`);
  expect(res.status).toBe(200);
  board = res.body;
});

describe('GET /api/board', () => {
  it('names the weeks and the current week', () => {
    expect(board).toMatchObject({ currentWeek: thisWeek, from: wk(-4), to: wk(8) });
    expect(board.weeks).toEqual(weekRange(wk(-4), wk(8)));
  });

  it('lists the team’s athletes on the board, by name, without archived ones or other teams', () => {
    expect(board.athletes.map((a) => a.name)).toEqual(['Ada Second', 'Linked Athlete']);
  });

  it('gives each athlete the equipment the gym has, the restrictions not yet ended and the next meet', () => {
    const ada = board.athletes.find((a) => a.id === ids.second)!;
    expect(ada.equipment).toEqual(['box', 'bands']);
    expect(ada.restrictions).toEqual([
      {
        joint: 'knee',
        maxStress: 1,
        emphasis: [],
        families: [],
        fromDate: day(wk(-2)),
        toDate: null,
        note: 'sore knee',
      },
      // Dated ahead: the request builder gives it to the engine with its own weeks.
      { joint: 'wrist', maxStress: 0, emphasis: [], families: [], fromDate: day(wk(30)), toDate: null, note: null },
    ]);
    expect(ada.meet).toMatchObject({ name: 'Soon meet', date: day(wk(5), 5), week: wk(5) });
    expect(ada.ruleOverrides).toEqual({ repeatWindowWeeks: 3, jointBudget: { knee: 4 } });
    expect(board.athletes.find((a) => a.id === team.athleteId)!.meet).toBeNull();
  });

  it('sends the rules, slots and the whole library with archived variants flagged', async () => {
    const [rules] = await db().select().from(teamRules).where(eq(teamRules.teamId, team.teamId));
    expect(board.seed).toBe(rules!.seed);
    expect(board.rulesVersion).toBe(rules!.version);
    expect(board.slots.map((s) => s.id)).toEqual(['lower', 'upper']);
    expect(board.rules.repeatWindowWeeks).toBe(6);
    const byName = new Map(board.variants.map((v) => [v.name, v]));
    expect(byName.get('Old squat')!.archived).toBe(true);
    expect(byName.get('Board squat')).toMatchObject({ archived: false, lift: 'squat', stress: { knee: 2 } });
  });

  it('sends the visible weeks in full and every other entry with a variant as engine input', () => {
    const visible = board.entries.map((e) => [e.athleteId, e.week, e.slotId, e.variantId]);
    expect(visible).toEqual(
      expect.arrayContaining([
        [ids.second, wk(-1), 'lower', ids.squat],
        [ids.second, wk(1), 'upper', ids.bench],
        [team.athleteId, wk(2), 'lower', null],
      ]),
    );
    expect(visible).toHaveLength(3);
    const pinned = board.entries.find((e) => e.week === wk(1))!;
    expect(pinned).toMatchObject({ source: 'coach', pinned: true, reason: 'why not', version: 1 });
    expect(board.context).toEqual([
      { athleteId: ids.second, week: wk(-20), slotId: 'lower', variantId: ids.old, pinned: false },
      { athleteId: ids.second, week: wk(20), slotId: 'lower', variantId: ids.squat, pinned: true },
    ]);
  });

  it('validates the range by field', async () => {
    const coach = await t.signIn(team.coach.email);
    const missing = await coach.get('/api/board');
    expect(missing.status).toBe(422);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(['query.from', 'query.to']);
    const backwards = await coach.get(`/api/board?from=${wk(2)}&to=${wk(1)}`);
    expect(backwards.body.error.fields['query.to']).toBeDefined();
    const long = await coach.get(`/api/board?from=${wk(0)}&to=${wk(40)}`);
    expect(long.status).toBe(422);
  });

  it('shows another team only its own board', async () => {
    const otherTeam = await createTeam(db());
    const agent = await t.signIn(otherTeam.headCoach.email);
    const res = await agent.get(`/api/board?from=${wk(-4)}&to=${wk(8)}`);
    expect(res.status).toBe(200);
    expect(res.body.athletes.map((a: { name: string }) => a.name)).toEqual(['Linked Athlete']);
    expect(res.body.entries).toEqual([]);
    expect(res.body.variants).toEqual([]);
    const [athleteRow] = await db().select().from(athletes).where(eq(athletes.id, ids.second));
    expect(athleteRow!.teamId).toBe(team.teamId);
  });
});
