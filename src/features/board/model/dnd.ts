// Drag-and-drop wiring the board shares: cell and library ids, a pointer sensor that leaves touch to the
// touch sensor, the collision rule and the keyboard moves between cells.
import type { PointerEvent as ReactPointerEvent } from 'react';
import {
  KeyboardSensor,
  PointerSensor,
  type CollisionDetection,
  type SensorContext,
  type PointerSensorOptions,
} from '@dnd-kit/core';
import type { Coordinates } from '@dnd-kit/utilities';
import { cellKey, parseCellKey, type CellKey, type CellRef } from './board-model';

const CELL = 'cell:';
const LIB = 'lib:';

export const cellDndId = (c: CellRef) => `${CELL}${cellKey(c.athleteId, c.week, c.slotId)}`;
export const libraryDndId = (variantId: number) => `${LIB}${variantId}`;

export function cellOfDndId(id: string | number | null | undefined): CellRef | null {
  return typeof id === 'string' && id.startsWith(CELL) ? parseCellKey(id.slice(CELL.length) as CellKey) : null;
}

export function variantOfLibraryId(id: string | number): number | null {
  return typeof id === 'string' && id.startsWith(LIB) ? Number(id.slice(LIB.length)) : null;
}

/** Mouse and pen only: a finger on a card should scroll the board until it is held (the touch sensor). */
export class MouseAndPenSensor extends PointerSensor {
  static override activators = [
    {
      eventName: 'onPointerDown' as const,
      handler: ({ nativeEvent }: ReactPointerEvent, { onActivation }: PointerSensorOptions) => {
        if (nativeEvent.pointerType === 'touch' || !nativeEvent.isPrimary || nativeEvent.button !== 0) return false;
        onActivation?.({ event: nativeEvent });
        return true;
      },
    },
  ];
}

/** The drag preview's class: hit tests look through it to what lies under it. */
export const OVERLAY_CLASS = 'board-drag-overlay';
/** Marks a drop target with its dnd id. */
export const DROP_ATTR = 'data-drop-id';

/**
 * The drop target the point is on, if the topmost thing there is one. The drag preview ignores the
 * pointer (pointer-events: none), so the page reports what lies under it.
 */
function dropIdAt(x: number, y: number): string | null {
  const el = document.elementFromPoint(x, y);
  if (!el || el.closest(`.${OVERLAY_CLASS}`)) return null;
  return el.closest(`[${DROP_ATTR}]`)?.getAttribute(DROP_ATTR) ?? null;
}

/**
 * The cell under the pointer, or under the dragged card's top-left corner when moving by keyboard. It
 * asks the page itself rather than rectangles measured when the drag began, so it stays right while
 * the board scrolls under a drag, and a cell hidden under the sticky name column is never hit.
 */
export const boardCollision: CollisionDetection = ({ pointerCoordinates, collisionRect, droppableContainers }) => {
  const p = pointerCoordinates ?? { x: collisionRect.left + 4, y: collisionRect.top + 4 };
  const id = dropIdAt(p.x, p.y);
  const container = id ? droppableContainers.find((c) => c.id === id) : undefined;
  const found = container && !container.disabled ? container : undefined;
  // An unchanged answer is the same array, so the drag context does not tell the whole board about a
  // change that is none.
  if (last && (found ? last[0]?.data?.droppableContainer === found : last.length === 0)) return last;
  last = found ? [{ id: found.id, data: { droppableContainer: found, value: 0 } }] : [];
  return last;
};
let last: ReturnType<CollisionDetection> | null = null;

const ARROWS = new Set(['ArrowUp', 'ArrowDown', 'ArrowLeft', 'ArrowRight']);

interface Box {
  left: number;
  top: number;
  width: number;
  height: number;
}

/**
 * The next box from `here` in the arrow's direction: the nearest one ahead, preferring the same row
 * (or column) — three pixels across count as one along.
 */
export function nextInDirection<T extends { box: Box }>(code: string, here: Box, candidates: T[]): T | null {
  const cx = here.left + here.width / 2;
  const cy = here.top + here.height / 2;
  let best: { item: T; score: number } | null = null;
  for (const item of candidates) {
    const r = item.box;
    const dx = r.left + r.width / 2 - cx;
    const dy = r.top + r.height / 2 - cy;
    const along = code === 'ArrowRight' ? dx : code === 'ArrowLeft' ? -dx : code === 'ArrowDown' ? dy : -dy;
    const across = code === 'ArrowRight' || code === 'ArrowLeft' ? Math.abs(dy) : Math.abs(dx);
    if (along < 4) continue;
    const score = along + 3 * across;
    if (!best || score < best.score) best = { item, score };
  }
  return best?.item ?? null;
}

interface SensorInternals {
  props: { context: { current: SensorContext } };
  referenceCoordinates?: Coordinates;
  handleMove(event: Event, coordinates: Coordinates): void;
}
type KeyHandler = (this: SensorInternals, event: Event) => void;

/**
 * dnd-kit's keyboard sensor, except that an arrow key moves the card straight onto the next cell: that
 * cell is scrolled into view first and read where it then is, so moves stay exact while the board
 * scrolls under them (the stock sensor scrolls instead of moving, from a view of the page a step old).
 */
export class BoardKeyboardSensor extends KeyboardSensor {}

const stockKeyDown = (KeyboardSensor.prototype as unknown as { handleKeyDown: KeyHandler }).handleKeyDown;
(BoardKeyboardSensor.prototype as unknown as { handleKeyDown: KeyHandler }).handleKeyDown = function (event) {
  if (!(event instanceof KeyboardEvent) || !ARROWS.has(event.code)) {
    stockKeyDown.call(this, event);
    return;
  }
  event.preventDefault();
  const { collisionRect, droppableContainers, over } = this.props.context.current;
  if (!collisionRect) return;
  this.referenceCoordinates ??= { x: collisionRect.left, y: collisionRect.top };
  const here = (over && droppableContainers.get(over.id)?.node.current?.getBoundingClientRect()) ?? collisionRect;
  const candidates: { node: HTMLElement; box: DOMRect }[] = [];
  for (const c of droppableContainers.getEnabled()) {
    const node = c.node.current;
    if (c.id !== over?.id && node) candidates.push({ node, box: node.getBoundingClientRect() });
  }
  const next = nextInDirection(event.code, here, candidates);
  if (!next) return;
  next.node.scrollIntoView({ block: 'nearest', inline: 'nearest' });
  const r = next.node.getBoundingClientRect();
  this.handleMove(event, { x: r.left - this.referenceCoordinates.x, y: r.top - this.referenceCoordinates.y });
};
