// Messages: a thread per athlete and week between the athlete and the team's coaches — who sees which
// thread, the length limit, read marks per reader, the coaches' newest-first list, and that bad input
// stores nothing.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { messages } from '../../server/db/schema';
import { MESSAGE_MAX_LENGTH, type MessageThread, type ThreadSummary } from '../../shared/schemas';
import { useTestApp } from '../support/app';
import { createAthlete, createTeam, createUser, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let athlete: request.Agent;
let coach: request.Agent;
let headCoach: request.Agent;
let otherCoach: request.Agent;
let otherAthlete: request.Agent;
/** A second athlete of the same team, with an account. */
let mateId: number;
let mate: request.Agent;

const WEEK = '2026-W20';
const threadOf = (athleteId: number, week = WEEK) => `/api/messages/threads/${athleteId}/${week}`;

async function storedCount(athleteId: number, week = WEEK) {
  const rows = await t.ctx.database.db
    .select({ id: messages.id })
    .from(messages)
    .where(and(eq(messages.athleteId, athleteId), eq(messages.week, week)));
  return rows.length;
}

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  const mateUser = await createUser(db, team.teamId, 'athlete');
  mateId = await createAthlete(db, team.teamId, { userId: mateUser.id, name: 'Second Athlete' });
  athlete = await t.signIn(team.athleteUser.email);
  coach = await t.signIn(team.coach.email);
  headCoach = await t.signIn(team.headCoach.email);
  otherCoach = await t.signIn(other.headCoach.email);
  otherAthlete = await t.signIn(other.athleteUser.email);
  mate = await t.signIn(mateUser.email);
});

describe('a thread between the athlete and the coaches', () => {
  it('the athlete asks, a coach answers with a link to a cell, both read the thread in order', async () => {
    const asked = await athlete
      .post(threadOf(team.athleteId))
      .send({ body: '  Elbow is cranky, can I swap the floor press?  ' });
    expect(asked.status).toBe(201);
    expect(asked.body).toMatchObject({
      body: 'Elbow is cranky, can I swap the floor press?',
      authorRole: 'athlete',
      mine: true,
      link: null,
    });

    const answered = await coach
      .post(threadOf(team.athleteId))
      .send({ body: 'Yes: take the pin press I put in instead.', link: { week: WEEK, slotId: 'upper' } });
    expect(answered.status).toBe(201);
    expect(answered.body.link).toEqual({ week: WEEK, slotId: 'upper' });

    const seen = await athlete.get(threadOf(team.athleteId));
    expect(seen.status).toBe(200);
    const thread = seen.body as MessageThread;
    expect(thread.items.map((m) => m.authorRole)).toEqual(['athlete', 'coach']);
    expect(thread.items[1]).toMatchObject({ mine: false, authorName: expect.stringMatching(/^Test coach /) });
    expect(thread.unread).toBe(1);
  });

  it('keeps read marks per reader: one coach reading does not mark it read for the other', async () => {
    const week = '2026-W21';
    await athlete.post(threadOf(team.athleteId, week)).send({ body: 'Bar speed felt slow today.' });
    expect((await coach.get(threadOf(team.athleteId, week))).body.unread).toBe(1);
    expect((await headCoach.get(threadOf(team.athleteId, week))).body.unread).toBe(1);

    expect((await coach.put(`${threadOf(team.athleteId, week)}/read`)).status).toBe(200);
    expect((await coach.get(threadOf(team.athleteId, week))).body.unread).toBe(0);
    expect((await headCoach.get(threadOf(team.athleteId, week))).body.unread).toBe(1);
    // The athlete's own message is not unread for the athlete.
    expect((await athlete.get(threadOf(team.athleteId, week))).body.unread).toBe(0);
  });

  it("lists the coaches' threads newest first, with unread counts, and one athlete's on request", async () => {
    await mate.post(threadOf(mateId, '2026-W19')).send({ body: 'Is the meet entry sorted?' });
    const list = await headCoach.get('/api/messages/threads');
    expect(list.status).toBe(200);
    const items = list.body.items as ThreadSummary[];
    const ids = items.map((i) => i.lastMessage.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    expect(items[0]).toMatchObject({ athleteId: mateId, week: '2026-W19', unread: 1, count: 1 });
    expect(list.body.total).toBe(3);

    const one = await headCoach.get(`/api/messages/threads?athleteId=${team.athleteId}`);
    expect((one.body.items as ThreadSummary[]).every((i) => i.athleteId === team.athleteId)).toBe(true);
    expect(one.body.total).toBe(2);
  });
});

describe('scoping', () => {
  it("an athlete sees only their own threads: a team-mate's thread is not found", async () => {
    expect((await athlete.get(threadOf(mateId, '2026-W19'))).status).toBe(404);
    const before = await storedCount(mateId, '2026-W19');
    expect((await athlete.post(threadOf(mateId, '2026-W19')).send({ body: 'Hi' })).status).toBe(404);
    expect(await storedCount(mateId, '2026-W19')).toBe(before);
    const own = await athlete.get('/api/messages/threads');
    expect((own.body.items as ThreadSummary[]).every((i) => i.athleteId === team.athleteId)).toBe(true);
    expect((await athlete.get(`/api/messages/threads?athleteId=${mateId}`)).status).toBe(404);
  });

  it("another team's thread answers 404 to its coaches and athletes, and nothing is stored", async () => {
    expect((await otherCoach.get(threadOf(team.athleteId))).status).toBe(404);
    expect((await otherAthlete.get(threadOf(team.athleteId))).status).toBe(404);
    const before = await storedCount(team.athleteId);
    const res = await otherCoach.post(threadOf(team.athleteId)).send({ body: 'Hello from elsewhere' });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(await storedCount(team.athleteId)).toBe(before);
    expect((await otherCoach.put(`${threadOf(team.athleteId)}/read`)).status).toBe(404);
    const list = await otherCoach.get('/api/messages/threads');
    expect(list.body.total).toBe(0);
    expect((await otherCoach.get(`/api/messages/threads?athleteId=${team.athleteId}`)).status).toBe(404);
  });
});

describe('bad input gets a clear message and stores nothing', () => {
  it.each([
    ['empty', ''],
    ['only spaces', '   \n '],
    ['10,000 characters', 'x'.repeat(10_000)],
    ['one over the limit', 'y'.repeat(MESSAGE_MAX_LENGTH + 1)],
  ])('%s', async (_name, body) => {
    const before = await storedCount(team.athleteId);
    const res = await athlete.post(threadOf(team.athleteId)).send({ body });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields.body[0]).toMatch(body.trim() === '' ? /Write a message/ : /At most 2000 characters/);
    expect(await storedCount(team.athleteId)).toBe(before);
  });

  it('takes exactly the limit', async () => {
    const res = await coach.post(threadOf(team.athleteId, '2026-W22')).send({ body: 'z'.repeat(MESSAGE_MAX_LENGTH) });
    expect(res.status).toBe(201);
  });

  it('a body that is not text, a bad week or id in the path, a malformed link', async () => {
    expect((await athlete.post(threadOf(team.athleteId)).send({ body: 42 })).body.error.fields.body).toBeDefined();
    const badWeek = await athlete.post(`/api/messages/threads/${team.athleteId}/2026-20`).send({ body: 'Hi' });
    expect(badWeek.status).toBe(422);
    expect(badWeek.body.error.fields['params.week']).toBeDefined();
    expect((await athlete.get('/api/messages/threads/abc/2026-W20')).status).toBe(422);
    const badLink = await coach.post(threadOf(team.athleteId)).send({ body: 'See here', link: { week: 'soon' } });
    expect(badLink.status).toBe(422);
    expect(Object.keys(badLink.body.error.fields)).toEqual(expect.arrayContaining(['link.week', 'link.slotId']));
  });

  it('only coaches can link a cell', async () => {
    const before = await storedCount(team.athleteId);
    const res = await athlete
      .post(threadOf(team.athleteId))
      .send({ body: 'Look', link: { week: WEEK, slotId: 'upper' } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.link).toEqual(['Only coaches can link a board cell']);
    expect(await storedCount(team.athleteId)).toBe(before);
  });
});
