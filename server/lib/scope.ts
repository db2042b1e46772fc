// Whose rows a request may read: an athlete only their own; coaches any athlete of their team.
import type { Request } from 'express';
import type { Queryable } from '../db/client';
import { authOf } from '../middleware/auth';
import { findTeamAthlete } from '../modules/athletes/athletes.service';
import { NotFoundError, ValidationError } from './errors';

/** The caller's own roster entry (athletes). */
export function ownAthleteId(req: Request): number {
  const id = authOf(req).athleteId;
  if (id === null) throw new NotFoundError('A roster entry linked to your account');
  return id;
}

/**
 * The athlete a list is about: for an athlete always themselves (naming anyone else is not found); for
 * coaches the athlete named, who must be on their team.
 */
export async function athleteInScope(db: Queryable, req: Request, requested: number | undefined): Promise<number> {
  const auth = authOf(req);
  if (auth.role === 'athlete') {
    const own = ownAthleteId(req);
    if (requested !== undefined && requested !== own) throw new NotFoundError('That athlete');
    return own;
  }
  if (requested === undefined)
    throw new ValidationError('Some fields need attention.', { 'query.athleteId': ['Pick an athlete'] });
  if (!(await findTeamAthlete(db, auth.teamId, requested))) throw new NotFoundError('That athlete');
  return requested;
}
