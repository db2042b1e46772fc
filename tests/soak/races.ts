// Invitation races: n parallel invitations to distinct addresses, then n to one address. The bar is
// n × 201 for the first, 1 × 201 and (n − 1) × 409 for the second, with one open invitation and one
// roster entry for that address.
import { and, eq, isNull } from 'drizzle-orm';
import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db/client';
import { athletes, invitations } from '../../server/db/schema';

export interface RaceReport {
  distinct: Record<string, number>;
  sameAddress: Record<string, number>;
  openInvitationsForAddress: number;
  rosterEntriesForAddress: number;
}

function tally(statuses: number[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const s of statuses) out[s] = (out[s] ?? 0) + 1;
  return out;
}

export async function invitationRaces(
  app: Express,
  db: Db,
  headCoach: { cookie: string; teamId: number },
  n: number,
  tag: string,
): Promise<RaceReport> {
  const invite = (email: string, athleteName: string) =>
    request(app)
      .post('/api/invitations')
      .set('Cookie', headCoach.cookie)
      .send({ email, role: 'athlete', athleteName, sex: 'M' })
      .then((r) => r.status);
  const distinct = await Promise.all(
    Array.from({ length: n }, (_, i) => invite(`race-${tag}-${i}@example.test`, `Racer ${tag} ${i}`)),
  );
  const email = `race-${tag}-same@example.test`;
  const name = `Same Racer ${tag}`;
  const same = await Promise.all(Array.from({ length: n }, () => invite(email, name)));
  const open = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(
      and(
        eq(invitations.teamId, headCoach.teamId),
        eq(invitations.email, email),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    );
  const roster = await db
    .select({ id: athletes.id })
    .from(athletes)
    .where(and(eq(athletes.teamId, headCoach.teamId), eq(athletes.name, name)));
  return {
    distinct: tally(distinct),
    sameAddress: tally(same),
    openInvitationsForAddress: open.length,
    rosterEntriesForAddress: roster.length,
  };
}
