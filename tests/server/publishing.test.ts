// Publishing a week: every athlete of the team with an account and weekly e-mails on gets exactly one
// e-mail (publishing twice sends once) with their picks and tissue work, a link to My week and a way out.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq, like } from 'drizzle-orm';
import { outbox, planEntries, users, weekPublications } from '../../server/db/schema';
import { inboxClient } from '../../server/standins/smtp';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { useTestApp } from '../support/app';
import { createAthlete, createTeam, createUser, createVariant, type TestTeam } from '../support/factories';
import { startSession } from '../../server/modules/auth/sessions.service';

const t = useTestApp();
const inbox = inboxClient();
let team: TestTeam;
let coach: request.Agent;
const week = addWeeks(weekOfDate(new Date()), 1);

interface Recipient {
  athleteId: number;
  email: string;
}
const recipients: Recipient[] = [];
let mutedEmail: string;
let squatName: string;

async function plan(athleteId: number, slotId: string, variantId: number) {
  await t.ctx.database.db
    .insert(planEntries)
    .values({ teamId: team.teamId, athleteId, week, slotId, variantId, source: 'engine', reasons: [] });
}

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  coach = await t.signIn(team.coach.email);
  squatName = `Box squat <b>wide</b> & low ${team.teamId}`;
  const squat = await createVariant(db, team.teamId, {
    name: squatName,
    scheme: 'triple',
    notes: 'Sit back; pause 1 s',
  });
  const bench = await createVariant(db, team.teamId, {
    name: `Floor press ${team.teamId}`,
    lift: 'bench',
    family: 'floor press',
    stress: { shoulder: 1, elbow: 2 },
  });
  recipients.push({ athleteId: team.athleteId, email: team.athleteUser.email });
  const second = await createUser(db, team.teamId, 'athlete');
  const secondId = await createAthlete(db, team.teamId, { userId: second.id, name: 'Second Athlete' });
  recipients.push({ athleteId: secondId, email: second.email });
  // With weekly e-mails off, and without an account: neither gets anything.
  const muted = await createUser(db, team.teamId, 'athlete');
  await createAthlete(db, team.teamId, { userId: muted.id });
  await db.update(users).set({ weeklyEmail: false }).where(eq(users.id, muted.id));
  mutedEmail = muted.email;
  await createAthlete(db, team.teamId, { name: 'No Account' });
  for (const r of recipients) {
    await plan(r.athleteId, 'lower', squat);
    await plan(r.athleteId, 'upper', bench);
  }
});

describe('POST /api/weeks/:week/publish', () => {
  it('e-mails each athlete once, even when published twice', async () => {
    const before = await coach.get(`/api/weeks/${week}/publication`);
    expect(before.status).toBe(200);
    expect(before.body).toMatchObject({ week, published: false, recipients: 2, queued: 0, sent: 0 });

    const first = await coach.post(`/api/weeks/${week}/publish`);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ week, published: true, alreadyPublished: false, recipients: 2 });
    expect(first.body.publishedByName).toContain('Test coach');

    const second = await coach.post(`/api/weeks/${week}/publish`);
    expect(second.status).toBe(200);
    expect(second.body.alreadyPublished).toBe(true);
    const head = await t.signIn(team.headCoach.email);
    expect((await head.post(`/api/weeks/${week}/publish`)).body.alreadyPublished).toBe(true);

    for (const r of recipients) await inbox.waitFor(r.email);
    await t.ctx.services.mail.sendDue();
    for (const r of recipients) expect(await inbox.list({ to: r.email })).toHaveLength(1);
    expect(await inbox.list({ to: mutedEmail })).toHaveLength(0);
    const rows = await t.ctx.database.db
      .select()
      .from(outbox)
      .where(and(eq(outbox.teamId, team.teamId), like(outbox.dedupeKey, `weekly:%`)));
    expect(rows).toHaveLength(2);
    const after = await coach.get(`/api/weeks/${week}/publication`);
    expect(after.body).toMatchObject({ published: true, sent: 2, queued: 0 });
    const pubs = await t.ctx.database.db
      .select()
      .from(weekPublications)
      .where(eq(weekPublications.teamId, team.teamId));
    expect(pubs).toHaveLength(1);
  });

  it('carries the picks, the tissue work, My week and the way out, in text and HTML, escaped', async () => {
    const [mail] = await inbox.waitFor(team.athleteUser.email);
    expect(mail!.subject).toMatch(new RegExp(`^Your week of \\d+ \\w+: ${team.name}$`));
    expect(mail!.text).toContain(`Lower max effort: ${squatName}`);
    expect(mail!.text).toContain('Work up to a top triple');
    expect(mail!.text).toContain('Sit back; pause 1 s');
    expect(mail!.text).toContain(`Upper max effort: Floor press ${team.teamId}`);
    expect(mail!.text).toContain('Connective-tissue work');
    expect(mail!.text).toContain('http://127.0.0.1:3999/my-week');
    expect(mail!.text).toMatch(
      /Stop these weekly e-mails: http:\/\/127\.0\.0\.1:3999\/api\/email\/unsubscribe\?token=/,
    );
    expect(mail!.html).toContain('Box squat &lt;b&gt;wide&lt;/b&gt; &amp; low');
    expect(mail!.html).not.toContain('<b>wide</b>');
    expect(mail!.html).toContain('href="http://127.0.0.1:3999/my-week"');
    expect(mail!.html).toMatch(/Stop the set on sharp or unusual pain/);
    // No images, pixels or anything fetched from elsewhere.
    expect(mail!.html).not.toMatch(/<img|url\(|<link|<script/i);
    const hosts = [...mail!.html.matchAll(/https?:\/\/[^/"'\s]+/g)].map((m) => m[0]);
    expect(new Set(hosts)).toEqual(new Set(['http://127.0.0.1:3999']));
    expect(mail!.headers['list-unsubscribe']).toMatch(/^<http:\/\/127\.0\.0\.1:3999\/api\/email\/unsubscribe\?token=/);
    expect(mail!.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
  });

  it('the way out turns weekly e-mails off (and back on) for that account only', async () => {
    const [mail] = await inbox.waitFor(recipients[1]!.email);
    const url = new URL(/<(.+)>/.exec(mail!.headers['list-unsubscribe']!)![1]!);
    const off = await request(t.app).get(`${url.pathname}${url.search}`);
    expect(off.status).toBe(200);
    expect(off.type).toBe('text/html');
    expect(off.text).toContain('Weekly e-mails are off');
    expect(off.headers['content-security-policy']).toMatch(/default-src 'none'/);
    // The page's own font comes from the app, never from elsewhere.
    expect(off.text).toContain('url(/api/email/font/400.woff2)');
    const font = await request(t.app).get('/api/email/font/400.woff2');
    expect(font.status).toBe(200);
    expect(font.headers['content-type']).toBe('font/woff2');
    expect((await request(t.app).get('/api/email/font/900.woff2')).status).toBe(422);
    const weekly = async (email: string) =>
      (await t.ctx.database.db.select().from(users).where(eq(users.email, email)))[0]!.weeklyEmail;
    expect(await weekly(recipients[1]!.email)).toBe(false);
    expect(await weekly(recipients[0]!.email)).toBe(true);
    expect((await coach.get(`/api/weeks/${addWeeks(week, 1)}/publication`)).body.recipients).toBe(1);

    const on = await request(t.app).post(`/api/email/resubscribe${url.search}`);
    expect(on.status).toBe(200);
    expect(await weekly(recipients[1]!.email)).toBe(true);
    // Mail programs' one-click POST does the same as the link.
    expect((await request(t.app).post(`${url.pathname}${url.search}`)).status).toBe(200);
    expect(await weekly(recipients[1]!.email)).toBe(false);
    await request(t.app).post(`/api/email/resubscribe${url.search}`);

    const forged = await request(t.app).get('/api/email/unsubscribe?token=eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOiIxIn0.bad');
    expect(forged.status).toBe(400);
    expect(forged.text).toContain('Link not valid');
  });

  it('a session token is not an unsubscribe token', async () => {
    const session = await startSession(
      t.ctx,
      { userId: team.athleteUser.id, teamId: team.teamId, role: 'athlete' },
      'test',
    );
    const res = await request(t.app).get(`/api/email/unsubscribe?token=${session}`);
    expect(res.status).toBe(400);
  });

  it('checks the week and the role, and keeps teams apart', async () => {
    const bad = await coach.post('/api/weeks/2027-W60/publish');
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['params.week']);
    const athlete = await t.signIn(team.athleteUser.email);
    expect((await athlete.post(`/api/weeks/${week}/publish`)).status).toBe(403);

    const otherTeam = await createTeam(t.ctx.database.db);
    const otherSquat = await createVariant(t.ctx.database.db, otherTeam.teamId);
    await t.ctx.database.db.insert(planEntries).values({
      teamId: otherTeam.teamId,
      athleteId: otherTeam.athleteId,
      week,
      slotId: 'lower',
      variantId: otherSquat,
      source: 'engine',
      reasons: [],
    });
    const otherCoach = await t.signIn(otherTeam.coach.email);
    const before = (await inbox.list({ to: team.athleteUser.email })).length;
    const res = await otherCoach.post(`/api/weeks/${week}/publish`);
    expect(res.status).toBe(201);
    expect(res.body.recipients).toBe(1);
    await inbox.waitFor(otherTeam.athleteUser.email);
    await t.ctx.services.mail.sendDue();
    expect(await inbox.list({ to: team.athleteUser.email })).toHaveLength(before);
  });

  it('an athlete without picks that week sees an empty published week and gets no e-mail', async () => {
    const lone = await createTeam(t.ctx.database.db);
    const agent = await t.signIn(lone.headCoach.email);
    const res = await agent.post(`/api/weeks/${week}/publish`);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ athletesPublished: 1, emailsQueued: 0 });
    expect(res.body.check.emptyCells.count).toBe(2);
    await t.ctx.services.mail.sendDue();
    expect(await inbox.list({ to: lone.athleteUser.email })).toHaveLength(0);
    const athlete = await t.signIn(lone.athleteUser.email);
    const mine = await athlete.get(`/api/my-week?week=${week}`);
    expect(mine.body).toMatchObject({ published: true, picks: [] });
  });

  it('only this week or next week can be published, with a clear message', async () => {
    for (const far of [addWeeks(week, 3), addWeeks(week, -3)]) {
      const res = await coach.post(`/api/weeks/${far}/publish`).send({ dryRun: true });
      expect(res.status).toBe(422);
      expect(res.body.error.message).toMatch(/Only this week \(\d{4}-W\d\d\) or next week/);
      expect(res.body.error.fields['params.week']).toBeDefined();
    }
    const odd = await coach.post(`/api/weeks/${week}/publish`).send({ dryRun: 'yes' });
    expect(odd.status).toBe(422);
    expect(odd.body.error.fields.dryRun).toBeDefined();
  });
});
