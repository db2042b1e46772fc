// The accessory library's rules: unique names per team, versioned edits, archive instead of delete (a week
// may name an accessory), the library as the rotation and the week editor read it, and its CSV file.
import type { AccessoryChoice } from '../../../shared/engine/accessories';
import Papa from 'papaparse';
import {
  ACCESSORY_CSV_COLUMNS,
  LIBRARY_CSV_MAX_ROWS,
  accessoryToCsvRecord,
  detectCsvDelimiter,
  nameKey,
  readAccessoryTable,
  type AccessoryListFilters,
  type AccessoryValues,
  type LibraryAccessory,
  type LibraryImportResult,
  type ListResponse,
} from '../../../shared/schemas';
import { inTransaction } from '../../db/transaction';
import { decodeUpload, invalidRows } from '../variants/variants.service';
import type { Queryable } from '../../db/client';
import type { AppContext } from '../../context';
import { isDuplicateKey } from '../../db/errors';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import * as repo from './accessories.repository';

export function toAccessoryDto(r: repo.AccessoryRow): LibraryAccessory {
  return {
    id: r.id,
    name: r.name,
    category: r.category as LibraryAccessory['category'],
    stress: r.stress,
    sets: r.sets,
    reps: r.reps,
    loadKg: r.loadKg === null ? null : Number(r.loadKg),
    rpe: r.rpe === null ? null : Number(r.rpe),
    notes: r.notes,
    archived: r.archivedAt !== null,
    version: r.version,
    updatedAt: r.updatedAt.toISOString(),
  };
}

const NAME_TAKEN = 'Another accessory of the library already has this name (archived ones count too)';
const STALE =
  'Someone else changed this accessory since you opened it. Their version is shown; apply your change again.';

async function mustFind(db: Queryable, teamId: number, id: number) {
  const row = await repo.findAccessory(db, teamId, id);
  if (!row) throw new NotFoundError('That accessory');
  return row;
}

export async function listAccessories(ctx: AppContext, teamId: number, f: AccessoryListFilters) {
  const { rows, total } = await repo.listAccessories(ctx.database.db, teamId, f);
  return { items: rows.map(toAccessoryDto), total } satisfies ListResponse<LibraryAccessory>;
}

export async function getAccessory(ctx: AppContext, teamId: number, id: number) {
  return toAccessoryDto(await mustFind(ctx.database.db, teamId, id));
}

export async function createAccessory(ctx: AppContext, teamId: number, body: AccessoryValues) {
  const db = ctx.database.db;
  if (await repo.findNameClash(db, teamId, body.name)) throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
  let id: number;
  try {
    id = await repo.insertAccessory(db, teamId, body);
  } catch (err) {
    if (isDuplicateKey(err)) throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
    throw err;
  }
  return toAccessoryDto(await mustFind(db, teamId, id));
}

/** Edits, archives (`archived: true`) or brings back an accessory, refusing a stale version with 409. */
export async function patchAccessory(
  ctx: AppContext,
  teamId: number,
  id: number,
  body: Partial<AccessoryValues> & { archived?: boolean | undefined; version: number },
) {
  const db = ctx.database.db;
  const current = await mustFind(db, teamId, id);
  if (current.version !== body.version) throw new ConflictError(STALE, toAccessoryDto(current));
  const { archived, version, ...fields } = body;
  // A load replaces the RPE target and an RPE the load: a target is one or the other.
  if (fields.loadKg != null && fields.rpe === undefined) fields.rpe = null;
  if (fields.rpe != null && fields.loadKg === undefined) fields.loadKg = null;
  if (fields.name !== undefined && (await repo.findNameClash(db, teamId, fields.name, id))) {
    throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
  }
  const values: Partial<repo.AccessoryValues> = { ...fields };
  if (archived !== undefined) values.archivedAt = archived ? (current.archivedAt ?? new Date()) : null;
  let ok: boolean;
  try {
    ok = await repo.updateAccessory(db, teamId, id, version, values);
  } catch (err) {
    if (isDuplicateKey(err)) throw new ValidationError(NAME_TAKEN, { name: [NAME_TAKEN] });
    throw err;
  }
  const after = await mustFind(db, teamId, id);
  if (!ok) throw new ConflictError(STALE, toAccessoryDto(after));
  return toAccessoryDto(after);
}

/** The whole library, archived ones included: for the week editor's checks and the rotation. */
export async function libraryOf(db: Queryable, teamId: number): Promise<LibraryAccessory[]> {
  return (await repo.allAccessories(db, teamId)).map(toAccessoryDto);
}

/** An accessory as the rotation engine knows it. */
export const engineAccessory = (a: LibraryAccessory): AccessoryChoice => ({
  id: String(a.id),
  name: a.name,
  category: a.category,
  stress: a.stress,
  archived: a.archived,
});

/** RFC 4180 text: a header row of our column names, then one row per accessory, CRLF line ends. */
export async function exportAccessories(ctx: AppContext, teamId: number): Promise<string> {
  const rows = (await repo.allAccessories(ctx.database.db, teamId)).map(toAccessoryDto);
  const data = rows.map((a) => accessoryToCsvRecord(a));
  return Papa.unparse({ fields: [...ACCESSORY_CSV_COLUMNS], data }, { newline: '\r\n', quotes: false }) + '\r\n';
}

/**
 * Adds the file's new accessories and updates those whose name is already in the library, in one
 * transaction; a single bad row refuses the whole file with every problem listed.
 */
export async function importAccessories(ctx: AppContext, teamId: number, file: Buffer) {
  const text = (await decodeUpload(file)).replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, { delimiter: detectCsvDelimiter(text), skipEmptyLines: false });
  const quoteProblems = parsed.errors
    .filter((e) => e.type === 'Quotes')
    .map((e) => ({ row: (e.row ?? 0) + 1, field: 'row', message: 'A quote mark is not closed on this row' }));
  const table = readAccessoryTable(parsed.data);
  if (table.valid.length > LIBRARY_CSV_MAX_ROWS) {
    throw new ValidationError('The file is too long.', {
      file: [`Import at most ${LIBRARY_CSV_MAX_ROWS} rows at a time.`],
    });
  }
  const problems = [...quoteProblems, ...table.problems];
  if (problems.length > 0) throw invalidRows(problems);
  return inTransaction(ctx.database.db, async (tx) => {
    const existing = new Map((await repo.allAccessories(tx, teamId)).map((a) => [nameKey(a.name), a]));
    const now = new Date();
    const fresh: repo.AccessoryValues[] = [];
    let updated = 0;
    let unchanged = 0;
    for (const row of table.valid) {
      const old = existing.get(nameKey(row.accessory.name));
      const archivedAt = row.archived ? (old?.archivedAt ?? now) : null;
      const values = { ...row.accessory, archivedAt };
      if (!old) fresh.push(values);
      else if (
        JSON.stringify(accessoryToCsvRecord({ ...toAccessoryDto(old) })) ===
        JSON.stringify(accessoryToCsvRecord({ ...row.accessory, archived: row.archived }))
      )
        unchanged++;
      else {
        if (!(await repo.updateAccessory(tx, teamId, old.id, old.version, values)))
          throw new ConflictError('The library changed during the import, so nothing was imported. Try again.');
        updated++;
      }
    }
    await repo.insertAccessories(tx, teamId, fresh);
    return { created: fresh.length, updated, unchanged } satisfies LibraryImportResult;
  });
}
