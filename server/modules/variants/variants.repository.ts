// SQL for the team's exercise library. Every function takes the caller's teamId.
import {
  and,
  asc,
  desc,
  eq,
  getTableColumns,
  inArray,
  isNull,
  like,
  or,
  sql,
  type AnyColumn,
  type SQL,
} from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { containsPattern } from '../../db/patterns';
import { variants } from '../../db/schema';
import { readSort, type VariantListFilters, type VariantSortKey } from '../../../shared/schemas';

export type VariantRow = typeof variants.$inferSelect & { inHistory: boolean };
export type VariantValues = Omit<typeof variants.$inferInsert, 'id' | 'teamId' | 'version' | 'createdAt' | 'updatedAt'>;

// A plan entry or a top set naming the variant: such a variant is archived rather than deleted.
// Written out in full: drizzle renders a column of a single-table select unqualified, which inside the
// subquery would name the subquery's own id.
const inHistory = sql<number>`(exists(select 1 from plan_entries pe where pe.variant_id = variants.id)
  or exists(select 1 from top_sets ts where ts.variant_id = variants.id))`;

function columns() {
  return { ...getTableColumns(variants), inHistory };
}

const toRow = (r: Omit<VariantRow, 'inHistory'> & { inHistory: number | string | boolean }): VariantRow => ({
  ...r,
  inHistory: Number(r.inHistory) > 0,
});

const SORT_COLUMNS: Record<VariantSortKey, SQL | AnyColumn> = {
  name: variants.name,
  lift: variants.lift,
  family: variants.family,
  risk: variants.risk,
  specificity: variants.specificity,
  updatedAt: variants.updatedAt,
};

export async function listVariants(db: Queryable, teamId: number, f: VariantListFilters) {
  const where: (SQL | undefined)[] = [eq(variants.teamId, teamId)];
  if (!f.includeArchived) where.push(isNull(variants.archivedAt));
  if (f.lift) where.push(eq(variants.lift, f.lift));
  if (f.family) where.push(eq(variants.family, f.family));
  if (f.equipment === 'none') where.push(sql`json_length(${variants.equipment}) = 0`);
  else if (f.equipment) where.push(sql`json_contains(${variants.equipment}, json_quote(${f.equipment}))`);
  if (f.risk?.length) where.push(inArray(variants.risk, f.risk));
  if (f.q) {
    const p = containsPattern(f.q);
    where.push(or(like(variants.name, p), like(variants.family, p), like(variants.bar, p), like(variants.notes, p)));
  }
  const cond = and(...where);
  const { key, desc: down } = readSort(f.sort);
  const order = down ? desc(SORT_COLUMNS[key]) : asc(SORT_COLUMNS[key]);
  const [rows, [count]] = await Promise.all([
    db
      .select(columns())
      .from(variants)
      .where(cond)
      .orderBy(order, asc(variants.name), asc(variants.id))
      .limit(f.limit)
      .offset(f.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(variants)
      .where(cond),
  ]);
  return { rows: rows.map(toRow), total: Number(count?.n ?? 0) };
}

export async function findVariant(db: Queryable, teamId: number, id: number): Promise<VariantRow | null> {
  const [row] = await db
    .select(columns())
    .from(variants)
    .where(and(eq(variants.teamId, teamId), eq(variants.id, id)))
    .limit(1);
  return row ? toRow(row) : null;
}

/** Another variant of the team with this name, as the database compares names (case and accents aside). */
export async function findNameClash(db: Queryable, teamId: number, name: string, exceptId?: number) {
  const [row] = await db
    .select({ id: variants.id, name: variants.name })
    .from(variants)
    .where(
      and(
        eq(variants.teamId, teamId),
        eq(variants.name, name),
        exceptId === undefined ? undefined : sql`${variants.id} <> ${exceptId}`,
      ),
    )
    .limit(1);
  return row ?? null;
}

export async function insertVariant(db: Queryable, teamId: number, values: VariantValues): Promise<number> {
  const [res] = await db
    .insert(variants)
    .values({ ...values, teamId })
    .$returningId();
  return res!.id;
}

export async function insertVariants(db: Queryable, teamId: number, values: VariantValues[]): Promise<void> {
  // Bounded statements: a large import would otherwise become one enormous INSERT.
  for (let i = 0; i < values.length; i += 500) {
    await db.insert(variants).values(values.slice(i, i + 500).map((v) => ({ ...v, teamId })));
  }
}

/** Writes only when the row still has the version the caller read; false when someone else got there first. */
export async function updateVariant(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  values: Partial<VariantValues>,
): Promise<boolean> {
  const [res] = await db
    .update(variants)
    .set({ ...values, version: sql`${variants.version} + 1` })
    .where(and(eq(variants.teamId, teamId), eq(variants.id, id), eq(variants.version, version)));
  return res.affectedRows > 0;
}

export async function deleteVariant(db: Queryable, teamId: number, id: number): Promise<boolean> {
  const [res] = await db.delete(variants).where(and(eq(variants.teamId, teamId), eq(variants.id, id)));
  return res.affectedRows > 0;
}

/** The whole library, archived variants included, by name: for export and import. */
export async function allVariants(db: Queryable, teamId: number): Promise<VariantRow[]> {
  const rows = await db.select(columns()).from(variants).where(eq(variants.teamId, teamId)).orderBy(asc(variants.name));
  return rows.map(toRow);
}

export async function variantFacets(db: Queryable, teamId: number) {
  const rows = await db
    .select({ family: variants.family, bar: variants.bar, equipment: variants.equipment })
    .from(variants)
    .where(and(eq(variants.teamId, teamId), isNull(variants.archivedAt)));
  return rows;
}
