// Invitations under contention: many coaches pressing "Invite" at once get one clear answer each —
// distinct addresses all succeed, one address gives a single invitation and clear conflicts, never a 500.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq, isNull } from 'drizzle-orm';
import { athletes, invitations } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createTeam, uniq, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let head: request.Agent;

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
  head = await t.signIn(team.headCoach.email);
});

const invite = (email: string, athleteName = `Racer ${uniq()}`) =>
  head.post('/api/invitations').send({ email, role: 'athlete', athleteName, sex: 'F' });

function tally(statuses: number[]): Record<number, number> {
  const out: Record<number, number> = {};
  for (const s of statuses) out[s] = (out[s] ?? 0) + 1;
  return out;
}

describe('parallel invitations', () => {
  it('20 at once to distinct addresses: 20 × 201', async () => {
    const emails = Array.from({ length: 20 }, () => `distinct-${uniq()}@example.test`);
    const answers = await Promise.all(emails.map((e) => invite(e)));
    expect(tally(answers.map((a) => a.status))).toEqual({ 201: 20 });
  });

  it('20 at once to one address: 1 × 201, 19 × 409 already_invited, one open invitation and one roster entry', async () => {
    const email = `same-${uniq()}@example.test`;
    const name = `Only Once ${uniq()}`;
    const answers = await Promise.all(Array.from({ length: 20 }, () => invite(email, name)));
    expect(tally(answers.map((a) => a.status))).toEqual({ 201: 1, 409: 19 });
    for (const a of answers.filter((x) => x.status === 409)) expect(a.body.error.code).toBe('already_invited');
    const db = t.ctx.database.db;
    const open = await db
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(
          eq(invitations.teamId, team.teamId),
          eq(invitations.email, email),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
        ),
      );
    expect(open).toHaveLength(1);
    const entries = await db
      .select({ id: athletes.id })
      .from(athletes)
      .where(and(eq(athletes.teamId, team.teamId), eq(athletes.name, name)));
    expect(entries).toHaveLength(1);
  });

  it('the database itself holds one open invitation per team and address', async () => {
    const email = `direct-${uniq()}@example.test`;
    const row = {
      teamId: team.teamId,
      email,
      role: 'coach' as const,
      expiresAt: new Date(Date.now() + 86_400_000),
    };
    const db = t.ctx.database.db;
    await db.insert(invitations).values({ ...row, tokenHash: uniq().padEnd(64, 'a') });
    await expect(db.insert(invitations).values({ ...row, tokenHash: uniq().padEnd(64, 'b') })).rejects.toThrow();
    // Once that one is withdrawn, a new one may be opened.
    await db.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.email, email));
    await db.insert(invitations).values({ ...row, tokenHash: uniq().padEnd(64, 'c') });
  });
});
