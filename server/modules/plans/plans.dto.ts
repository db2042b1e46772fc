// Stored plan rows as the API sends them.
import type { PlanEntryDto } from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import { userNames, type EntryRow } from './plans.repository';

export function entryDto(row: EntryRow, names: Map<number, string>): PlanEntryDto {
  return {
    id: row.id,
    athleteId: row.athleteId,
    week: row.week,
    slotId: row.slotId,
    variantId: row.variantId,
    source: row.source,
    pinned: row.pinned,
    reason: row.reason,
    reasons: row.reasons ?? [],
    version: row.version,
    updatedBy: row.updatedBy,
    updatedByName: row.updatedBy === null ? null : (names.get(row.updatedBy) ?? null),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Rows as DTOs, with the names of whoever last changed them. */
export async function entryDtos(db: Queryable, rows: EntryRow[]): Promise<PlanEntryDto[]> {
  const names = await userNames(
    db,
    rows.map((r) => r.updatedBy),
  );
  return rows.map((r) => entryDto(r, names));
}
