// Saving plan cells: checks that the athlete, slot and variant are the team's, refuses a stale version,
// asks for a reason when the pick breaks a rule, and writes each change with its history row in one transaction.
import { publishChange } from '../events/events.service';
import { prepareCandidateChecks, weekRange, type CandidateChecks, type Violation } from '../../../shared/engine';
import { buildPlanRequests, type StoredEntry } from '../../../shared/planning';
import { inTransaction } from '../../db/transaction';
import {
  type PlanCell,
  type PlanEntryDto,
  type PlanHistoryList,
  type PlanList,
  type PlanListQuery,
  type PlanSource,
  type CellStatusChange,
} from '../../../shared/schemas';
import type { Db, Queryable } from '../../db/client';
import type { AuthContext } from '../../middleware/auth';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { loadPlanning, today, type Planning } from './plans.context';
import { entryDtos } from './plans.dto';
import { statusChanges } from './review.service';
import {
  appendHistory,
  athleteExists,
  cellHistory,
  entriesByIds,
  entriesOfAthletes,
  findCell,
  insertEntry,
  listAthletes,
  listEntries,
  updateEntry,
  type EntryRow,
  type EntryWrite,
  type HistoryInsert,
} from './plans.repository';

export interface CellChange extends PlanCell {
  /** null clears the cell. */
  variantId: number | null;
  version: number;
  reason?: string | undefined;
  pinned?: boolean | undefined;
  source?: PlanSource | undefined;
  reasons?: string[] | undefined;
}

/** Names a field of change i the way the request spelled it (a single cell, or `changes.i.…` in a batch). */
export type FieldPath = (i: number, field: string) => string;
export const singleField: FieldPath = (_i, field) => field;
export const batchField: FieldPath = (i, field) => `changes.${i}.${field}`;

const cellKey = (c: { athleteId: number; week: string; slotId: string }) => `${c.athleteId}|${c.week}|${c.slotId}`;

function errCode(err: unknown): string | undefined {
  for (let e = err as { code?: unknown; cause?: unknown } | undefined, d = 0; e && d < 4; d++) {
    if (typeof e.code === 'string') return e.code;
    e = e.cause as typeof e;
  }
  return undefined;
}

/** Two saves racing for one empty cell: the loser's insert fails; it is told what the winner saved. */
const RACE_CODES = new Set(['ER_DUP_ENTRY', 'ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);

function checkInputs(planning: Planning, changes: CellChange[], field: FieldPath, thisWeek: string) {
  const fields: Record<string, string[]> = {};
  changes.forEach((c, i) => {
    if (c.week < thisWeek) (fields[field(i, 'week')] ??= []).push(`Past weeks are history; plan ${thisWeek} or later`);
    if (!planning.athleteById.has(c.athleteId)) throw new NotFoundError('That athlete');
    const slot = planning.slots.find((s) => s.id === c.slotId);
    if (!slot) throw new NotFoundError('That slot');
    if (c.variantId === null) return;
    const v = planning.variantById.get(c.variantId);
    if (!v) throw new NotFoundError('That variant');
    if (v.archived) (fields[field(i, 'variantId')] ??= []).push(`${v.name} is archived in the library`);
    else if (!slot.lifts.includes(v.lift)) {
      (fields[field(i, 'variantId')] ??= []).push(
        `${v.name} is a ${v.lift} variant; ${slot.label} takes ${slot.lifts.join(' or ')}`,
      );
    }
  });
  if (Object.keys(fields).length) throw new ValidationError('Some fields need attention.', fields);
}

/** Engine checks over the board as it will be once every change is made. */
function checksAfter(planning: Planning, rows: EntryRow[], changes: CellChange[]): Map<string, CandidateChecks> {
  const changed = new Set(changes.map(cellKey));
  const entries: StoredEntry[] = rows.filter((r) => !changed.has(cellKey(r)));
  for (const c of changes) entries.push({ ...c, pinned: !!c.pinned });
  const weeks = changes.map((c) => c.week).sort();
  const out = new Map<string, CandidateChecks>();
  const groups = buildPlanRequests(planning, {
    weeks: weekRange(weeks[0]!, weeks[weeks.length - 1]!),
    entries,
    athleteIds: [...new Set(changes.map((c) => c.athleteId))],
  });
  for (const g of groups) {
    const checks = prepareCandidateChecks(g.request);
    for (const id of g.athleteIds) out.set(String(id), checks);
  }
  return out;
}

function violationDto(v: Violation) {
  return {
    rule: v.rule,
    athleteId: Number(v.athleteId),
    week: v.week,
    slotId: v.slotId,
    variantId: Number(v.variantId),
    message: v.message,
  };
}

function writeOf(c: CellChange, breaks: boolean, userId: number): EntryWrite {
  if (c.variantId === null) {
    return { variantId: null, source: 'coach', pinned: false, reason: null, reasons: [], updatedBy: userId };
  }
  // A pick that breaks a rule is always the coach's, pinned, with the reason given.
  const source: PlanSource = breaks ? 'coach' : (c.source ?? 'coach');
  return {
    variantId: c.variantId,
    source,
    pinned: breaks || (c.pinned ?? !!c.reason),
    reason: c.reason ?? null,
    reasons: c.reasons ?? [],
    updatedBy: userId,
  };
}

const sameWrite = (row: EntryRow, w: EntryWrite) =>
  row.variantId === w.variantId && row.source === w.source && row.pinned === w.pinned && row.reason === w.reason;

/**
 * Applies the changes in one transaction. Each names the version it read (0: the cell had no entry);
 * a stale one answers 409 with what is there now, and nothing is written.
 */
export async function saveChanges(
  db: Db,
  auth: AuthContext,
  changes: CellChange[],
  field: FieldPath = singleField,
): Promise<{ entries: PlanEntryDto[]; created: boolean; affected: CellStatusChange[] }> {
  const t = today();
  const single = changes.length === 1;
  try {
    return await inTransaction(db, async (tx) => {
      const athleteIds = [...new Set(changes.map((c) => c.athleteId))];
      const athletes = await listAthletes(tx, auth.teamId, athleteIds);
      if (athletes.length !== athleteIds.length) throw new NotFoundError('That athlete');
      const planning = await loadPlanning(tx, auth.teamId, { athletes, today: t });
      checkInputs(planning, changes, field, t.week);

      // One locking read of these athletes' entries: the cells to change, and the rest of their board for
      // the rule check, held until commit (a concurrent create of the same cell waits, then sees this one).
      const all = await entriesOfAthletes(tx, auth.teamId, athleteIds, true);
      const byCell = new Map(all.map((r) => [cellKey(r), r]));
      const rows = changes.map((c) => byCell.get(cellKey(c)) ?? null);
      const stale = changes
        .map((c, i) => ({ c, row: rows[i]! }))
        .filter(({ c, row }) => (row ? row.version !== c.version : c.version !== 0));
      if (stale.length) await conflict(tx, single, stale);

      const checks = checksAfter(planning, all, changes);
      const breaking = new Set<number>();
      const needReason: ReturnType<typeof violationDto>[] = [];
      const fields: Record<string, string[]> = {};
      changes.forEach((c, i) => {
        if (c.variantId === null) return;
        const found = checks
          .get(String(c.athleteId))!
          .explain(String(c.athleteId), c.week, c.slotId, String(c.variantId));
        if (!found.length) return;
        breaking.add(i);
        if (!c.reason) {
          const list = found.map(violationDto);
          needReason.push(...list);
          fields[field(i, 'reason')] = [`This pick breaks a rule (${list.map((v) => v.message).join('; ')}): say why`];
        }
      });
      if (needReason.length) {
        throw new AppError(422, 'rule_break', 'This pick breaks a rule; give a reason to keep it anyway.', {
          fields,
          violations: needReason,
        });
      }

      const history: HistoryInsert[] = [];
      const ids: number[] = [];
      let created = false;
      for (const [i, c] of changes.entries()) {
        const row = rows[i]!;
        const w = writeOf(c, breaking.has(i), auth.userId);
        if (!row) {
          if (w.variantId === null) continue; // nothing there to clear
          const id = await insertEntry(tx, auth.teamId, c, w);
          created = true;
          ids.push(id);
          history.push(historyRow(auth, c, id, null, w, 1));
          continue;
        }
        ids.push(row.id);
        if (sameWrite(row, w)) continue;
        if (!(await updateEntry(tx, row.id, row.version, w))) await conflict(tx, single, [{ c, row }]);
        history.push(historyRow(auth, c, row.id, row.variantId, w, row.version + 1));
      }
      await appendHistory(tx, history);
      for (const athleteId of athleteIds) {
        const weeks = changes.filter((c) => c.athleteId === athleteId).map((c) => c.week);
        await publishChange(tx, { teamId: auth.teamId, athleteId, topic: 'plan', weeks });
      }
      const saved = await entriesByIds(tx, auth.teamId, ids);
      const byId = new Map(saved.map((r) => [r.id, r]));
      // Every other cell of these athletes whose status the save changed, so none turns silently.
      const after = await entriesOfAthletes(tx, auth.teamId, athleteIds);
      const affected = statusChanges(planning, all, after, athleteIds, new Set(changes.map(cellKey)));
      return {
        entries: await entryDtos(
          tx,
          ids.map((id) => byId.get(id)!),
        ),
        created,
        affected,
      };
    });
  } catch (err) {
    const code = errCode(err);
    if (!code || !RACE_CODES.has(code)) throw err;
    // The winner may still be committing (a deadlock is reported before it has): read until its row shows.
    let now = await Promise.all(changes.map((c) => findCell(db, auth.teamId, c)));
    for (let tries = 0; tries < 20 && now.some((r) => !r); tries++) {
      await new Promise((r) => setTimeout(r, 50));
      now = await Promise.all(changes.map((c) => findCell(db, auth.teamId, c)));
    }
    return conflict(
      db,
      single,
      changes.map((c, i) => ({ c, row: now[i]! })),
    );
  }
}

function historyRow(
  auth: AuthContext,
  cell: PlanCell,
  planEntryId: number,
  oldVariantId: number | null,
  w: EntryWrite,
  version: number,
): HistoryInsert {
  return {
    teamId: auth.teamId,
    planEntryId,
    athleteId: cell.athleteId,
    week: cell.week,
    slotId: cell.slotId,
    oldVariantId,
    newVariantId: w.variantId ?? null,
    source: w.source,
    pinned: w.pinned ?? false,
    reason: w.reason ?? null,
    version,
    changedBy: auth.userId,
  };
}

/** 409 with the cells as they are now: one entry (or null) for a single cell, a list for a batch. */
async function conflict(
  db: Queryable,
  single: boolean,
  stale: { c: CellChange; row: EntryRow | null }[],
): Promise<never> {
  const existing = stale.map((s) => s.row).filter((r): r is EntryRow => r !== null);
  const dtos = new Map((await entryDtos(db, existing)).map((d) => [d.id, d]));
  const message = 'Someone else changed this cell after you loaded the board.';
  if (single) throw new ConflictError(message, stale[0]!.row ? dtos.get(stale[0]!.row.id)! : null);
  throw new ConflictError(
    message,
    stale.map(({ c, row }) => ({
      athleteId: c.athleteId,
      week: c.week,
      slotId: c.slotId,
      entry: row ? dtos.get(row.id)! : null,
    })),
  );
}

/** Clearing needs an entry to clear. */
export async function clearCell(db: Db, auth: AuthContext, cell: PlanCell, version: number): Promise<PlanEntryDto> {
  const row = await findCell(db, auth.teamId, cell);
  if (!row) {
    if (!(await athleteExists(db, auth.teamId, cell.athleteId))) throw new NotFoundError('That athlete');
    throw new NotFoundError('That plan entry');
  }
  const { entries } = await saveChanges(db, auth, [{ ...cell, variantId: null, version }]);
  return entries[0]!;
}

export async function listPlans(db: Db, teamId: number, q: PlanListQuery): Promise<PlanList> {
  const { rows, total } = await listEntries(db, teamId, q);
  return { items: await entryDtos(db, rows), total };
}

export async function planHistory(
  db: Db,
  teamId: number,
  cell: PlanCell,
  limit: number,
  offset: number,
): Promise<PlanHistoryList> {
  if (!(await athleteExists(db, teamId, cell.athleteId))) throw new NotFoundError('That athlete');
  const { rows, total } = await cellHistory(db, teamId, cell, limit, offset);
  return {
    total,
    items: rows.map(({ h, oldName, newName, byName }) => ({
      id: h.id,
      version: h.version,
      oldVariantId: h.oldVariantId,
      oldVariantName: oldName,
      newVariantId: h.newVariantId,
      newVariantName: newName,
      source: h.source,
      pinned: h.pinned,
      reason: h.reason,
      changedBy: h.changedBy,
      changedByName: byName,
      changedAt: h.changedAt.toISOString(),
    })),
  };
}

// Offered to other modules: the board's planning facts and entries, and one athlete's picks of a week
// (My week and the connective-tissue work), through this module's service.
export { loadPlanning, today } from './plans.context';
export { entryDtos } from './plans.dto';
export { entriesOfAthletes, weekPicks } from './plans.repository';
