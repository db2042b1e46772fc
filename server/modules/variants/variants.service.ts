// The library's rules: unique names per team, versioned edits, archive instead of delete once a
// variant is in someone's history, and the all-or-nothing CSV import.
import { inTransaction } from '../../db/transaction';
import { fileTypeFromBuffer } from 'file-type';
import { JOINTS } from '../../../shared/engine/types';
import {
  LIBRARY_CSV_MAX_ROWS,
  nameKey,
  type LibraryCsvRow,
  type LibraryImportResult,
  type LibraryVariant,
  type ListResponse,
  type VariantDeleteResult,
  type VariantFacets,
  type VariantListFilters,
  type VariantTraits,
  type VariantValues as VariantInput,
} from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import type { variants } from '../../db/schema';
import type { AppContext } from '../../context';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { buildLibraryCsv, parseLibraryCsv } from './variants.csv';
import { driverMessage, isDuplicateKey, isStillReferenced } from '../../db/errors';
import * as repo from './variants.repository';

/** A variant's traits from its row, as the library, the board and the engine's request read them. */
export function variantTraits(r: typeof variants.$inferSelect): VariantTraits {
  return {
    name: r.name,
    lift: r.lift,
    family: r.family,
    bar: r.bar,
    equipment: r.equipment,
    emphasis: r.emphasis,
    stress: r.stress,
    risk: r.risk as 1 | 2 | 3,
    specificity: Number(r.specificity),
    scheme: r.scheme,
    meetPhaseWeeks: r.meetPhaseWeeks,
  };
}

export function toVariantDto(r: repo.VariantRow): LibraryVariant {
  return {
    id: r.id,
    ...variantTraits(r),
    notes: r.notes,
    archived: r.archivedAt !== null,
    inHistory: r.inHistory,
    version: r.version,
    updatedAt: r.updatedAt.toISOString(),
  };
}

const NAME_TAKEN = 'Another variant of the library already has this name (archived ones count too)';

async function mustFind(db: Queryable, teamId: number, id: number) {
  const row = await repo.findVariant(db, teamId, id);
  if (!row) throw new NotFoundError('That variant');
  return row;
}

export async function listVariants(ctx: AppContext, teamId: number, f: VariantListFilters) {
  // The library list may lag a moment behind a save (the replica); a single variant is read from the primary.
  const { rows, total } = await repo.listVariants(ctx.database.mayLag, teamId, f);
  return { items: rows.map(toVariantDto), total } satisfies ListResponse<LibraryVariant>;
}

export async function getVariant(ctx: AppContext, teamId: number, id: number) {
  return toVariantDto(await mustFind(ctx.database.db, teamId, id));
}

export async function variantFacets(ctx: AppContext, teamId: number): Promise<VariantFacets> {
  const rows = await repo.variantFacets(ctx.database.mayLag, teamId);
  const sorted = (xs: Iterable<string>) => [...new Set(xs)].sort((a, b) => a.localeCompare(b));
  return {
    families: sorted(rows.map((r) => r.family)),
    bars: sorted(rows.map((r) => r.bar)),
    equipment: sorted(rows.flatMap((r) => r.equipment)),
  };
}

export async function createVariant(ctx: AppContext, teamId: number, body: VariantInput) {
  const db = ctx.database.db;
  if (await repo.findNameClash(db, teamId, body.name)) throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
  let id: number;
  try {
    id = await repo.insertVariant(db, teamId, body);
  } catch (err) {
    if (isDuplicateKey(err)) throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
    throw err;
  }
  return toVariantDto(await mustFind(db, teamId, id));
}

const STALE = 'Someone else changed this variant since you opened it. Their version is shown; apply your change again.';

export async function patchVariant(
  ctx: AppContext,
  teamId: number,
  id: number,
  body: Partial<VariantInput> & { archived?: boolean; version: number },
) {
  const db = ctx.database.db;
  const current = await mustFind(db, teamId, id);
  if (current.version !== body.version) throw new ConflictError(STALE, toVariantDto(current));
  const { archived, version, ...fields } = body;
  if (fields.name !== undefined && (await repo.findNameClash(db, teamId, fields.name, id))) {
    throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
  }
  const values: Partial<repo.VariantValues> = { ...fields };
  if (archived !== undefined) values.archivedAt = archived ? (current.archivedAt ?? new Date()) : null;
  let ok: boolean;
  try {
    ok = await repo.updateVariant(db, teamId, id, version, values);
  } catch (err) {
    if (isDuplicateKey(err)) throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
    throw err;
  }
  const after = await mustFind(db, teamId, id);
  if (!ok) throw new ConflictError(STALE, toVariantDto(after));
  return toVariantDto(after);
}

/** Deletes a variant nobody has trained or planned; one in the history is archived and keeps showing there. */
export async function removeVariant(ctx: AppContext, teamId: number, id: number): Promise<VariantDeleteResult> {
  return inTransaction(ctx.database.db, async (tx) => {
    const current = await mustFind(tx, teamId, id);
    if (!current.inHistory) {
      try {
        await repo.deleteVariant(tx, teamId, id);
        return { result: 'deleted' as const };
      } catch (err) {
        // A plan entry or top set arrived since the check: fall through to archiving.
        if (!isStillReferenced(err)) throw err;
      }
    }
    if (current.archivedAt === null) {
      const ok = await repo.updateVariant(tx, teamId, id, current.version, { archivedAt: new Date() });
      if (!ok) throw new ConflictError(STALE, toVariantDto(await mustFind(tx, teamId, id)));
    }
    return { result: 'archived' as const, item: toVariantDto(await mustFind(tx, teamId, id)) };
  });
}

export async function exportLibrary(ctx: AppContext, teamId: number): Promise<string> {
  const rows = await repo.allVariants(ctx.database.db, teamId);
  return buildLibraryCsv(
    rows.map((r) => ({ ...r, specificity: Number(r.specificity), archived: r.archivedAt !== null })),
  );
}

/** Uploaded bytes → text: UTF-8 as spreadsheets save it today, with Windows-1252 for older exports. */
export async function decodeUpload(buffer: Buffer): Promise<string> {
  const type = await fileTypeFromBuffer(buffer);
  if (type) {
    throw new ValidationError('That file is not CSV text.', {
      file: [`This is a .${type.ext} file, not CSV text: save it as CSV (comma-separated) and upload that.`],
    });
  }
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    return new TextDecoder('windows-1252').decode(buffer);
  }
}

const MAX_REPORTED_PROBLEMS = 500;

export function invalidRows(all: { row: number; field: string; message: string }[]): AppError {
  // One line per distinct problem: a broken row can trip the same check more than once.
  const seen = new Set<string>();
  const rows = all.filter((p) => {
    const key = JSON.stringify([p.row, p.field, p.message]);
    return seen.has(key) ? false : (seen.add(key), true);
  });
  const shown = rows.slice(0, MAX_REPORTED_PROBLEMS);
  const rowCount = new Set(rows.map((r) => r.row)).size;
  return new AppError(
    422,
    'invalid_rows',
    `Nothing was imported: ${rowCount === 1 ? '1 row needs' : `${rowCount} rows need`} fixing.` +
      (rows.length > shown.length ? ` The first ${shown.length} problems are listed.` : ''),
    { rows: shown },
  );
}

const sameStress = (a: Record<string, number | undefined>, b: Record<string, number | undefined>) =>
  JOINTS.every((j) => (a[j] ?? 0) === (b[j] ?? 0));

function unchanged(existing: repo.VariantRow, row: LibraryCsvRow): boolean {
  const v = row.variant;
  return (
    existing.name === v.name &&
    existing.lift === v.lift &&
    existing.family === v.family &&
    existing.bar === v.bar &&
    JSON.stringify(existing.equipment) === JSON.stringify(v.equipment) &&
    existing.emphasis === v.emphasis &&
    sameStress(existing.stress, v.stress) &&
    existing.risk === v.risk &&
    Number(existing.specificity) === v.specificity &&
    existing.scheme === v.scheme &&
    (existing.notes ?? null) === v.notes &&
    (v.meetPhaseWeeks === undefined || existing.meetPhaseWeeks === v.meetPhaseWeeks) &&
    (existing.archivedAt !== null) === row.archived
  );
}

/**
 * Adds the file's new variants and updates those whose name is already in the library, in one
 * transaction; a single bad row refuses the whole file with every problem listed.
 */
export async function importLibrary(ctx: AppContext, teamId: number, file: Buffer): Promise<LibraryImportResult> {
  const parsed = parseLibraryCsv(await decodeUpload(file));
  if (parsed.rows.length > LIBRARY_CSV_MAX_ROWS) {
    throw new ValidationError('The file is too long.', {
      file: [`Import at most ${LIBRARY_CSV_MAX_ROWS} rows at a time; this file has ${parsed.rows.length}.`],
    });
  }
  if (parsed.problems.length > 0) throw invalidRows(parsed.problems);
  const rowOf = new Map(
    parsed.rows.flatMap((r) => (r.parsed.ok ? [[nameKey(r.parsed.value.variant.name), r.row]] : [])),
  );

  try {
    return await inTransaction(ctx.database.db, async (tx) => {
      const existing = new Map((await repo.allVariants(tx, teamId)).map((v) => [nameKey(v.name), v]));
      const now = new Date();
      const fresh: repo.VariantValues[] = [];
      let updated = 0;
      let same = 0;
      for (const row of parsed.valid) {
        const old = existing.get(nameKey(row.variant.name));
        const archivedAt = row.archived ? (old?.archivedAt ?? now) : null;
        if (!old) fresh.push({ ...row.variant, archivedAt });
        else if (unchanged(old, row)) same++;
        else {
          const ok = await repo.updateVariant(tx, teamId, old.id, old.version, { ...row.variant, archivedAt });
          if (!ok)
            throw new ConflictError('The library changed during the import, so nothing was imported. Try again.');
          updated++;
        }
      }
      await repo.insertVariants(tx, teamId, fresh);
      return { created: fresh.length, updated, unchanged: same };
    });
  } catch (err) {
    if (!isDuplicateKey(err)) throw err;
    // Two names our comparison tells apart but the database does not (e.g. ligatures): name the row.
    const dup = /Duplicate entry '\d+-(.*)' for key/.exec(driverMessage(err))?.[1] ?? '';
    const row = rowOf.get(nameKey(dup)) ?? 2;
    throw invalidRows([{ row, field: 'name', message: 'The database sees this name as the same as another one' }]);
  }
}
