// The authorization matrix: every API route × every kind of caller, with the status each must get.
// Routes are read from the router itself, so a new route without an entry here fails this test.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { listRoutes } from '../../server/lib/routes';
import { useTestApp } from '../support/app';
import { createTeam, createVariant, type TestTeam } from '../support/factories';

type Actor = 'signedOut' | 'athlete' | 'coach' | 'headCoach' | 'otherTeam';
const ACTORS: Actor[] = ['signedOut', 'athlete', 'coach', 'headCoach', 'otherTeam'];

interface Fixture {
  team: TestTeam;
  other: TestTeam;
  variantId: number;
}

interface Case {
  path: (f: Fixture) => string;
  /** Sent by callers who are allowed in: invalid on purpose, so the answer is 400 and nothing changes. */
  invalidBody?: unknown;
  /** Sent by the other team's head coach: valid, so a 404 proves the row is out of their reach. */
  validBody?: (f: Fixture) => unknown;
  expect: Record<Actor, number>;
  /** The route ends the session: callers sign in again afterwards. */
  signsOut?: boolean;
}

const all = (status: number): Record<Actor, number> => ({
  signedOut: status,
  athlete: status,
  coach: status,
  headCoach: status,
  otherTeam: status,
});
const signedIn = (status: number): Record<Actor, number> => ({ ...all(status), signedOut: 401 });
/** Coaches and head coaches in; athletes refused; the other team cannot see team A's row. */
// eslint-disable-next-line @typescript-eslint/no-unused-vars -- for the routes that come with the coach pages
const staff = (status: number, other = 404): Record<Actor, number> => ({
  signedOut: 401,
  athlete: 403,
  coach: status,
  headCoach: status,
  otherTeam: other,
});
// eslint-disable-next-line @typescript-eslint/no-unused-vars -- for the routes that come with the coach pages
const headOnly = (status: number, other = 404): Record<Actor, number> => ({
  signedOut: 401,
  athlete: 403,
  coach: 403,
  headCoach: status,
  otherTeam: other,
});

const MATRIX: Record<string, Case> = {
  'GET /api/health': { path: () => '/api/health', expect: all(200) },
  'POST /api/auth/login': { path: () => '/api/auth/login', invalidBody: {}, expect: all(400) },
  'POST /api/auth/logout': { path: () => '/api/auth/logout', expect: all(200), signsOut: true },
  'GET /api/auth/me': { path: () => '/api/auth/me', expect: signedIn(200) },
};

const t = useTestApp();
let f: Fixture;
const agents = new Map<Actor, request.Agent | request.SuperTest<request.Test>>();

beforeAll(async () => {
  const db = t.ctx.database.db;
  const team = await createTeam(db);
  const other = await createTeam(db);
  f = { team, other, variantId: await createVariant(db, team.teamId) };
  await signInAll();
});

async function signInAll() {
  agents.set('signedOut', request(t.app) as unknown as request.Agent);
  agents.set('athlete', await t.signIn(f.team.athleteUser.email));
  agents.set('coach', await t.signIn(f.team.coach.email));
  agents.set('headCoach', await t.signIn(f.team.headCoach.email));
  agents.set('otherTeam', await t.signIn(f.other.headCoach.email));
}

describe('authorization matrix', () => {
  it('has an entry for every route the router serves, and no stale ones', () => {
    const routes = listRoutes(t.app.locals.apiRouter)
      .map((r) => `${r.method} ${r.path}`)
      .sort();
    expect(routes).toEqual(Object.keys(MATRIX).sort());
  });

  for (const [key, c] of Object.entries(MATRIX)) {
    const [method, ...rest] = key.split(' ');
    it(`${key}`, async () => {
      const got: Partial<Record<Actor, number>> = {};
      for (const actor of ACTORS) {
        const agent = agents.get(actor)!;
        const path = c.path(f);
        let req = (agent as unknown as Record<string, (p: string) => request.Test>)[method!.toLowerCase()]!(path);
        const body = actor === 'otherTeam' && c.validBody ? c.validBody(f) : c.invalidBody;
        if (body !== undefined) req = req.send(body as object);
        got[actor] = (await req).status;
      }
      if (c.signsOut) await signInAll();
      expect(got, `${rest.join(' ')}`).toEqual(c.expect);
    });
  }
});
