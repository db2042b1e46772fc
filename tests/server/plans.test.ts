// Plan entries: saving a cell (create, update, stale versions, rule breaks with a reason), clearing,
// batches in one transaction, the change history and the list.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq, sql } from 'drizzle-orm';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { planEntries, planEntryHistory, restrictions, variants } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createPlanEntry,
  createPlanLibrary,
  createTeam,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);

let team: TestTeam;
let other: TestTeam;
let lib: Awaited<ReturnType<typeof createPlanLibrary>>;
let coach: request.Agent;
let head: request.Agent;
let otherHead: request.Agent;
let otherVariant: number;

beforeAll(async () => {
  team = await createTeam(db());
  other = await createTeam(db());
  lib = await createPlanLibrary(db(), team.teamId);
  otherVariant = await createVariant(db(), other.teamId, { lift: 'squat' });
  coach = await t.signIn(team.coach.email);
  head = await t.signIn(team.headCoach.email);
  otherHead = await t.signIn(other.headCoach.email);
});

async function historyOf(athleteId: number, week: string, slotId: string) {
  return db()
    .select()
    .from(planEntryHistory)
    .where(
      and(
        eq(planEntryHistory.athleteId, athleteId),
        eq(planEntryHistory.week, week),
        eq(planEntryHistory.slotId, slotId),
      ),
    )
    .orderBy(planEntryHistory.id);
}

const cellPath = (athleteId: number, week: string, slotId = 'lower') => `/api/plans/${athleteId}/${week}/${slotId}`;

describe('PUT /api/plans/:athleteId/:week/:slotId', () => {
  it('creates a coach pick with version 0 and appends a history row', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    const res = await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[0], version: 0 });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      athleteId,
      week: wk(2),
      slotId: 'lower',
      variantId: lib.squat[0],
      source: 'coach',
      pinned: false,
      reason: null,
      version: 1,
      updatedBy: team.coach.id,
    });
    expect(res.body.updatedByName).toMatch(/Test coach/);
    const rows = await historyOf(athleteId, wk(2), 'lower');
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      oldVariantId: null,
      newVariantId: lib.squat[0],
      source: 'coach',
      pinned: false,
      version: 1,
      changedBy: team.coach.id,
      planEntryId: res.body.id,
    });
  });

  it('updates with the version it read, bumps it, and records old and new variant', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    const first = await coach.put(cellPath(athleteId, wk(3))).send({ variantId: lib.squat[1] });
    const second = await head.put(cellPath(athleteId, wk(3))).send({ variantId: lib.deadlift[1], version: 1 });
    expect(second.status).toBe(200);
    expect(second.body).toMatchObject({ id: first.body.id, variantId: lib.deadlift[1], version: 2 });
    const rows = await historyOf(athleteId, wk(3), 'lower');
    expect(rows.map((r) => [r.oldVariantId, r.newVariantId, r.version, r.changedBy])).toEqual([
      [null, lib.squat[1], 1, team.coach.id],
      [lib.squat[1], lib.deadlift[1], 2, team.headCoach.id],
    ]);
  });

  it('answers a stale version with 409 and the entry as it is now, and writes nothing', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(athleteId, wk(4))).send({ variantId: lib.squat[2] });
    await head.put(cellPath(athleteId, wk(4))).send({ variantId: lib.squat[3], version: 1 });
    const stale = await coach.put(cellPath(athleteId, wk(4))).send({ variantId: lib.squat[4], version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('version_conflict');
    expect(stale.body.error.current).toMatchObject({
      variantId: lib.squat[3],
      version: 2,
      updatedBy: team.headCoach.id,
    });
    // "Create" on a cell that already has an entry is stale too.
    const create = await coach.put(cellPath(athleteId, wk(4))).send({ variantId: lib.squat[4], version: 0 });
    expect(create.status).toBe(409);
    expect(create.body.error.current.version).toBe(2);
    expect(await historyOf(athleteId, wk(4), 'lower')).toHaveLength(2);
  });

  it('answers a version for a cell with no entry with 409 and current null', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    const res = await coach.put(cellPath(athleteId, wk(4))).send({ variantId: lib.squat[2], version: 3 });
    expect(res.status).toBe(409);
    expect(res.body.error.current).toBeNull();
  });

  it('lets exactly one of two simultaneous creates of one cell win', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    const [a, b] = await Promise.all([
      coach.put(cellPath(athleteId, wk(5))).send({ variantId: lib.squat[0], version: 0 }),
      head.put(cellPath(athleteId, wk(5))).send({ variantId: lib.squat[1], version: 0 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const loser = a.status === 409 ? a : b;
    const winner = a.status === 201 ? a : b;
    expect(loser.body.error.current).toMatchObject({ variantId: winner.body.variantId, version: 1 });
    expect(await historyOf(athleteId, wk(5), 'lower')).toHaveLength(1);
  });

  it('does not write when nothing changes', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[0] });
    const again = await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[0], version: 1 });
    expect(again.status).toBe(200);
    expect(again.body.version).toBe(1);
    expect(await historyOf(athleteId, wk(2), 'lower')).toHaveLength(1);
  });

  it('reports malformed params and body as field errors', async () => {
    const res = await coach
      .put('/api/plans/abc/2026-W77/Lower%20slot')
      .send({ variantId: 'x', version: -1, reason: 'x' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining(['params.athleteId', 'params.week', 'params.slotId', 'variantId', 'version', 'reason']),
    );
  });

  it('refuses past weeks, a variant of the wrong lift, and an archived variant, by field', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    const past = await coach.put(cellPath(athleteId, wk(-1))).send({ variantId: lib.squat[0] });
    expect(past.status).toBe(422);
    expect(past.body.error.fields.week[0]).toMatch(/Past weeks/);
    const lift = await coach.put(cellPath(athleteId, wk(2), 'upper')).send({ variantId: lib.squat[0] });
    expect(lift.status).toBe(422);
    expect(lift.body.error.fields.variantId[0]).toMatch(/squat variant; Upper max effort takes bench/);
    const archived = await createVariant(db(), team.teamId, { lift: 'squat', archivedAt: new Date() });
    const arch = await coach.put(cellPath(athleteId, wk(2))).send({ variantId: archived });
    expect(arch.status).toBe(422);
    expect(arch.body.error.fields.variantId[0]).toMatch(/archived/);
  });

  it("answers 404 for another team's athlete or variant and for an unknown slot", async () => {
    const mine = await createAthlete(db(), team.teamId);
    const theirs = await otherHead.put(cellPath(mine, wk(2))).send({ variantId: otherVariant });
    expect(theirs.status).toBe(404);
    const foreignVariant = await coach.put(cellPath(mine, wk(2))).send({ variantId: otherVariant });
    expect(foreignVariant.status).toBe(404);
    const slot = await coach.put(cellPath(mine, wk(2), 'sled')).send({ variantId: lib.squat[0] });
    expect(slot.status).toBe(404);
    expect(await historyOf(mine, wk(2), 'lower')).toHaveLength(0);
  });

  it('asks for a reason when the pick breaks a rule, then saves it pinned with the reason', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    await db()
      .insert(restrictions)
      .values({ teamId: team.teamId, athleteId, joint: 'elbow', maxStress: 1, fromDate: '2020-01-06' });
    const heavy = await createVariant(db(), team.teamId, {
      name: `Heavy elbow press ${athleteId}`,
      lift: 'bench',
      family: 'elbow press',
      stress: { elbow: 3 },
    });
    const bare = await coach.put(cellPath(athleteId, wk(3), 'upper')).send({ variantId: heavy });
    expect(bare.status).toBe(422);
    expect(bare.body.error.code).toBe('rule_break');
    expect(bare.body.error.fields.reason[0]).toMatch(/breaks a rule/);
    expect(bare.body.error.violations).toEqual([
      expect.objectContaining({ rule: 'restriction', athleteId, week: wk(3), slotId: 'upper', variantId: heavy }),
    ]);
    expect(await historyOf(athleteId, wk(3), 'upper')).toHaveLength(0);

    const why = 'Testing the elbow with a light single, cleared by the physio';
    const kept = await coach.put(cellPath(athleteId, wk(3), 'upper')).send({ variantId: heavy, reason: why });
    expect(kept.status).toBe(201);
    expect(kept.body).toMatchObject({ source: 'coach', pinned: true, reason: why });
    const [row] = await historyOf(athleteId, wk(3), 'upper');
    expect(row).toMatchObject({ pinned: true, reason: why, source: 'coach', newVariantId: heavy });
  });

  it('counts the rest of the board: the same variant in the next week breaks the repeat window', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[5] });
    const again = await coach.put(cellPath(athleteId, wk(3))).send({ variantId: lib.squat[5] });
    expect(again.status).toBe(422);
    expect(again.body.error.violations.map((v: { rule: string }) => v.rule)).toContain('repeat');
  });
});

describe('DELETE /api/plans/:athleteId/:week/:slotId', () => {
  it('clears the cell, keeps the row with a new version, and appends history', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[0] });
    const stale = await coach.delete(`${cellPath(athleteId, wk(2))}?version=7`);
    expect(stale.status).toBe(409);
    expect(stale.body.error.current.variantId).toBe(lib.squat[0]);
    const res = await coach.delete(`${cellPath(athleteId, wk(2))}?version=1`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ variantId: null, version: 2, pinned: false });
    const rows = await historyOf(athleteId, wk(2), 'lower');
    expect(rows.at(-1)).toMatchObject({ oldVariantId: lib.squat[0], newVariantId: null, version: 2 });
    // A cleared cell is filled again with the version it now has.
    const refill = await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[1], version: 2 });
    expect(refill.status).toBe(200);
    expect(refill.body.version).toBe(3);
  });

  it('needs a version, and answers 404 for a cell with no entry or another team', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    const missing = await coach.delete(cellPath(athleteId, wk(2)));
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty(['query.version']);
    expect((await coach.delete(`${cellPath(athleteId, wk(2))}?version=1`)).status).toBe(404);
    await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[0] });
    expect((await otherHead.delete(`${cellPath(athleteId, wk(2))}?version=1`)).status).toBe(404);
  });
});

describe('POST /api/plans/batch', () => {
  it('swaps two cells in one go', async () => {
    const a = await createAthlete(db(), team.teamId);
    const b = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(a, wk(2))).send({ variantId: lib.squat[0] });
    await coach.put(cellPath(b, wk(2))).send({ variantId: lib.squat[1] });
    const res = await coach.post('/api/plans/batch').send({
      changes: [
        { athleteId: a, week: wk(2), slotId: 'lower', variantId: lib.squat[1], version: 1 },
        { athleteId: b, week: wk(2), slotId: 'lower', variantId: lib.squat[0], version: 1 },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(res.body.items.map((e: { variantId: number; version: number }) => [e.variantId, e.version])).toEqual([
      [lib.squat[1], 2],
      [lib.squat[0], 2],
    ]);
  });

  it('writes nothing when one change is stale', async () => {
    const a = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(a, wk(2))).send({ variantId: lib.squat[0] });
    const res = await coach.post('/api/plans/batch').send({
      changes: [
        { athleteId: a, week: wk(3), slotId: 'lower', variantId: lib.squat[2], version: 0 },
        { athleteId: a, week: wk(2), slotId: 'lower', variantId: lib.squat[1], version: 5 },
      ],
    });
    expect(res.status).toBe(409);
    expect(res.body.error.current).toEqual([
      expect.objectContaining({
        athleteId: a,
        week: wk(2),
        slotId: 'lower',
        entry: expect.objectContaining({ version: 1 }),
      }),
    ]);
    expect(await historyOf(a, wk(3), 'lower')).toHaveLength(0);
  });

  it('rolls every change back when a later write fails', async () => {
    const a = await createAthlete(db(), team.teamId);
    const b = await createAthlete(db(), team.teamId);
    // A trigger that fails history rows of athlete b only, so the failure comes after a's entry is written.
    await db().execute(
      sql.raw(`CREATE TRIGGER plans_test_fail_${b} BEFORE INSERT ON plan_entry_history FOR EACH ROW
        BEGIN IF NEW.athlete_id = ${b} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'injected failure'; END IF; END`),
    );
    try {
      const res = await coach.post('/api/plans/batch').send({
        changes: [
          { athleteId: a, week: wk(2), slotId: 'lower', variantId: lib.squat[0] },
          { athleteId: b, week: wk(2), slotId: 'lower', variantId: lib.squat[1] },
        ],
      });
      expect(res.status).toBe(500);
      expect(JSON.stringify(res.body)).not.toMatch(/injected|SIGNAL|\.ts:/);
    } finally {
      await db().execute(sql.raw(`DROP TRIGGER plans_test_fail_${b}`));
    }
    const written = await db()
      .select()
      .from(planEntries)
      .where(sql`${planEntries.athleteId} in (${a}, ${b})`);
    expect(written).toEqual([]);
  });

  it('refuses an empty batch and the same cell twice, by field', async () => {
    const empty = await coach.post('/api/plans/batch').send({ changes: [] });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields).toHaveProperty('changes');
    const a = team.athleteId;
    const twice = await coach.post('/api/plans/batch').send({
      changes: [
        { athleteId: a, week: wk(2), slotId: 'lower', variantId: lib.squat[0] },
        { athleteId: a, week: wk(2), slotId: 'lower', variantId: lib.squat[1] },
      ],
    });
    expect(twice.status).toBe(422);
    expect(twice.body.error.fields).toHaveProperty(['changes.1']);
  });

  it('asks for a reason per change that breaks a rule, naming the field of that change', async () => {
    const a = await createAthlete(db(), team.teamId);
    const res = await coach.post('/api/plans/batch').send({
      changes: [
        { athleteId: a, week: wk(2), slotId: 'lower', variantId: lib.squat[3] },
        { athleteId: a, week: wk(3), slotId: 'lower', variantId: lib.squat[3] },
      ],
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['changes.0.reason', 'changes.1.reason']);
  });

  it("answers 404 for another team's athlete", async () => {
    const res = await otherHead.post('/api/plans/batch').send({
      changes: [{ athleteId: team.athleteId, week: wk(2), slotId: 'lower', variantId: otherVariant }],
    });
    expect(res.status).toBe(404);
  });
});

describe('GET /api/plans/:athleteId/:week/:slotId/history', () => {
  it('lists every change of the cell, newest first, with names', async () => {
    const athleteId = await createAthlete(db(), team.teamId);
    await coach.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[0] });
    await head.put(cellPath(athleteId, wk(2))).send({ variantId: lib.squat[1], version: 1 });
    await head.delete(`${cellPath(athleteId, wk(2))}?version=2`);
    const res = await coach.get(`${cellPath(athleteId, wk(2))}/history`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(3);
    const [name0, name1] = await Promise.all(
      [lib.squat[0]!, lib.squat[1]!].map(
        async (id) => (await db().select().from(variants).where(eq(variants.id, id)))[0]!.name,
      ),
    );
    expect(
      res.body.items.map((h: { version: number; oldVariantName: string | null; newVariantName: string | null }) => [
        h.version,
        h.oldVariantName,
        h.newVariantName,
      ]),
    ).toEqual([
      [3, name1, null],
      [2, name0, name1],
      [1, null, name0],
    ]);
    expect(res.body.items[0].changedByName).toMatch(/Test head_coach/);
    const page = await coach.get(`${cellPath(athleteId, wk(2))}/history?limit=1&offset=1`);
    expect(page.body).toMatchObject({ total: 3, items: [expect.objectContaining({ version: 2 })] });
  });

  it("validates the paging and answers 404 for another team's athlete", async () => {
    expect((await coach.get(`${cellPath(team.athleteId, wk(2))}/history?limit=0`)).status).toBe(422);
    expect((await otherHead.get(`${cellPath(team.athleteId, wk(2))}/history`)).status).toBe(404);
  });
});

describe('GET /api/plans', () => {
  it('lists the team’s entries with week, athlete and source filters, sorting and paging', async () => {
    const a = await createAthlete(db(), team.teamId, { name: 'Aaron List' });
    const weeks = ['2025-W10', '2025-W11', '2025-W12'];
    for (const [i, week] of weeks.entries()) {
      await createPlanEntry(db(), team.teamId, a, lib.squat[i]!, { week, source: i === 1 ? 'coach' : 'engine' });
    }
    await createPlanEntry(db(), other.teamId, await createAthlete(db(), other.teamId), otherVariant, {
      week: '2025-W11',
    });
    const all = await coach.get(`/api/plans?from=2025-W10&to=2025-W12&athleteId=${a}`);
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(3);
    expect(all.body.items.map((e: { week: string }) => e.week)).toEqual(weeks);
    const desc = await coach.get(`/api/plans?from=2025-W10&to=2025-W12&athleteId=${a}&sort=-week&limit=2`);
    expect(desc.body.total).toBe(3);
    expect(desc.body.items.map((e: { week: string }) => e.week)).toEqual(['2025-W12', '2025-W11']);
    const coachOnly = await coach.get(`/api/plans?athleteId=${a}&source=coach`);
    expect(coachOnly.body.items.map((e: { week: string }) => e.week)).toEqual(['2025-W11']);
    const theirs = await otherHead.get(`/api/plans?athleteId=${a}`);
    expect(theirs.body).toEqual({ items: [], total: 0 });
  });

  it('reports bad filters by field', async () => {
    const res = await coach.get('/api/plans?sort=name&limit=9999&source=robot&from=W12');
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'query.from',
      'query.limit',
      'query.sort',
      'query.source',
    ]);
    const range = await coach.get('/api/plans?from=2025-W12&to=2025-W10');
    expect(range.status).toBe(422);
    expect(range.body.error.fields['query.to']).toEqual(['Must not be before "from"']);
  });
});
