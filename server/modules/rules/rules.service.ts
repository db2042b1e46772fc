// Team rules: read with defaults for anything stored before a setting existed; written whole by the
// head coach, refused with the current document when someone saved in between.
import { randomBytes } from 'node:crypto';
import { DEFAULT_TEAM_RULES, readTeamRules, type TeamRules, type TeamRulesDoc } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { AuthContext } from '../../middleware/auth';
import { ConflictError } from '../../lib/errors';
import { isDuplicateKey } from '../../db/errors';
import * as repo from './rules.repository';

export async function getRules(ctx: AppContext, teamId: number): Promise<TeamRulesDoc> {
  const row = await repo.findRules(ctx.database.db, teamId);
  if (!row) return { rules: DEFAULT_TEAM_RULES, equipment: [], version: 0, updatedAt: null, updatedBy: null };
  return {
    rules: readTeamRules(row.rules),
    equipment: row.equipment,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    updatedBy:
      row.updatedById !== null && row.updatedByName !== null ? { id: row.updatedById, name: row.updatedByName } : null,
  };
}

const STALE = 'Someone else saved the rules since you opened them. Their version is shown; apply your change again.';

export async function putRules(
  ctx: AppContext,
  auth: AuthContext,
  body: { rules: TeamRules; equipment: string[]; version: number },
): Promise<TeamRulesDoc> {
  const db = ctx.database.db;
  const values = {
    rules: body.rules as unknown as Record<string, unknown>,
    equipment: body.equipment,
    updatedBy: auth.userId,
  };
  let ok: boolean;
  if (body.version === 0) {
    try {
      await repo.insertRules(db, { ...values, teamId: auth.teamId, seed: randomBytes(6).toString('hex') });
      ok = true;
    } catch (err) {
      if (!isDuplicateKey(err)) throw err;
      ok = false;
    }
  } else {
    ok = await repo.updateRules(db, auth.teamId, body.version, values);
  }
  const after = await getRules(ctx, auth.teamId);
  if (!ok) throw new ConflictError(STALE, after);
  return after;
}
