// SQL for bodyweight readings: one per athlete and day, written as an upsert.
import { and, asc, desc, eq, gte, lte, sql } from 'drizzle-orm';
import type { Bodyweight } from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import { bodyweights } from '../../db/schema';

function toBodyweight(r: { id: number; measuredOn: string; weightKg: number }): Bodyweight {
  return { id: r.id, measuredOn: r.measuredOn, weightKg: Number(r.weightKg) };
}

const columns = { id: bodyweights.id, measuredOn: bodyweights.measuredOn, weightKg: bodyweights.weightKg };

export async function upsertBodyweight(
  db: Queryable,
  row: { teamId: number; athleteId: number; measuredOn: string; weightKg: number },
): Promise<{ bodyweight: Bodyweight; created: boolean }> {
  const [res] = await db
    .insert(bodyweights)
    .values(row)
    .onDuplicateKeyUpdate({ set: { weightKg: row.weightKg } });
  const [saved] = await db
    .select(columns)
    .from(bodyweights)
    .where(
      and(
        eq(bodyweights.teamId, row.teamId),
        eq(bodyweights.athleteId, row.athleteId),
        eq(bodyweights.measuredOn, row.measuredOn),
      ),
    );
  // MariaDB counts 1 affected row for an insert and 2 for an update of an existing one.
  return { bodyweight: toBodyweight(saved!), created: res.affectedRows === 1 };
}

export async function listBodyweights(
  db: Queryable,
  teamId: number,
  athleteId: number,
  q: { from?: string | undefined; to?: string | undefined; limit: number; offset: number; sort: 'newest' | 'oldest' },
) {
  const filter = and(
    eq(bodyweights.teamId, teamId),
    eq(bodyweights.athleteId, athleteId),
    q.from ? gte(bodyweights.measuredOn, q.from) : undefined,
    q.to ? lte(bodyweights.measuredOn, q.to) : undefined,
  );
  const rows = await db
    .select(columns)
    .from(bodyweights)
    .where(filter)
    .orderBy(q.sort === 'newest' ? desc(bodyweights.measuredOn) : asc(bodyweights.measuredOn))
    .limit(q.limit)
    .offset(q.offset);
  const [count] = await db
    .select({ n: sql<number>`count(*)` })
    .from(bodyweights)
    .where(filter);
  return { items: rows.map(toBodyweight), total: Number(count?.n ?? 0) };
}

/** Every reading of the athlete, oldest first (a few hundred at most: one a day). */
export async function allBodyweights(db: Queryable, teamId: number, athleteId: number, since?: string) {
  const rows = await db
    .select(columns)
    .from(bodyweights)
    .where(
      and(
        eq(bodyweights.teamId, teamId),
        eq(bodyweights.athleteId, athleteId),
        since ? gte(bodyweights.measuredOn, since) : undefined,
      ),
    )
    .orderBy(asc(bodyweights.measuredOn));
  return rows.map(toBodyweight);
}
