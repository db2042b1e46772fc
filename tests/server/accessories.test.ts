// The accessory library API (team scope, field errors, 409 on stale versions, archive and bring back), the
// week's accessories chosen from it, and the rotation's suggestion counting the max-effort picks' joint stress.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { accessoryBlockOf, accessoryBlockWeek } from '../../shared/engine/accessories';
import type { AccessorySuggestion, AthleteWeek, LibraryAccessory } from '../../shared/schemas';
import { useTestApp } from '../support/app';
import { createPlanEntry, createTeam, createVariant, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let coach: request.Agent;
let head: request.Agent;
let otherHead: request.Agent;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  coach = await t.signIn(team.coach.email);
  head = await t.signIn(team.headCoach.email);
  otherHead = await t.signIn(other.headCoach.email);
});

const row = (over: Record<string, unknown> = {}) => ({
  name: 'Chest-supported row',
  category: 'upperBack',
  stress: {},
  sets: 4,
  reps: 10,
  loadKg: null,
  rpe: 8,
  notes: null,
  ...over,
});

async function add(agent: request.Agent, over: Record<string, unknown> = {}): Promise<LibraryAccessory> {
  const res = await agent.post('/api/accessories').send(row(over));
  expect(res.status).toBe(201);
  return res.body;
}

describe('the accessory library', () => {
  it('adds, lists by category and reads an accessory of the team only', async () => {
    const a = await add(coach, { name: 'Seal row A' });
    await add(coach, { name: 'JM press A', category: 'triceps', stress: { elbow: 2 }, rpe: null, loadKg: 30 });
    expect(a).toMatchObject({ name: 'Seal row A', category: 'upperBack', sets: 4, reps: 10, rpe: 8, archived: false });
    const list = await coach.get('/api/accessories?category=triceps');
    expect(list.status).toBe(200);
    expect(list.body.items.map((x: LibraryAccessory) => x.name)).toEqual(['JM press A']);
    expect(list.body.items[0].stress).toEqual({ elbow: 2 });
    expect((await otherHead.get(`/api/accessories/${a.id}`)).status).toBe(404);
    expect((await otherHead.get('/api/accessories')).body.items).toEqual([]);
    expect((await otherHead.patch(`/api/accessories/${a.id}`).send({ version: 1, sets: 3 })).status).toBe(404);
  });

  it('answers bad input with field errors and saves nothing', async () => {
    const res = await coach
      .post('/api/accessories')
      .send(row({ name: ' ', category: 'calves', sets: 0, reps: 101, rpe: 11, stress: { knee: 4 } }));
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'category',
      'name',
      'reps',
      'rpe',
      'sets',
      'stress.knee',
    ]);
    const both = await coach.post('/api/accessories').send(row({ name: 'Both targets', loadKg: 20, rpe: 8 }));
    expect(both.status).toBe(422);
    expect(both.body.error.fields.rpe).toEqual(['Give a load or an RPE, not both']);
    expect((await coach.get('/api/accessories?q=Both')).body.total).toBe(0);
  });

  it('refuses a name already in the library, archived ones and other cases included', async () => {
    const a = await add(coach, { name: 'Face pull B', category: 'shoulders' });
    await coach.patch(`/api/accessories/${a.id}`).send({ version: a.version, archived: true });
    const res = await coach.post('/api/accessories').send(row({ name: 'face pull b', category: 'shoulders' }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.name[0]).toMatch(/already has this name/);
    // Another team may use the name.
    expect((await otherHead.post('/api/accessories').send(row({ name: 'Face pull B' }))).status).toBe(201);
  });

  it('edits with the version read, answers a stale one with 409 and the current row, archives and brings back', async () => {
    const a = await add(head, { name: 'Lat pulldown C', category: 'lats' });
    const first = await coach.patch(`/api/accessories/${a.id}`).send({ version: a.version, reps: 12, loadKg: 50 });
    expect(first.status).toBe(200);
    // A load replaces the RPE target.
    expect(first.body).toMatchObject({ reps: 12, loadKg: 50, rpe: null, version: a.version + 1 });
    const stale = await head.patch(`/api/accessories/${a.id}`).send({ version: a.version, reps: 8 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current).toMatchObject({ reps: 12, version: a.version + 1 });
    const archived = await head.patch(`/api/accessories/${a.id}`).send({ version: a.version + 1, archived: true });
    expect(archived.body.archived).toBe(true);
    expect((await head.get('/api/accessories?q=Lat pulldown C')).body.total).toBe(0);
    expect((await head.get('/api/accessories?q=Lat pulldown C&includeArchived=true')).body.total).toBe(1);
    const back = await head.patch(`/api/accessories/${a.id}`).send({ version: a.version + 2, archived: false });
    expect(back.body.archived).toBe(false);
  });
});

describe('the week’s accessories from the library', () => {
  const week = addWeeks(weekOfDate(new Date()), 2);
  const path = (athleteId: number, w = week) => `/api/athletes/${athleteId}/weeks/${w}`;

  it('takes name and category from the library, refuses another team’s accessory and a newly archived one', async () => {
    const a = await add(coach, { name: 'Reverse hyper D', category: 'hamstrings', stress: { lowerBack: 1 } });
    const foreign = await add(otherHead, { name: 'Not ours D' });
    const work = (accessoryId: number, name = 'typed') => ({
      version: 0,
      deload: false,
      trainingMaxPct: 90,
      sessions: {
        'lower-me': {
          speed: null,
          accessories: [{ accessoryId, name, category: 'grip', sets: 4, reps: 12, loadKg: null, rpe: 7 }],
        },
      },
    });
    const refused = await coach.put(path(team.athleteId)).send(work(foreign.id));
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields['sessions.lower-me.accessories.0.accessoryId']).toEqual([
      'Not in the accessory library',
    ]);
    const saved = await coach.put(path(team.athleteId)).send(work(a.id));
    expect(saved.status).toBe(200);
    const got = (saved.body as AthleteWeek).work['lower-me']!.accessories[0]!;
    expect(got).toMatchObject({ accessoryId: a.id, name: 'Reverse hyper D', category: 'hamstrings' });

    const b = await add(coach, { name: 'Archived E', category: 'hamstrings' });
    await coach.patch(`/api/accessories/${b.id}`).send({ version: b.version, archived: true });
    const again = await coach.put(path(team.athleteId)).send({ ...work(b.id), version: saved.body.version });
    expect(again.status).toBe(422);
    expect(again.body.error.fields['sessions.lower-me.accessories.0.accessoryId']).toEqual([
      'Archived in the library: pick another',
    ]);
  });

  it('suggests accessories by the rotation, keeping joints within budget with the max-effort picks counted', async () => {
    const db = t.ctx.database.db;
    const fresh = await createTeam(db);
    const c = await t.signIn(fresh.coach.email);
    // The rules' default knee budget is 10 over four weeks: a max-effort squat at knee 3 in three of those
    // weeks leaves 1, so the glute-ham raise (knee 2), lighter in all and first otherwise, does not fit and
    // the reverse hyper does.
    const squat = await createVariant(db, fresh.teamId, { lift: 'squat', stress: { knee: 3 } });
    for (const n of [-3, -2, -1]) {
      await createPlanEntry(db, fresh.teamId, fresh.athleteId, squat, { week: addWeeks(week, n), slotId: 'lower' });
    }
    await add(c, { name: 'Glute-ham raise', category: 'hamstrings', stress: { knee: 2 } });
    const hyper = await add(c, { name: 'Reverse hyper', category: 'hamstrings', stress: { lowerBack: 2, hip: 1 } });
    const row1 = await add(c, { name: 'Seal row', category: 'upperBack' });
    const res = await c.get(`${path(fresh.athleteId)}/accessories`);
    expect(res.status).toBe(200);
    const s = res.body as AccessorySuggestion;
    expect(s.blockWeek).toBeGreaterThanOrEqual(1);
    expect(s.sessions['lower-me']!.accessories.map((a) => a.accessoryId)).toEqual([hyper.id]);
    expect(s.sessions['lower-me']!.unfilled).toEqual([
      { category: 'abdominals', reason: 'The library has no abdominals accessory in use' },
    ]);
    // Upper body: one upper-back row for two sessions; the second says why it stays empty.
    const upper = [s.sessions['upper-me']!, s.sessions['upper-speed']!];
    expect(upper.flatMap((x) => x.accessories.map((a) => a.accessoryId))).toEqual([row1.id]);
    expect(upper.flatMap((x) => x.unfilled.map((u) => u.category))).toContain('upperBack');
    // Library defaults come with the pick.
    expect(s.sessions['lower-me']!.accessories[0]).toMatchObject({ name: 'Reverse hyper', sets: 4, reps: 10, rpe: 8 });
    expect((await otherHead.get(`${path(fresh.athleteId)}/accessories`)).status).toBe(404);
    expect(accessoryBlockOf(week, 3)).toBeGreaterThan(0);
  });

  it('follows the team’s accessory block and repeat window from the rules', async () => {
    const db = t.ctx.database.db;
    const fresh = await createTeam(db);
    const c = await t.signIn(fresh.coach.email);
    const h = await t.signIn(fresh.headCoach.email);
    const seal = await add(c, { name: 'Seal row', category: 'upperBack' });
    const pull = await add(c, { name: 'Band pull-apart', category: 'upperBack', stress: { shoulder: 1 } });
    // Last week's upper session had the seal row (lighter, so the rotation's first choice).
    const lastWeek = addWeeks(week, -1);
    const saved = await c.put(`/api/athletes/${fresh.athleteId}/weeks/${lastWeek}`).send({
      version: 0,
      deload: false,
      trainingMaxPct: 90,
      sessions: {
        'upper-me': {
          speed: null,
          accessories: [
            { accessoryId: seal.id, name: 'x', category: 'upperBack', sets: 3, reps: 12, loadKg: null, rpe: 8 },
          ],
        },
      },
    });
    expect(saved.status).toBe(200);
    const setRotation = async (blockWeeks: number, repeatWindowWeeks: number) => {
      const current = (await h.get('/api/rules')).body;
      const res = await h
        .put('/api/rules')
        .send({ ...current, rules: { ...current.rules, accessoryRotation: { blockWeeks, repeatWindowWeeks } } });
      expect(res.status).toBe(200);
    };
    const suggest = async () => (await c.get(`${path(fresh.athleteId)}/accessories`)).body as AccessorySuggestion;
    // A block length that puts last week and this week in one block: the block's pick carries on.
    const together = [2, 3, 4].find((b) => accessoryBlockOf(lastWeek, b) === accessoryBlockOf(week, b))!;
    await setRotation(together, together);
    const kept = await suggest();
    expect(kept.blockWeek).toBe(accessoryBlockWeek(week, together));
    expect(kept.sessions['upper-me']!.accessories.map((a) => a.accessoryId)).toEqual([seal.id]);
    // One-week blocks: this week is a new block, and the seal row, done within the window, gives way.
    await setRotation(1, 1);
    const fresh1 = await suggest();
    expect(fresh1.blockWeek).toBe(1);
    expect(fresh1.sessions['upper-me']!.accessories.map((a) => a.accessoryId)).toEqual([pull.id]);
  });
});
