// The roster entry behind an athlete page: looked up inside the caller's team only, so another
// team's athlete is simply not found.
import { and, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, users } from '../../db/schema';

export async function findTeamAthlete(db: Queryable, teamId: number, athleteId: number) {
  const [row] = await db
    .select({
      id: athletes.id,
      teamId: athletes.teamId,
      name: athletes.name,
      sex: athletes.sex,
      division: athletes.division,
      userId: athletes.userId,
      unit: users.unit,
    })
    .from(athletes)
    .leftJoin(users, eq(users.id, athletes.userId))
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return row ? { ...row, unit: row.unit ?? 'kg' } : null;
}
