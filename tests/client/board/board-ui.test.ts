// Pure helpers behind the board's interface: keyboard moves between cells, which rows to draw, and the
// library filters.
import { describe, expect, it } from 'vitest';
import { nextInDirection } from '../../../src/features/board/model/dnd';
import { rowHeight, rowWindow } from '../../../src/features/board/components/board-grid';
import { NO_FILTERS, filterLibrary } from '../../../src/features/board/components/library-drawer';
import { VARIANTS } from './fixtures';

describe('nextInDirection', () => {
  // A 3 × 3 grid of 100 × 50 cells.
  const cells = [0, 1, 2].flatMap((row) =>
    [0, 1, 2].map((col) => ({ id: `${row}${col}`, box: { left: col * 100, top: row * 50, width: 100, height: 50 } })),
  );
  const at = (id: string) => cells.find((c) => c.id === id)!.box;

  it('moves to the neighbour in the same row or column', () => {
    expect(nextInDirection('ArrowRight', at('11'), cells)!.id).toBe('12');
    expect(nextInDirection('ArrowLeft', at('11'), cells)!.id).toBe('10');
    expect(nextInDirection('ArrowDown', at('11'), cells)!.id).toBe('21');
    expect(nextInDirection('ArrowUp', at('11'), cells)!.id).toBe('01');
  });

  it('stops at the edge', () => {
    expect(
      nextInDirection(
        'ArrowRight',
        at('02'),
        cells.filter((c) => c.id !== '02'),
      ),
    ).toBeNull();
  });

  it('from a card outside the grid, takes the nearest cell in that direction', () => {
    const card = { left: 400, top: 60, width: 200, height: 40 };
    expect(nextInDirection('ArrowLeft', card, cells)!.id).toBe('12');
  });
});

describe('rowWindow', () => {
  const h = rowHeight(2);
  it('draws the rows in view with some to spare, and no more', () => {
    const [start, end] = rowWindow(0, 800, 40, h);
    expect(start).toBe(0);
    expect(end).toBeGreaterThanOrEqual(Math.ceil(800 / h));
    expect(end).toBeLessThan(40);
    const [s2, e2] = rowWindow(20 * h, 800, 40, h);
    expect(s2).toBeGreaterThan(15);
    expect(s2).toBeLessThanOrEqual(20);
    expect(e2).toBeGreaterThan(20 + Math.floor(800 / h));
  });

  it('never runs past the last row', () => {
    expect(rowWindow(1e6, 800, 40, h)).toEqual([40, 40]);
    expect(rowWindow(0, 800, 3, h)).toEqual([0, 3]);
  });
});

describe('filterLibrary', () => {
  it('leaves archived variants out and filters by lift, family, equipment, risk and text', () => {
    const all = filterLibrary(VARIANTS, NO_FILTERS).map((v) => v.name);
    expect(all).not.toContain('Old squat');
    expect(filterLibrary(VARIANTS, { ...NO_FILTERS, lift: 'bench' }).map((v) => v.name)).toEqual([
      'Floor press',
      'Board press',
    ]);
    expect(filterLibrary(VARIANTS, { ...NO_FILTERS, q: 'PIN' }).map((v) => v.name)).toEqual(['Pin squat']);
    expect(filterLibrary(VARIANTS, { ...NO_FILTERS, family: 'box squat' }).map((v) => v.name)).toEqual(['Box squat']);
    expect(filterLibrary(VARIANTS, { ...NO_FILTERS, equipment: '(none)' })).toHaveLength(5);
    expect(filterLibrary(VARIANTS, { ...NO_FILTERS, equipment: 'bands' })).toEqual([]);
    expect(filterLibrary(VARIANTS, { ...NO_FILTERS, risk: '1' })).toHaveLength(5);
  });
});
