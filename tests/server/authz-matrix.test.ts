// The authorization matrix: every API route × every kind of caller, with the status each must get.
// Routes are read from the router itself, so a new route without an entry fails this test. Each
// module keeps its entries in tests/server/authz/<module>.matrix.ts.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { listRoutes } from '../../server/lib/routes';
import { useTestApp } from '../support/app';
import { createTeam } from '../support/factories';
import { ACTORS, type Actor, type Case, type Fixture, type MatrixModule } from './authz/types';

const modules = Object.values(import.meta.glob<{ matrix: MatrixModule }>('./authz/*.matrix.ts', { eager: true })).map(
  (m) => m.matrix,
);
const MATRIX: Record<string, Case> = Object.assign({}, ...modules.map((m) => m.cases));

const t = useTestApp();
let f: Fixture;
const agents = new Map<Actor, request.Agent>();

async function signInAll() {
  agents.set('signedOut', request(t.app) as unknown as request.Agent);
  agents.set('athlete', await t.signIn(f.team.athleteUser.email));
  agents.set('coach', await t.signIn(f.team.coach.email));
  agents.set('headCoach', await t.signIn(f.team.headCoach.email));
  agents.set('otherTeam', await t.signIn(f.other.headCoach.email));
}

beforeAll(async () => {
  const db = t.ctx.database.db;
  const team = await createTeam(db);
  const other = await createTeam(db);
  f = { team, other, ids: {} };
  for (const m of modules) Object.assign(f.ids, (await m.setup?.(db, team, other)) ?? {});
  await signInAll();
});

describe('authorization matrix', () => {
  it('has an entry for every route the router serves, and no stale ones', () => {
    const routes = listRoutes(t.app.locals.apiRouter)
      .map((r) => `${r.method} ${r.path}`)
      .sort();
    expect(routes).toEqual(Object.keys(MATRIX).sort());
  });

  for (const [key, c] of Object.entries(MATRIX)) {
    const method = key.split(' ')[0]!.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
    it(key, async () => {
      const got: Partial<Record<Actor, number>> = {};
      for (const actor of ACTORS) {
        let req = agents.get(actor)![method](c.path(f));
        const body = actor === 'otherTeam' && c.validBody ? c.validBody(f) : c.invalidBody;
        if (body !== undefined) req = req.send(body as object);
        got[actor] = (await req).status;
      }
      if (c.signsOut) await signInAll();
      expect(got).toEqual(c.expect);
    });
  }
});
