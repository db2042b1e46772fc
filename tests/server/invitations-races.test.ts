// Invitations under contention: many coaches pressing "Invite" at once get one clear answer each —
// distinct addresses all succeed, one address gives a single invitation and clear conflicts, never a 500.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { invitations } from '../../server/db/schema';
import { useTestApp } from '../support/app';
import { createTeam, uniq, type TestTeam } from '../support/factories';
import { cookieFor } from '../soak/fixture';
import { invitationRaces } from '../soak/races';

const t = useTestApp();
let team: TestTeam;
let cookie: string;

beforeAll(async () => {
  team = await createTeam(t.ctx.database.db);
  cookie = await cookieFor(t.app, team.headCoach.email, '127.0.0.1');
});

describe('parallel invitations', () => {
  it('20 at once to distinct addresses: 20 × 201; 20 at once to one address: 1 × 201 and 19 × 409', async () => {
    const report = await invitationRaces(t.app, t.ctx.database.db, { cookie, teamId: team.teamId }, 20, uniq());
    expect(report.distinct).toEqual({ 201: 20 });
    expect(report.sameAddress).toEqual({ 201: 1, 409: 19 });
    // One open invitation and, for an athlete, one roster entry.
    expect(report.openInvitationsForAddress).toBe(1);
    expect(report.rosterEntriesForAddress).toBe(1);
  });

  it('names the conflict: already_invited', async () => {
    const email = `twice-${uniq()}@example.test`;
    const send = () =>
      request(t.app)
        .post('/api/invitations')
        .set('Cookie', cookie)
        .send({ email, role: 'athlete', athleteName: 'Twice Asked', sex: 'F' });
    const [a, b] = await Promise.all([send(), send()]);
    const refused = [a, b].find((r) => r.status === 409);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect(refused!.body.error.code).toBe('already_invited');
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
