// The board editor's state in one reducer: saves in flight, the undo stack, a drop waiting for a reason,
// a conflict with another coach, plan runs and their report, and the cells "Needs a look" covers.
import type { CellStatusChange, GenerateResult } from '../../../../shared/schemas';
import { cellKey, type CellKey } from '../model/board-model';
import { pushUndo, type CellChange, type UndoItem } from '../model/changes';
import type { ConflictView } from './conflict-notice';
import type { ReasonAsk } from './reason-dialog';

export interface PendingAsk {
  ask: ReasonAsk;
  changes: CellChange[];
  breakKeys: Set<CellKey>;
  label: string;
  undoable: boolean;
}

export interface PendingConflict {
  view: ConflictView;
  changes: CellChange[];
  label: string;
  undoable: boolean;
}

export type RunKind = 'fill' | 'meet' | 'reshuffle';
export interface EditorNotice {
  tone: 'error' | 'info';
  text: string;
}

export interface EditorState {
  /** Cells with a save in flight. */
  pending: ReadonlySet<CellKey>;
  undoStack: UndoItem[];
  ask: PendingAsk | null;
  conflict: PendingConflict | null;
  notice: EditorNotice | null;
  /** The last thing done, for screen readers. */
  status: string;
  busy: RunKind | null;
  report: { title: string; result: GenerateResult } | null;
  /** The weeks "Needs a look" covers (those of the last plan run), and cells a save changed. */
  lookWeeks: string[] | null;
  flagged: ReadonlyMap<CellKey, CellStatusChange>;
}

export const initialEditor = (): EditorState => ({
  pending: new Set(),
  undoStack: [],
  ask: null,
  conflict: null,
  notice: null,
  status: '',
  busy: null,
  report: null,
  lookWeeks: null,
  flagged: new Map(),
});

export type EditorAction =
  | { type: 'saveStarted'; keys: CellKey[] }
  | {
      type: 'saved';
      keys: CellKey[];
      affected: CellStatusChange[];
      notice: EditorNotice | null;
      undo: UndoItem | null;
      status: string;
    }
  | { type: 'saveEnded'; keys: CellKey[] }
  | { type: 'conflict'; conflict: PendingConflict | null }
  | { type: 'ask'; ask: PendingAsk | null }
  | { type: 'notice'; notice: EditorNotice | null }
  | { type: 'undoTaken' }
  | { type: 'runStarted'; kind: RunKind }
  | { type: 'ran'; title: string; result: GenerateResult; undo: UndoItem; status: string }
  | { type: 'runEnded' }
  | { type: 'reportClosed' }
  | { type: 'lookClosed' };

export function editorReducer(s: EditorState, a: EditorAction): EditorState {
  switch (a.type) {
    case 'saveStarted':
      return { ...s, pending: new Set([...s.pending, ...a.keys]), notice: null };
    case 'saved': {
      const flagged = new Map(s.flagged);
      for (const k of a.keys) flagged.delete(k);
      for (const c of a.affected) flagged.set(cellKey(c.athleteId, c.week, c.slotId), c);
      return {
        ...s,
        flagged,
        notice: a.notice ?? s.notice,
        undoStack: a.undo ? pushUndo(s.undoStack, a.undo) : s.undoStack,
        status: a.status,
      };
    }
    case 'saveEnded':
      return { ...s, pending: new Set([...s.pending].filter((k) => !a.keys.includes(k))) };
    case 'conflict':
      return { ...s, conflict: a.conflict };
    case 'ask':
      return { ...s, ask: a.ask };
    case 'notice':
      return { ...s, notice: a.notice };
    case 'undoTaken':
      return { ...s, undoStack: s.undoStack.slice(0, -1) };
    case 'runStarted':
      return { ...s, busy: a.kind, notice: null };
    case 'ran':
      return {
        ...s,
        report: { title: a.title, result: a.result },
        lookWeeks: a.result.weeks,
        undoStack: pushUndo(s.undoStack, a.undo),
        status: a.status,
      };
    case 'runEnded':
      return { ...s, busy: null };
    case 'reportClosed':
      return { ...s, report: null };
    case 'lookClosed':
      return { ...s, lookWeeks: null, flagged: new Map() };
  }
}
