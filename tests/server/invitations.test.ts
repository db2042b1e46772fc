// Invitations end to end through the API and the local SMTP stand-in's inbox: invite, the e-mail and its
// link, accepting once, resending, revoking, expiry, existing accounts, and team isolation.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { athletes, invitations, outbox } from '../../server/db/schema';
import { inboxClient } from '../../server/standins/smtp';
import { TEST_PASSWORD, useTestApp } from '../support/app';
import { createAthlete, createTeam, uniq, type TestTeam } from '../support/factories';

const t = useTestApp();
const inbox = inboxClient();
let team: TestTeam;
let other: TestTeam;
let head: request.Agent;

const NEW_PASSWORD = 'a-long-new-password';
const newEmail = () => `invitee-${uniq()}@example.test`;

function tokenFrom(text: string): string {
  const m = /\/accept-invitation\?token=([A-Za-z0-9_-]{43})/.exec(text);
  if (!m) throw new Error(`no invitation link in:\n${text}`);
  return m[1]!;
}

async function linkFor(email: string, count = 1): Promise<string> {
  const mails = await inbox.waitFor(email, { count });
  return tokenFrom(mails[count - 1]!.text);
}

async function accept(token: string, body: Record<string, string> = {}) {
  const agent = request.agent(t.app);
  const res = await agent.post('/api/invitation-links/accept').send({
    token,
    name: 'New Person',
    password: NEW_PASSWORD,
    confirmPassword: NEW_PASSWORD,
    ...body,
  });
  return { agent, res };
}

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
  other = await createTeam(t.ctx.database.db);
  head = await t.signIn(team.headCoach.email);
});

describe('inviting a new athlete', () => {
  it('sends an e-mail whose link works once and signs the athlete in to the team', async () => {
    const email = newEmail();
    const created = await head
      .post('/api/invitations')
      .send({ email: email.toUpperCase(), role: 'athlete', athleteName: 'Ilse Varga', sex: 'F' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email, role: 'athlete', status: 'pending', athleteName: 'Ilse Varga' });
    const expiresIn = Date.parse(created.body.expiresAt) - Date.now();
    expect(expiresIn).toBeGreaterThan(7 * 86_400_000 - 60_000);
    expect(expiresIn).toBeLessThanOrEqual(7 * 86_400_000);

    const [mail] = await inbox.waitFor(email);
    expect(mail!.subject).toBe(`Join ${team.name} on Rackturn`);
    expect(mail!.html).toContain('Accept the invitation');
    const token = tokenFrom(mail!.text);
    expect(mail!.html).toContain(`/accept-invitation?token=${token}`);
    expect(mail!.text).toContain(`http://127.0.0.1:3999/accept-invitation?token=${token}`);

    // Only the hash is kept, and the delivered e-mail's body no longer sits in the outbox.
    const [row] = await t.ctx.database.db.select().from(invitations).where(eq(invitations.id, created.body.id));
    expect(row!.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    const [queued] = await t.ctx.database.db.select().from(outbox).where(eq(outbox.toEmail, email));
    expect(queued!.sentAt).not.toBeNull();
    expect(queued!.textBody).toBe('');
    expect(queued!.htmlBody).not.toContain(token);

    const preview = await request(t.app).get(`/api/invitation-links/preview?token=${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ email, role: 'athlete', teamName: team.name, existingAccount: false });

    const { agent, res } = await accept(token, { name: 'Ilse Varga' });
    expect(res.status).toBe(200);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email, name: 'Ilse Varga', role: 'athlete', teamId: team.teamId });
    expect(me.body.athleteId).toBe(created.body.athleteId);
    // The new account signs in with its password like anyone else.
    expect((await request(t.app).post('/api/auth/login').send({ email, password: NEW_PASSWORD })).status).toBe(200);

    const again = await accept(token);
    expect(again.res.status).toBe(410);
    expect(again.res.body.error.code).toBe('invitation_used');
    const usedPreview = await request(t.app).get(`/api/invitation-links/preview?token=${token}`);
    expect(usedPreview.status).toBe(410);
    expect(usedPreview.body.error.code).toBe('invitation_used');
  });

  it('links the account to an existing roster entry without one', async () => {
    const athleteId = await createAthlete(t.ctx.database.db, team.teamId, { name: 'Rosto Entry' });
    const linkable = await head.get('/api/invitations/linkable-athletes');
    expect(linkable.body.items.map((a: { id: number }) => a.id)).toContain(athleteId);
    const email = newEmail();
    const created = await head.post('/api/invitations').send({ email, role: 'athlete', athleteId });
    expect(created.status).toBe(201);
    expect(created.body.athleteName).toBe('Rosto Entry');
    // An entry with an invitation under way is not offered again.
    const after = await head.get('/api/invitations/linkable-athletes');
    expect(after.body.items.map((a: { id: number }) => a.id)).not.toContain(athleteId);
    const again = await head.post('/api/invitations').send({ email: newEmail(), role: 'athlete', athleteId });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('athlete_already_invited');

    const { agent, res } = await accept(await linkFor(email));
    expect(res.status).toBe(200);
    expect((await agent.get('/api/auth/me')).body.athleteId).toBe(athleteId);
    const [a] = await t.ctx.database.db.select().from(athletes).where(eq(athletes.id, athleteId));
    expect(a!.userId).toBe((await agent.get('/api/auth/me')).body.id);
  });

  it('refuses a roster entry that already has an account, or belongs to another team', async () => {
    const taken = await head
      .post('/api/invitations')
      .send({ email: newEmail(), role: 'athlete', athleteId: team.athleteId });
    expect(taken.status).toBe(409);
    expect(taken.body.error.code).toBe('athlete_has_account');
    const foreign = await createAthlete(t.ctx.database.db, other.teamId);
    const res = await head.post('/api/invitations').send({ email: newEmail(), role: 'athlete', athleteId: foreign });
    expect(res.status).toBe(404);
  });
});

describe('inviting a coach', () => {
  it('makes a coach of the team', async () => {
    const email = newEmail();
    expect((await head.post('/api/invitations').send({ email, role: 'coach' })).status).toBe(201);
    const { agent, res } = await accept(await linkFor(email));
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('coach');
    const me = await agent.get('/api/auth/me');
    expect(me.body).toMatchObject({ role: 'coach', teamId: team.teamId, athleteId: null });
  });

  it('asks an address that already has an account for that account’s password, and adds the team', async () => {
    // The other team's coach joins this team too.
    const res = await head.post('/api/invitations').send({ email: other.coach.email, role: 'coach' });
    expect(res.status).toBe(201);
    const token = await linkFor(other.coach.email);
    const preview = await request(t.app).get(`/api/invitation-links/preview?token=${token}`);
    expect(preview.body.existingAccount).toBe(true);

    const wrong = await accept(token, { password: 'not-their-password' });
    expect(wrong.res.status).toBe(422);
    expect(Object.keys(wrong.res.body.error.fields)).toEqual(['password']);

    const right = await accept(token, { password: TEST_PASSWORD, name: '' });
    expect(right.res.status).toBe(200);
    const me = await right.agent.get('/api/auth/me');
    expect(me.body).toMatchObject({ email: other.coach.email, role: 'coach', teamId: team.teamId });
  });
});

describe('validation and conflicts', () => {
  it('reports field errors', async () => {
    const res = await head.post('/api/invitations').send({ email: 'not-an-address', role: 'athlete' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['athleteName', 'email', 'sex']);
    const role = await head.post('/api/invitations').send({ email: newEmail(), role: 'head_coach' });
    expect(Object.keys(role.body.error.fields)).toEqual(['role']);
  });

  it('asks a new account for a name and a long enough password, twice the same', async () => {
    const email = newEmail();
    await head.post('/api/invitations').send({ email, role: 'coach' });
    const token = await linkFor(email);
    const res = await accept(token, { name: '', password: 'short', confirmPassword: 'different' });
    expect(res.res.status).toBe(422);
    expect(Object.keys(res.res.body.error.fields).sort()).toEqual(['confirmPassword', 'name', 'password']);
    const bad = await request(t.app).get('/api/invitation-links/preview?token=abc');
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['query.token']);
    const unknown = await request(t.app).get(`/api/invitation-links/preview?token=${'x'.repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('invitation_not_found');
  });

  it('refuses a second open invitation for one address, and an address already in the team', async () => {
    const email = newEmail();
    expect((await head.post('/api/invitations').send({ email, role: 'coach' })).status).toBe(201);
    const twice = await head.post('/api/invitations').send({ email, role: 'coach' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('already_invited');
    const member = await head.post('/api/invitations').send({ email: team.coach.email, role: 'coach' });
    expect(member.status).toBe(409);
    expect(member.body.error.code).toBe('already_member');
  });
});

describe('resend, revoke and expiry', () => {
  it('resending replaces the token: the old link stops working, the new one works', async () => {
    const email = newEmail();
    const created = await head.post('/api/invitations').send({ email, role: 'coach' });
    const first = await linkFor(email);
    const resent = await head.post(`/api/invitations/${created.body.id}/resend`);
    expect(resent.status).toBe(200);
    const second = await linkFor(email, 2);
    expect(second).not.toBe(first);
    expect((await request(t.app).get(`/api/invitation-links/preview?token=${first}`)).status).toBe(404);
    expect((await accept(first)).res.status).toBe(404);
    expect((await accept(second)).res.status).toBe(200);
    // Both e-mails arrived, once each.
    expect(await inbox.list({ to: email })).toHaveLength(2);
  });

  it('a revoked invitation gets a clear answer and cannot be resent', async () => {
    const email = newEmail();
    const created = await head.post('/api/invitations').send({ email, role: 'coach' });
    const token = await linkFor(email);
    const revoked = await head.post(`/api/invitations/${created.body.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.status).toBe('revoked');
    const res = await accept(token);
    expect(res.res.status).toBe(410);
    expect(res.res.body.error.code).toBe('invitation_revoked');
    const resend = await head.post(`/api/invitations/${created.body.id}/resend`);
    expect(resend.status).toBe(409);
    expect(resend.body.error.current.status).toBe('revoked');
  });

  it('an expired invitation gets a clear answer, shows as expired, and a resend renews it', async () => {
    const email = newEmail();
    const created = await head.post('/api/invitations').send({ email, role: 'coach' });
    const token = await linkFor(email);
    await t.ctx.database.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, created.body.id));
    const res = await request(t.app).get(`/api/invitation-links/preview?token=${token}`);
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('invitation_expired');
    const expired = await head.get('/api/invitations?status=expired&limit=500');
    expect(expired.body.items.map((i: { id: number }) => i.id)).toContain(created.body.id);
    const renewed = await head.post(`/api/invitations/${created.body.id}/resend`);
    expect(renewed.body.status).toBe('pending');
    expect((await accept(await linkFor(email, 2))).res.status).toBe(200);
  });

  it('another team’s invitation is not found', async () => {
    const created = await head.post('/api/invitations').send({ email: newEmail(), role: 'coach' });
    const otherHead = await t.signIn(other.headCoach.email);
    expect((await otherHead.post(`/api/invitations/${created.body.id}/resend`)).status).toBe(404);
    expect((await otherHead.post(`/api/invitations/${created.body.id}/revoke`)).status).toBe(404);
    const list = await otherHead.get('/api/invitations?status=all');
    expect(list.body.items.map((i: { id: number }) => i.id)).not.toContain(created.body.id);
    expect((await head.post('/api/invitations/999999999/revoke')).status).toBe(404);
  });
});

describe('GET /api/invitations', () => {
  it('lists with total, filters, sorting and paging', async () => {
    const fresh = await createTeam(t.ctx.database.db);
    const agent = await t.signIn(fresh.headCoach.email);
    const emails = ['b', 'a', 'c'].map((p) => `${p}-${uniq()}@example.test`);
    for (const email of emails) await agent.post('/api/invitations').send({ email, role: 'coach' });
    await agent
      .post('/api/invitations')
      .send({ email: `d-${uniq()}@example.test`, role: 'athlete', athleteName: 'Dee', sex: 'M' });
    const all = await agent.get('/api/invitations');
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(4);
    const coaches = await agent.get('/api/invitations?role=coach&sort=email');
    expect(coaches.body.items.map((i: { email: string }) => i.email)).toEqual([...emails].sort());
    const page = await agent.get('/api/invitations?role=coach&sort=-email&limit=1&offset=1');
    expect(page.body).toMatchObject({ total: 3 });
    expect(page.body.items.map((i: { email: string }) => i.email)).toEqual([[...emails].sort()[1]]);
    const bad = await agent.get('/api/invitations?status=nope&limit=0');
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['query.limit', 'query.status']);
  });
});
