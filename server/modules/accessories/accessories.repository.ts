// SQL for the team's accessory library. Every function takes the caller's teamId.
import { and, asc, desc, eq, isNull, like, or, sql, type AnyColumn, type SQL } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { accessories } from '../../db/schema';
import { accessorySortKeys, readSort, type AccessoryListFilters } from '../../../shared/schemas';
import { containsPattern } from '../../db/patterns';

export type AccessoryRow = typeof accessories.$inferSelect;
export type AccessoryValues = Omit<
  typeof accessories.$inferInsert,
  'id' | 'teamId' | 'version' | 'createdAt' | 'updatedAt'
>;

const SORT_COLUMNS: Record<(typeof accessorySortKeys)[number], SQL | AnyColumn> = {
  name: accessories.name,
  category: accessories.category,
  updatedAt: accessories.updatedAt,
};

export async function listAccessories(db: Queryable, teamId: number, f: AccessoryListFilters) {
  const where: (SQL | undefined)[] = [eq(accessories.teamId, teamId)];
  if (!f.includeArchived) where.push(isNull(accessories.archivedAt));
  if (f.category) where.push(eq(accessories.category, f.category));
  if (f.q) {
    const p = containsPattern(f.q);
    where.push(or(like(accessories.name, p), like(accessories.notes, p)));
  }
  const cond = and(...where);
  const { key, desc: down } = readSort(f.sort);
  const column = SORT_COLUMNS[key];
  const [rows, [count]] = await Promise.all([
    db
      .select()
      .from(accessories)
      .where(cond)
      .orderBy(down ? desc(column) : asc(column), asc(accessories.name), asc(accessories.id))
      .limit(f.limit)
      .offset(f.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(accessories)
      .where(cond),
  ]);
  return { rows, total: Number(count?.n ?? 0) };
}

export async function findAccessory(db: Queryable, teamId: number, id: number): Promise<AccessoryRow | null> {
  const [row] = await db
    .select()
    .from(accessories)
    .where(and(eq(accessories.teamId, teamId), eq(accessories.id, id)))
    .limit(1);
  return row ?? null;
}

/** Another accessory of the team with this name, as the database compares names (case and accents aside). */
export async function findNameClash(db: Queryable, teamId: number, name: string, exceptId?: number) {
  const [row] = await db
    .select({ id: accessories.id })
    .from(accessories)
    .where(
      and(
        eq(accessories.teamId, teamId),
        eq(accessories.name, name),
        exceptId === undefined ? undefined : sql`${accessories.id} <> ${exceptId}`,
      ),
    )
    .limit(1);
  return row ?? null;
}

export async function insertAccessory(db: Queryable, teamId: number, values: AccessoryValues): Promise<number> {
  const [res] = await db
    .insert(accessories)
    .values({ ...values, teamId })
    .$returningId();
  return res!.id;
}

export async function insertAccessories(db: Queryable, teamId: number, values: AccessoryValues[]): Promise<void> {
  for (let i = 0; i < values.length; i += 500) {
    await db.insert(accessories).values(values.slice(i, i + 500).map((v) => ({ ...v, teamId })));
  }
}

/** Writes only when the row still has the version the caller read; false when someone else got there first. */
export async function updateAccessory(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  values: Partial<AccessoryValues>,
): Promise<boolean> {
  const [res] = await db
    .update(accessories)
    .set({ ...values, version: sql`${accessories.version} + 1` })
    .where(and(eq(accessories.teamId, teamId), eq(accessories.id, id), eq(accessories.version, version)));
  return res.affectedRows > 0;
}

/** The whole library, archived ones included, by name: for export, import and the rotation. */
export async function allAccessories(db: Queryable, teamId: number): Promise<AccessoryRow[]> {
  return db.select().from(accessories).where(eq(accessories.teamId, teamId)).orderBy(asc(accessories.name));
}
