// Board changes as data: the optimistic board, the server's answer put in place, the inverse that undoes
// an action, the undo stack's limit, and the request each save becomes.
import { describe, expect, it } from 'vitest';
import {
  UNDO_LIMIT,
  applyEntries,
  applyOptimistic,
  inverseChange,
  pushUndo,
  requestFor,
  type UndoItem,
} from '../../../src/features/board/model/changes';
import { entry, snapshot, wk } from './fixtures';

describe('applyOptimistic / applyEntries', () => {
  it('shows a change at once: a replaced pick as a coach pick, a new one added, untouched cells kept', () => {
    const keep = entry(2, wk(1), 'lower', 1);
    const old = entry(1, wk(1), 'lower', 2, { version: 3 });
    const data = snapshot([keep, old]);
    const next = applyOptimistic(data, [
      { athleteId: 1, week: wk(1), slotId: 'lower', variantId: 3, version: 3, reason: 'because', pinned: true },
      { athleteId: 1, week: wk(2), slotId: 'upper', variantId: 4, version: 0 },
      { athleteId: 1, week: wk(20), slotId: 'upper', variantId: 4, version: 0 },
    ]);
    expect(next.entries[0]).toBe(keep);
    expect(next.entries[1]).toMatchObject({
      id: old.id,
      variantId: 3,
      source: 'coach',
      pinned: true,
      reason: 'because',
      version: 3,
    });
    expect(next.entries[2]).toMatchObject({ week: wk(2), slotId: 'upper', variantId: 4, id: -1 });
    expect(next.entries).toHaveLength(3);
    expect(data.entries).toHaveLength(2);
  });

  it('clears a cell without pinning it', () => {
    const data = snapshot([entry(1, wk(1), 'lower', 2, { pinned: true, reason: 'x', source: 'coach' })]);
    const next = applyOptimistic(data, [{ athleteId: 1, week: wk(1), slotId: 'lower', variantId: null, version: 1 }]);
    expect(next.entries[0]).toMatchObject({ variantId: null, pinned: false, reason: null });
  });

  it('puts the stored entries in place of the optimistic ones', () => {
    const data = snapshot([entry(1, wk(1), 'lower', 2)]);
    const stored = entry(1, wk(1), 'lower', 3, { version: 2, source: 'coach' });
    const added = entry(2, wk(2), 'upper', 4);
    const next = applyEntries(data, [stored, added]);
    expect(next.entries).toEqual([stored, added]);
  });
});

describe('inverseChange', () => {
  it('undoes a drop on an empty cell by clearing it at the version the drop left', () => {
    const after = entry(1, wk(1), 'lower', 3, { version: 1, source: 'coach' });
    expect(inverseChange(after, undefined)).toEqual({
      athleteId: 1,
      week: wk(1),
      slotId: 'lower',
      version: 1,
      variantId: null,
    });
  });

  it('puts back an engine pick, or a pinned coach pick with its reason', () => {
    const after = entry(1, wk(1), 'lower', 3, { version: 4 });
    expect(
      inverseChange(after, { variantId: 2, source: 'engine', pinned: false, reason: null, reasons: ['least recent'] }),
    ).toEqual({
      athleteId: 1,
      week: wk(1),
      slotId: 'lower',
      version: 4,
      variantId: 2,
      source: 'engine',
      pinned: false,
      reasons: ['least recent'],
    });
    expect(
      inverseChange(after, { variantId: 5, source: 'coach', pinned: true, reason: 'physio ok', reasons: [] }),
    ).toMatchObject({
      variantId: 5,
      pinned: true,
      reason: 'physio ok',
    });
  });
});

describe('pushUndo', () => {
  it(`keeps the last ${UNDO_LIMIT} actions and ignores ones that changed nothing`, () => {
    let stack: UndoItem[] = [];
    for (let i = 0; i < 25; i++) {
      stack = pushUndo(stack, {
        label: `a${i}`,
        changes: [{ athleteId: 1, week: wk(1), slotId: 'lower', variantId: null, version: i + 1 }],
      });
    }
    expect(stack).toHaveLength(UNDO_LIMIT);
    expect(stack[0]!.label).toBe('a5');
    expect(stack.at(-1)!.label).toBe('a24');
    expect(pushUndo(stack, { label: 'none', changes: [] })).toBe(stack);
  });
});

describe('requestFor', () => {
  it('saves one cell by PUT, clears one by DELETE with its version, and sends several as one batch', () => {
    const set = { athleteId: 1, week: wk(1), slotId: 'lower', variantId: 3, version: 2, reason: 'why not' };
    expect(requestFor([set])).toEqual({
      method: 'PUT',
      path: `/plans/1/${wk(1)}/lower`,
      body: { variantId: 3, version: 2, reason: 'why not' },
    });
    expect(requestFor([{ ...set, variantId: null }])).toEqual({
      method: 'DELETE',
      path: `/plans/1/${wk(1)}/lower?version=2`,
    });
    const two = [set, { ...set, athleteId: 2 }];
    expect(requestFor(two)).toEqual({ method: 'POST', path: '/plans/batch', body: { changes: two } });
  });
});
