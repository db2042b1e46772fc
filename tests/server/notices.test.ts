// Notices for coaches: each trigger (pain in a check-in, a much lower top set, a missed one, a new video,
// a new message from the athlete) reaches every coach of the team and no one else; read marks; and the
// daily e-mail summary (once a day, not when turned off, not when there is nothing, off by its own link).
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq, like } from 'drizzle-orm';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import type { NoticeList } from '../../shared/schemas';
import { outbox } from '../../server/db/schema';
import {
  MUCH_LOWER_RATIO,
  isMuchLower,
  noticeMissedTopSets,
  sendNoticeDigests,
} from '../../server/modules/notices/notices.service';
import { useTestApp } from '../support/app';
import {
  createPlanEntry,
  createTeam,
  createTopSet,
  createVariant,
  publishAthleteWeek,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const thisWeek = weekOfDate(new Date());
let team: TestTeam;
let other: TestTeam;
let athlete: request.Agent;
let coach: request.Agent;
let headCoach: request.Agent;
let otherCoach: request.Agent;
let press: number;
let pressEntry: number;

async function noticesOf(agent: request.Agent): Promise<NoticeList> {
  const res = await agent.get('/api/notices?limit=100');
  expect(res.status).toBe(200);
  return res.body as NoticeList;
}

const tinyWebm = () => {
  const docType = Buffer.from([0x42, 0x82, 0x84, ...Buffer.from('webm')]);
  return Buffer.concat([Buffer.from([0x1a, 0x45, 0xdf, 0xa3, 0x80 | docType.length]), docType, Buffer.alloc(64)]);
};

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  press = await createVariant(db, team.teamId, { lift: 'bench', name: 'Test pin press', stress: { elbow: 2 } });
  pressEntry = await createPlanEntry(db, team.teamId, team.athleteId, press, { week: thisWeek, slotId: 'upper' });
  // The best so far on the variant: a single at 150 kg (e1RM 150 kg).
  await createTopSet(db, team.teamId, team.athleteId, press, { week: addWeeks(thisWeek, -3), weightKg: 150 });
  athlete = await t.signIn(team.athleteUser.email);
  coach = await t.signIn(team.coach.email);
  headCoach = await t.signIn(team.headCoach.email);
  otherCoach = await t.signIn(other.headCoach.email);
});

describe('what "much lower" means', () => {
  it('under 90 % of the best e1RM on the variant (a coaching rule of thumb, no published source)', () => {
    expect(MUCH_LOWER_RATIO).toBe(0.9);
    expect(isMuchLower(134.9, 150)).toBe(true);
    expect(isMuchLower(135, 150)).toBe(false);
    expect(isMuchLower(100, null)).toBe(false);
  });
});

describe('triggers', () => {
  it('a top set at or above 90 % of the best makes no notice; one well under makes one per coach', async () => {
    const fine = await athlete
      .post('/api/top-sets')
      .send({ planEntryId: pressEntry, unit: 'kg', weight: 140, reps: 1 });
    expect(fine.status).toBe(201);
    expect((await noticesOf(coach)).items.filter((n) => n.kind === 'top_set_low')).toEqual([]);

    // 120 kg × 1: e1RM 120 kg (Epley: one rep is the weight itself), 80 % of the 150 kg best.
    const low = await athlete.post('/api/top-sets').send({ planEntryId: pressEntry, unit: 'kg', weight: 120, reps: 1 });
    expect(low.status).toBe(201);
    for (const agent of [coach, headCoach]) {
      const list = await noticesOf(agent);
      const found = list.items.filter((n) => n.kind === 'top_set_low');
      expect(found).toHaveLength(1);
      expect(found[0]).toMatchObject({ athleteId: team.athleteId, read: false, path: `/athletes/${team.athleteId}` });
      expect(found[0]!.text).toMatch(/Test pin press top set 20 % under the best e1RM/);
    }
    expect((await noticesOf(otherCoach)).total).toBe(0);
  });

  it('pain in a check-in reaches the coaches; a check-in without pain does not', async () => {
    const before = (await noticesOf(coach)).items.filter((n) => n.kind === 'pain').length;
    const calm = await athlete.post('/api/tissue/checkins').send({ week: thisWeek, soreness: 1, painJoints: [] });
    expect(calm.status).toBe(201);
    expect((await noticesOf(coach)).items.filter((n) => n.kind === 'pain')).toHaveLength(before);
    const sore = await athlete
      .post('/api/tissue/checkins')
      .send({ week: thisWeek, soreness: 3, painJoints: ['elbow', 'lowerBack'] });
    expect(sore.status).toBe(201);
    const pain = (await noticesOf(headCoach)).items.filter((n) => n.kind === 'pain');
    expect(pain).toHaveLength(before + 1);
    expect(pain[0]!.text).toMatch(/reported pain \(elbow, lower back\)/);
  });

  it('a new video reaches the coaches', async () => {
    const setId = await createTopSet(t.ctx.database.db, team.teamId, team.athleteId, press, { week: thisWeek });
    const res = await athlete.post(`/api/top-sets/${setId}/video`).attach('video', tinyWebm(), 'set.webm');
    expect(res.status).toBe(201);
    const video = (await noticesOf(coach)).items.filter((n) => n.kind === 'video');
    expect(video).toHaveLength(1);
    expect(video[0]!.text).toMatch(/uploaded a top-set video/);
  });

  it("the athlete's message reaches the coaches; a coach's reply makes no notice", async () => {
    const thread = `/api/messages/threads/${team.athleteId}/${thisWeek}`;
    expect((await athlete.post(thread).send({ body: 'Can I move Thursday to Friday?' })).status).toBe(201);
    expect((await coach.post(thread).send({ body: 'Yes, fine.' })).status).toBe(201);
    const msgs = (await noticesOf(headCoach)).items.filter((n) => n.kind === 'message');
    expect(msgs).toHaveLength(1);
    expect(msgs[0]!.text).toMatch(/“Can I move Thursday to Friday\?”/);
  });

  it('a published pick with no top set once its week is over is a missed top set, noticed once', async () => {
    const db = t.ctx.database.db;
    const lastWeek = addWeeks(thisWeek, -1);
    const squat = await createVariant(db, team.teamId, { lift: 'squat', name: 'Missed-week box squat' });
    await createPlanEntry(db, team.teamId, team.athleteId, squat, { week: lastWeek, slotId: 'lower' });
    await publishAthleteWeek(db, team.teamId, team.athleteId, lastWeek);
    await noticeMissedTopSets(t.ctx);
    await noticeMissedTopSets(t.ctx);
    const missed = (await noticesOf(coach)).items.filter((n) => n.kind === 'top_set_missed');
    expect(missed).toHaveLength(1);
    // Named as the coach knows it: the slot's label from the team's rules and the variant.
    expect(missed[0]!.text).toMatch(/ logged no top set for Lower max effort \(Missed-week box squat\) in /);
    expect(missed[0]!.text.endsWith(lastWeek)).toBe(true);
  });
});

describe('reading notices', () => {
  it('counts unread, marks one and then all read, per coach; another coach’s notice is not found', async () => {
    const list = await noticesOf(coach);
    expect(list.unread).toBe(list.items.filter((n) => !n.read).length);
    const ids = list.items.map((n) => n.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    const first = list.items[0]!;
    expect((await coach.put(`/api/notices/${first.id}/read`)).status).toBe(200);
    expect((await noticesOf(coach)).unread).toBe(list.unread - 1);
    // The head coach's copy stays unread; another team cannot touch it.
    expect((await noticesOf(headCoach)).unread).toBeGreaterThanOrEqual(list.unread);
    expect((await otherCoach.put(`/api/notices/${first.id}/read`)).status).toBe(404);
    expect((await athlete.get('/api/notices')).status).toBe(403);
    expect((await coach.put('/api/notices/read-all')).status).toBe(200);
    expect((await noticesOf(coach)).unread).toBe(0);
    expect((await noticesOf(headCoach)).unread).toBeGreaterThan(0);
  });
});

describe('the daily e-mail summary', () => {
  const day = (d: number, hour: number) => {
    const x = new Date();
    x.setUTCDate(x.getUTCDate() + d);
    x.setUTCHours(hour, 0, 0, 0);
    return x;
  };
  const digestsTo = (email: string) =>
    t.ctx.database.db
      .select()
      .from(outbox)
      .where(and(eq(outbox.toEmail, email), like(outbox.dedupeKey, 'notice-digest:%')));

  it('is not sent before the hour of the day, then once a day with the unread notices', async () => {
    expect(await sendNoticeDigests(t.ctx, day(1, 5))).toBe(0);
    expect(await digestsTo(team.headCoach.email)).toHaveLength(0);
    await sendNoticeDigests(t.ctx, day(1, 7));
    // The coach had read every notice: no summary for them.
    expect(await digestsTo(team.coach.email)).toHaveLength(0);
    const sent = await digestsTo(team.headCoach.email);
    expect(sent).toHaveLength(1);
    expect(sent[0]!.subject).toMatch(/new notices from your athletes/);
    expect(sent[0]!.textBody).toMatch(/reported pain/);
    expect(sent[0]!.headers?.['List-Unsubscribe']).toMatch(/\/api\/notices\/daily-email\/off\?token=/);
    // Later the same day: nothing more, even with a new notice.
    await athlete.post(`/api/messages/threads/${team.athleteId}/${thisWeek}`).send({ body: 'One more thing.' });
    await sendNoticeDigests(t.ctx, day(1, 20));
    expect(await digestsTo(team.headCoach.email)).toHaveLength(1);
    // The next day, the notice not yet summarised goes out.
    await sendNoticeDigests(t.ctx, day(2, 7));
    const next = await digestsTo(team.headCoach.email);
    expect(next).toHaveLength(2);
    expect(next[1]!.textBody).toMatch(/One more thing/);
    expect(next[1]!.textBody).not.toMatch(/reported pain/);
  });

  it('is not sent when there is nothing unread', async () => {
    expect((await coach.put('/api/notices/read-all')).status).toBe(200);
    const before = (await digestsTo(team.coach.email)).length;
    await sendNoticeDigests(t.ctx, day(5, 7));
    expect(await digestsTo(team.coach.email)).toHaveLength(before);
  });

  it('is not sent when the coach turned it off, in the app or through the link in the e-mail', async () => {
    expect((await headCoach.get('/api/notices/settings')).body).toEqual({ dailyEmail: true });
    const bad = await headCoach.put('/api/notices/settings').send({ dailyEmail: 'no' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.dailyEmail).toBeDefined();
    expect((await headCoach.put('/api/notices/settings').send({ dailyEmail: false })).body).toEqual({
      dailyEmail: false,
    });
    await athlete.post(`/api/messages/threads/${team.athleteId}/${thisWeek}`).send({ body: 'Anyone there?' });
    await sendNoticeDigests(t.ctx, day(6, 7));
    expect(await digestsTo(team.headCoach.email)).toHaveLength(2);

    // Back on; then off again through the e-mail's own link.
    await headCoach.put('/api/notices/settings').send({ dailyEmail: true });
    await sendNoticeDigests(t.ctx, day(7, 7));
    const all = await digestsTo(team.headCoach.email);
    expect(all).toHaveLength(3);
    const link = new URL(all[2]!.headers!['List-Unsubscribe']!.slice(1, -1));
    const off = request(t.app);
    const page = await off.post(`${link.pathname}${link.search}`);
    expect(page.status).toBe(200);
    expect(page.text).toMatch(/Daily summaries are off/);
    expect((await headCoach.get('/api/notices/settings')).body).toEqual({ dailyEmail: false });
    expect((await off.get('/api/notices/daily-email/off?token=forged.token.value')).status).toBe(400);
  });
});
