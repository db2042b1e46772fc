// The people and rows the fuzzer and the races work with: two teams, so another team's ids are tried too.
import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db/client';
import { TEST_PASSWORD } from '../support/app';
import { createTeam, createTopSet, createVariant, type TestTeam } from '../support/factories';
import type { FuzzCaller } from './fuzz';

export interface SoakFixture {
  team: TestTeam;
  other: TestTeam;
  knownIds: number[];
  signIn(caller: Exclude<FuzzCaller, 'anonymous'>): Promise<string>;
}

/** Signs in and returns the session cookie as a Cookie header value. */
export async function cookieFor(app: Express, email: string, address: string): Promise<string> {
  const res = await request(app)
    .post('/api/auth/login')
    .set('X-Forwarded-For', address)
    .send({ email, password: TEST_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return String(([] as string[]).concat(res.headers['set-cookie'] ?? [])[0]).split(';')[0]!;
}

export async function soakFixture(app: Express, db: Db, address: string): Promise<SoakFixture> {
  const team = await createTeam(db);
  const other = await createTeam(db);
  const ids: number[] = [team.teamId, other.teamId, team.athleteId, other.athleteId, team.coach.id, other.coach.id];
  for (const t of [team, other]) {
    const v = await createVariant(db, t.teamId);
    ids.push(v, await createTopSet(db, t.teamId, t.athleteId, v));
  }
  const emails = { athlete: team.athleteUser.email, coach: team.coach.email, headCoach: team.headCoach.email };
  return { team, other, knownIds: ids, signIn: (caller) => cookieFor(app, emails[caller], address) };
}
