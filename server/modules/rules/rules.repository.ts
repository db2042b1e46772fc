// SQL for the team's rules row: rotation windows, budgets, taper, tissue settings and gym equipment.
import { and, eq, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { teamRules, users } from '../../db/schema';

export async function findRules(db: Queryable, teamId: number) {
  const [row] = await db
    .select({
      rules: teamRules.rules,
      equipment: teamRules.equipment,
      version: teamRules.version,
      updatedAt: teamRules.updatedAt,
      updatedById: teamRules.updatedBy,
      updatedByName: users.name,
    })
    .from(teamRules)
    .leftJoin(users, eq(users.id, teamRules.updatedBy))
    .where(eq(teamRules.teamId, teamId))
    .limit(1);
  return row ?? null;
}

export async function insertRules(
  db: Queryable,
  values: { teamId: number; rules: Record<string, unknown>; equipment: string[]; seed: string; updatedBy: number },
) {
  await db.insert(teamRules).values(values);
}

/** The seed is the board's to change (reshuffle), so a rules save leaves it alone. */
export async function updateRules(
  db: Queryable,
  teamId: number,
  version: number,
  values: { rules: Record<string, unknown>; equipment: string[]; updatedBy: number },
): Promise<boolean> {
  const [res] = await db
    .update(teamRules)
    .set({ ...values, version: sql`${teamRules.version} + 1` })
    .where(and(eq(teamRules.teamId, teamId), eq(teamRules.version, version)));
  return res.affectedRows > 0;
}
