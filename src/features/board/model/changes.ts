// Board changes as data: what a save sends, how the cached board looks before the server answers, and
// the inverse changes that undo an action (each naming the version the action left behind).
import type { BoardData, PlanEntryDto, PlanSource } from '../../../../shared/schemas';
import { cellKey, keyOf, type CellKey, type CellRef } from './board-model';

export interface CellChange extends CellRef {
  /** null clears the cell. */
  variantId: number | null;
  /** The version read (0: no entry there). */
  version: number;
  reason?: string;
  pinned?: boolean;
  source?: PlanSource;
  reasons?: string[];
}

/** Puts the changes on the board at once; the server's answer replaces them (or the snapshot comes back). */
export function applyOptimistic(data: BoardData, changes: CellChange[], now = new Date()): BoardData {
  const byKey = new Map(changes.map((c) => [keyOf(c), c]));
  const seen = new Set<CellKey>();
  const entries = data.entries.map((e) => {
    const key = cellKey(e.athleteId, e.week, e.slotId);
    const c = byKey.get(key);
    if (!c) return e;
    seen.add(key);
    return optimisticEntry(c, e, now);
  });
  for (const c of changes) {
    if (seen.has(keyOf(c)) || c.variantId === null) continue;
    if (c.week < data.from || c.week > data.to) continue;
    entries.push(optimisticEntry(c, undefined, now));
  }
  return { ...data, entries };
}

function optimisticEntry(c: CellChange, prev: PlanEntryDto | undefined, now: Date): PlanEntryDto {
  return {
    id: prev?.id ?? -1,
    athleteId: c.athleteId,
    week: c.week,
    slotId: c.slotId,
    variantId: c.variantId,
    source: c.source ?? 'coach',
    pinned: c.variantId !== null && (c.pinned ?? !!c.reason),
    reason: c.variantId === null ? null : (c.reason ?? null),
    reasons: c.reasons ?? [],
    version: c.version,
    updatedBy: prev?.updatedBy ?? null,
    updatedByName: prev?.updatedByName ?? null,
    updatedAt: now.toISOString(),
  };
}

/** Replaces the cells the server answered with what it stored. */
export function applyEntries(data: BoardData, saved: PlanEntryDto[]): BoardData {
  if (saved.length === 0) return data;
  const byKey = new Map(saved.map((e) => [cellKey(e.athleteId, e.week, e.slotId), e]));
  const seen = new Set<CellKey>();
  const entries = data.entries.map((e) => {
    const key = cellKey(e.athleteId, e.week, e.slotId);
    const s = byKey.get(key);
    if (!s) return e;
    seen.add(key);
    return s;
  });
  for (const [key, s] of byKey) {
    if (!seen.has(key) && s.week >= data.from && s.week <= data.to) entries.push(s);
  }
  return { ...data, entries };
}

type Before = Pick<PlanEntryDto, 'variantId' | 'source' | 'pinned' | 'reason' | 'reasons'> | null | undefined;

/** The change that puts `before` back into a cell that now holds `after`. */
export function inverseChange(after: PlanEntryDto, before: Before): CellChange {
  const cell = { athleteId: after.athleteId, week: after.week, slotId: after.slotId, version: after.version };
  if (!before || before.variantId === null) return { ...cell, variantId: null };
  return {
    ...cell,
    variantId: before.variantId,
    source: before.source,
    pinned: before.pinned,
    ...(before.reason ? { reason: before.reason } : {}),
    reasons: before.reasons,
  };
}

export interface UndoItem {
  label: string;
  changes: CellChange[];
}

export const UNDO_LIMIT = 20;

export function pushUndo(stack: UndoItem[], item: UndoItem): UndoItem[] {
  if (item.changes.length === 0) return stack;
  return [...stack, item].slice(-UNDO_LIMIT);
}

/** A save request as the API takes it: one cell by PUT or DELETE, several by batch. */
export function requestFor(
  changes: CellChange[],
):
  | { method: 'PUT'; path: string; body: object }
  | { method: 'DELETE'; path: string }
  | { method: 'POST'; path: string; body: object } {
  const [only] = changes;
  const body = (c: CellChange) => {
    const { athleteId: _a, week: _w, slotId: _s, ...rest } = c;
    return rest;
  };
  if (changes.length === 1 && only) {
    const path = `/plans/${only.athleteId}/${only.week}/${only.slotId}`;
    if (only.variantId === null) return { method: 'DELETE', path: `${path}?version=${only.version}` };
    return { method: 'PUT', path, body: body(only) };
  }
  return { method: 'POST', path: '/plans/batch', body: { changes } };
}
