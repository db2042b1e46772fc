// The board editor's reducer: saves in flight, the undo stack, cells a save changed, plan runs.
import { describe, expect, it } from 'vitest';
import type { CellStatusChange, GenerateResult } from '../../../shared/schemas';
import { editorReducer, initialEditor } from '../../../src/features/board/components/board-editor';
import { cellKey } from '../../../src/features/board/model/board-model';
import { wk } from './fixtures';

const k1 = cellKey(1, wk(1), 'upper');
// An undo with nothing in it is not kept, so each carries one change.
const back = [{ athleteId: 1, week: wk(1), slotId: 'upper', variantId: null, version: 2 }];
const k2 = cellKey(2, wk(1), 'lower');
const change = (athleteId: number, slotId: string, to: CellStatusChange['to']) =>
  ({ athleteId, week: wk(1), slotId, from: 'clean', to }) as CellStatusChange;

describe('editorReducer', () => {
  it('marks cells pending while their save is in flight, and clears only those when it ends', () => {
    let s = editorReducer(initialEditor(), { type: 'notice', notice: { tone: 'info', text: 'old' } });
    s = editorReducer(s, { type: 'saveStarted', keys: [k1] });
    s = editorReducer(s, { type: 'saveStarted', keys: [k2] });
    expect([...s.pending]).toEqual([k1, k2]);
    // A new save clears the last notice.
    expect(s.notice).toBeNull();
    s = editorReducer(s, { type: 'saveEnded', keys: [k1] });
    expect([...s.pending]).toEqual([k2]);
  });

  it('a save records its undo, flags the other cells it changed and unflags its own', () => {
    let s = editorReducer(initialEditor(), {
      type: 'saved',
      keys: [k1],
      affected: [change(2, 'lower', 'warning')],
      notice: { tone: 'info', text: 'also changed' },
      undo: { label: 'first', changes: back },
      status: 'Saved: first.',
    });
    expect([...s.flagged.keys()]).toEqual([k2]);
    expect(s.undoStack.map((u) => u.label)).toEqual(['first']);
    expect(s.status).toBe('Saved: first.');
    // Saving the flagged cell itself takes its mark off; a save with no undo (an undo itself) pushes none.
    s = editorReducer(s, { type: 'saved', keys: [k2], affected: [], notice: null, undo: null, status: 'Saved: x.' });
    expect(s.flagged.size).toBe(0);
    expect(s.notice?.text).toBe('also changed');
    expect(s.undoStack).toHaveLength(1);
    s = editorReducer(s, { type: 'undoTaken' });
    expect(s.undoStack).toHaveLength(0);
  });

  it('a plan run is busy until it ends, then reports, covers its weeks in Needs a look and can be undone', () => {
    let s = editorReducer(initialEditor(), { type: 'runStarted', kind: 'fill' });
    expect(s.busy).toBe('fill');
    const result = { weeks: [wk(1)], changes: [], unfilled: [] } as unknown as GenerateResult;
    s = editorReducer(s, {
      type: 'ran',
      title: 'Fill next week',
      result,
      undo: { label: 'Fill next week', changes: back },
      status: 'done',
    });
    s = editorReducer(s, { type: 'runEnded' });
    expect(s.busy).toBeNull();
    expect(s.report?.title).toBe('Fill next week');
    expect(s.lookWeeks).toEqual([wk(1)]);
    expect(s.undoStack.map((u) => u.label)).toEqual(['Fill next week']);
    s = editorReducer(s, { type: 'lookClosed' });
    expect(s.lookWeeks).toBeNull();
    s = editorReducer(s, { type: 'reportClosed' });
    expect(s.report).toBeNull();
  });
});
