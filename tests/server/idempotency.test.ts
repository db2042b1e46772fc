// Idempotency keys on the writes an athlete's phone may send twice: a repeat answers the first answer and
// writes nothing, copies arriving at once (on two app instances) write one row, the same key with another
// body is refused, keys are per caller, and a malformed key is a clear 400.
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, count, eq } from 'drizzle-orm';
import { weekOfDate } from '../../shared/engine/weeks';
import { idempotencyKeys, tissueCheckins, topSets } from '../../server/db/schema';
import { sweepIdempotencyKeys } from '../../server/db/idempotency-store';
import { TEST_PASSWORD, useTestApp } from '../support/app';
import { createPlanEntry, createTeam, createVariant, publishAthleteWeek, type TestTeam } from '../support/factories';

const t = useTestApp();
// A second instance: its own app and connection pool on the same database, as behind a load balancer.
const t2 = useTestApp();
const thisWeek = weekOfDate(new Date());
let team: TestTeam;
let other: TestTeam;
let athlete: request.Agent;
let entryId: number;

async function topSetCount(athleteId: number) {
  const [row] = await t.ctx.database.db.select({ n: count() }).from(topSets).where(eq(topSets.athleteId, athleteId));
  return row!.n;
}

async function checkinCount(athleteId: number) {
  const [row] = await t.ctx.database.db
    .select({ n: count() })
    .from(tissueCheckins)
    .where(eq(tissueCheckins.athleteId, athleteId));
  return row!.n;
}

/** The same signed-in session on the second instance (the session lives in the database). */
async function onSecondInstance(email: string) {
  const agent = request.agent(t2.app);
  const res = await agent.post('/api/auth/login').send({ email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return agent;
}

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  const variantId = await createVariant(db, team.teamId, { name: `Pin press ${Date.now()}`, scheme: 'triple' });
  entryId = await createPlanEntry(db, team.teamId, team.athleteId, variantId, { week: thisWeek });
  await publishAthleteWeek(db, team.teamId, team.athleteId, thisWeek);
  athlete = await t.signIn(team.athleteUser.email);
});

describe('Idempotency-Key on POST /api/top-sets', () => {
  it('answers a repeat with the first answer and keeps one row', async () => {
    const before = await topSetCount(team.athleteId);
    const key = randomUUID();
    const body = { planEntryId: entryId, unit: 'kg', weight: 120, reps: 3, rpe: 8 };
    const first = await athlete.post('/api/top-sets').set('Idempotency-Key', key).send(body);
    expect(first.status).toBe(201);
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    const again = await athlete.post('/api/top-sets').set('Idempotency-Key', key).send(body);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await topSetCount(team.athleteId)).toBe(before + 1);
  });

  it('treats the same body with its fields in another order as the same request', async () => {
    const before = await topSetCount(team.athleteId);
    const key = randomUUID();
    await athlete
      .post('/api/top-sets')
      .set('Idempotency-Key', key)
      .send({ planEntryId: entryId, unit: 'kg', weight: 121, reps: 2 })
      .expect(201);
    const again = await athlete
      .post('/api/top-sets')
      .set('Idempotency-Key', key)
      .send({ reps: 2, weight: 121, unit: 'kg', planEntryId: entryId });
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(await topSetCount(team.athleteId)).toBe(before + 1);
  });

  it('writes one row when copies arrive at once on two instances', async () => {
    const before = await topSetCount(team.athleteId);
    const second = await onSecondInstance(team.athleteUser.email);
    const key = randomUUID();
    const body = { planEntryId: entryId, unit: 'kg', weight: 122.5, reps: 3 };
    const answers = await Promise.all(
      [athlete, second, athlete, second, athlete, second].map((agent) =>
        agent.post('/api/top-sets').set('Idempotency-Key', key).send(body),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201, 201, 201, 201]);
    expect(answers.filter((a) => a.headers['idempotent-replayed'] !== 'true')).toHaveLength(1);
    const ids = new Set(answers.map((a) => (a.body as { topSet: { id: number } }).topSet.id));
    expect(ids.size).toBe(1);
    expect(await topSetCount(team.athleteId)).toBe(before + 1);
  });

  it('refuses the same key with another body, writing nothing', async () => {
    const key = randomUUID();
    await athlete
      .post('/api/top-sets')
      .set('Idempotency-Key', key)
      .send({ planEntryId: entryId, unit: 'kg', weight: 123, reps: 3 })
      .expect(201);
    const before = await topSetCount(team.athleteId);
    const changed = await athlete
      .post('/api/top-sets')
      .set('Idempotency-Key', key)
      .send({ planEntryId: entryId, unit: 'kg', weight: 133, reps: 3 });
    expect(changed.status).toBe(422);
    expect(changed.body.error.code).toBe('idempotency_key_reused');
    expect(changed.body.error.message).toMatch(/already used for another request \(POST \/api\/top-sets\)/);
    expect(await topSetCount(team.athleteId)).toBe(before);
  });

  it("keeps keys per caller: another athlete's request with the same key is their own", async () => {
    const key = randomUUID();
    await athlete
      .post('/api/top-sets')
      .set('Idempotency-Key', key)
      .send({ planEntryId: entryId, unit: 'kg', weight: 124, reps: 3 })
      .expect(201);
    const variantId = await createVariant(t.ctx.database.db, other.teamId, { name: `Pause squat ${Date.now()}` });
    const otherEntry = await createPlanEntry(t.ctx.database.db, other.teamId, other.athleteId, variantId, {
      week: thisWeek,
    });
    await publishAthleteWeek(t.ctx.database.db, other.teamId, other.athleteId, thisWeek);
    const otherAthlete = await t.signIn(other.athleteUser.email);
    const before = await topSetCount(other.athleteId);
    const theirs = await otherAthlete
      .post('/api/top-sets')
      .set('Idempotency-Key', key)
      .send({ planEntryId: otherEntry, unit: 'kg', weight: 90, reps: 5 });
    expect(theirs.status).toBe(201);
    expect(theirs.headers['idempotent-replayed']).toBeUndefined();
    expect(theirs.body.topSet.weightKg).toBe(90);
    expect(await topSetCount(other.athleteId)).toBe(before + 1);
  });

  it('answers a key that is not a UUID with 400 and writes nothing', async () => {
    const before = await topSetCount(team.athleteId);
    for (const bad of ['', 'abc', `${randomUUID()}x`, "1' OR '1'='1"]) {
      const res = await athlete
        .post('/api/top-sets')
        .set('Idempotency-Key', bad)
        .send({ planEntryId: entryId, unit: 'kg', weight: 125, reps: 3 });
      expect(res.status).toBe(400);
      expect(res.body.error).toMatchObject({ code: 'invalid_idempotency_key' });
      expect(res.body.error.message).toMatch(/must be a UUID/);
    }
    expect(await topSetCount(team.athleteId)).toBe(before);
  });

  it('replays a refused request too, so a fixed entry needs a new key', async () => {
    const key = randomUUID();
    const bad = { planEntryId: entryId, unit: 'kg', weight: -1, reps: 3 };
    const first = await athlete.post('/api/top-sets').set('Idempotency-Key', key).send(bad);
    expect(first.status).toBe(422);
    const again = await athlete.post('/api/top-sets').set('Idempotency-Key', key).send(bad);
    expect(again.status).toBe(422);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
  });

  it('leaves requests without the header as they were', async () => {
    const before = await topSetCount(team.athleteId);
    const body = { planEntryId: entryId, unit: 'kg', weight: 126, reps: 3 };
    await athlete.post('/api/top-sets').send(body).expect(201);
    await athlete.post('/api/top-sets').send(body).expect(201);
    expect(await topSetCount(team.athleteId)).toBe(before + 2);
  });
});

describe('Idempotency-Key on the other queued writes', () => {
  it('check-ins: a repeat writes one check-in', async () => {
    const before = await checkinCount(team.athleteId);
    const key = randomUUID();
    const body = { week: thisWeek, soreness: 2, painJoints: [] };
    const answers = await Promise.all(
      [1, 2, 3].map(() => athlete.post('/api/tissue/checkins').set('Idempotency-Key', key).send(body)),
    );
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201]);
    expect(await checkinCount(team.athleteId)).toBe(before + 1);
  });

  it('bodyweights: a repeat answers the first answer; another weight under that key is refused', async () => {
    const key = randomUUID();
    const first = await athlete
      .put('/api/bodyweights/2026-11-02')
      .set('Idempotency-Key', key)
      .send({ weight: 82.4, unit: 'kg' });
    expect(first.status).toBe(201);
    const again = await athlete
      .put('/api/bodyweights/2026-11-02')
      .set('Idempotency-Key', key)
      .send({ weight: 82.4, unit: 'kg' });
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    const otherDay = await athlete
      .put('/api/bodyweights/2026-11-03')
      .set('Idempotency-Key', key)
      .send({ weight: 82.4, unit: 'kg' });
    expect(otherDay.status).toBe(422);
    expect(otherDay.body.error.message).toMatch(/PUT \/api\/bodyweights\/2026-11-02/);
  });
});

describe('keeping keys', () => {
  it('sweeps keys older than two days and lets their key be used again', async () => {
    const db = t.ctx.database.db;
    const key = randomUUID();
    await athlete
      .put('/api/bodyweights/2026-11-05')
      .set('Idempotency-Key', key)
      .send({ weight: 81, unit: 'kg' })
      .expect(201);
    const mine = and(eq(idempotencyKeys.userId, team.athleteUser.id), eq(idempotencyKeys.idemKey, key));
    await db
      .update(idempotencyKeys)
      .set({ createdAt: new Date(Date.now() - 49 * 3_600_000) })
      .where(mine);
    // An expired key is a new key: the request runs (and answers 200, the day's reading being replaced).
    const reused = await athlete
      .put('/api/bodyweights/2026-11-05')
      .set('Idempotency-Key', key)
      .send({ weight: 81.5, unit: 'kg' });
    expect(reused.status).toBe(200);
    expect(reused.headers['idempotent-replayed']).toBeUndefined();
    await db
      .update(idempotencyKeys)
      .set({ createdAt: new Date(Date.now() - 49 * 3_600_000) })
      .where(mine);
    expect(await sweepIdempotencyKeys(db)).toBeGreaterThanOrEqual(1);
    expect(await db.select().from(idempotencyKeys).where(mine)).toHaveLength(0);
  });
});
