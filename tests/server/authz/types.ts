// Shared shapes for the authorization matrix: each module adds a `<module>.matrix.ts` file beside this.
import type { Db } from '../../../server/db/client';
import type { TestTeam } from '../../support/factories';

export type Actor = 'signedOut' | 'athlete' | 'coach' | 'headCoach' | 'otherTeam';
export const ACTORS: Actor[] = ['signedOut', 'athlete', 'coach', 'headCoach', 'otherTeam'];

/** Team A (whose rows every path names), team B (the other team), and ids the modules created in team A. */
export interface Fixture {
  team: TestTeam;
  other: TestTeam;
  ids: Record<string, number>;
}

export interface Case {
  path: (f: Fixture) => string;
  /** Sent by callers who are allowed in: invalid on purpose, so the answer is 422 and nothing changes. */
  invalidBody?: unknown;
  /** Sent by the other team's head coach: valid, so a 404 proves the row is out of their reach. */
  validBody?: (f: Fixture) => unknown;
  expect: Record<Actor, number>;
  /** The route ends the session: callers sign in again afterwards. */
  signsOut?: boolean;
}

export interface MatrixModule {
  cases: Record<string, Case>;
  /** Creates the rows the module's paths name, in team A; returns their ids (merged into Fixture.ids). */
  setup?: (db: Db, team: TestTeam, other: TestTeam) => Promise<Record<string, number>>;
}

export const all = (status: number): Record<Actor, number> => ({
  signedOut: status,
  athlete: status,
  coach: status,
  headCoach: status,
  otherTeam: status,
});
export const signedIn = (status: number, other = status): Record<Actor, number> => ({
  ...all(status),
  signedOut: 401,
  otherTeam: other,
});
/** Coaches and head coaches in; athletes refused; the other team cannot reach team A's row. */
export const staff = (status: number, other = 404): Record<Actor, number> => ({
  signedOut: 401,
  athlete: 403,
  coach: status,
  headCoach: status,
  otherTeam: other,
});
export const headOnly = (status: number, other = 404): Record<Actor, number> => ({
  signedOut: 401,
  athlete: 403,
  coach: 403,
  headCoach: status,
  otherTeam: other,
});
/** Only athletes (for their own pages); coaches are refused; the other team's athletes are not tested here. */
export const athleteOnly = (status: number): Record<Actor, number> => ({
  signedOut: 401,
  athlete: status,
  coach: 403,
  headCoach: 403,
  otherTeam: 403,
});
