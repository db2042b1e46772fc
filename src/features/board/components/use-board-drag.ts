// The board's drag and drop: sensors for mouse, touch and keyboard, the live ratings of every cell on
// screen while a card is carried (worked out once per drag), what a screen reader hears, and where the
// focus goes after a keyboard drop. What a drop does is the editor's business (`onDrop`).
import { startTransition, useCallback, useRef, useState, type RefObject } from 'react';
import {
  TouchSensor,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
  type DragStartEvent,
} from '@dnd-kit/core';
import {
  keyOf,
  prepareRatings,
  type BoardModel,
  type CellKey,
  type CellRef,
  type DragSource,
  type Ratings,
} from '../model/board-model';
import { BoardKeyboardSensor, MouseAndPenSensor, cellOfDndId, variantOfLibraryId } from '../model/dnd';
import { STATUS_WORDS } from '../model/words';

export const RATE_MEASURE = 'board:rate';

export interface DragState {
  source: DragSource;
  ratings: Ratings;
  /** Picked up with the keyboard: the focus follows the card to where it lands. */
  keyboard: boolean;
  /** What had the focus when the card was picked up, to go back to if it is not dropped. */
  from: HTMLElement | null;
}

/** Puts the focus on the card in a cell once it is drawn (a save shows it at once, but a frame later). */
function focusCard(box: HTMLElement | null, key: CellKey, fallback: HTMLElement | null, tries = 60) {
  const card = box?.querySelector<HTMLElement>(`[data-cell="${key}"] button`);
  if (card) card.focus();
  else if (tries > 0) requestAnimationFrame(() => focusCard(box, key, fallback, tries - 1));
  else fallback?.focus();
}

/** What became of a drop: saved, waiting for a reason, or not made (wrong lift, no change…). */
export type DropOutcome = 'saved' | 'asked' | 'refused';

const NO_SENSORS: ReturnType<typeof useSensors> = [];

export function useBoardDrag({
  modelRef,
  shownRef,
  scrollRef,
  labelOf,
  variantName,
  onDrop,
  disabled,
}: {
  modelRef: RefObject<BoardModel>;
  /** The athletes whose rows are drawn: their cells are rated first. */
  shownRef: RefObject<number[]>;
  scrollRef: RefObject<HTMLElement | null>;
  labelOf: (c: CellRef) => string;
  variantName: (id: number | null) => string;
  onDrop: (d: DragState, target: CellRef) => DropOutcome;
  /** No dragging at all (the board on a phone). */
  disabled: boolean;
}) {
  const [drag, setDrag] = useState<DragState | null>(null);
  // The cells' badges come in a transition: drawn in slices between frames, so picking a card up never
  // stalls the pointer, while the preview follows at once.
  const [shownRatings, setShownRatings] = useState<Ratings | null>(null);
  const dragRef = useRef<DragState | null>(null);

  const sensors = useSensors(
    useSensor(MouseAndPenSensor, { activationConstraint: { distance: 5 } }),
    useSensor(TouchSensor, { activationConstraint: { delay: 180, tolerance: 6 } }),
    useSensor(BoardKeyboardSensor, {
      // Enter opens a card's details; Space picks it up.
      keyboardCodes: { start: ['Space'], cancel: ['Escape'], end: ['Space', 'Enter'] },
    }),
  );

  const sourceOf = (id: string | number): DragSource | null => {
    const m = modelRef.current;
    const variantId = variantOfLibraryId(id);
    if (variantId !== null) return { kind: 'library', variantId };
    const cell = cellOfDndId(id);
    const entry = cell ? m.entryAt.get(keyOf(cell)) : undefined;
    if (cell && entry?.variantId != null) return { kind: 'cell', cell, variantId: entry.variantId, entry };
    return null;
  };

  const onDragStart = ({ active, activatorEvent }: DragStartEvent) => {
    const source = sourceOf(active.id);
    if (!source) return;
    // The engine is prepared once for this drag and judges every target cell on screen now; cells that
    // scroll into view later are judged as they appear.
    const m = modelRef.current;
    performance.mark(`${RATE_MEASURE}:start`);
    const ratings = prepareRatings(m, source);
    const shown = new Set(shownRef.current);
    for (const t of m.targets) if (shown.has(t.athleteId)) ratings.get(keyOf(t));
    performance.measure(RATE_MEASURE, `${RATE_MEASURE}:start`);
    const next = {
      source,
      ratings,
      keyboard: activatorEvent instanceof KeyboardEvent,
      from: document.activeElement instanceof HTMLElement ? document.activeElement : null,
    };
    dragRef.current = next;
    setDrag(next);
    startTransition(() => setShownRatings(ratings));
  };

  // The Space or click that ends a drag must not also open the card it lands on.
  const lastDragEnd = useRef(0);
  const endDrag = () => {
    dragRef.current = null;
    lastDragEnd.current = performance.now();
    setDrag(null);
    startTransition(() => setShownRatings(null));
  };

  const onDragEnd = ({ over }: DragEndEvent) => {
    const d = dragRef.current;
    endDrag();
    const target = cellOfDndId(over?.id);
    if (!d) return;
    const outcome = target ? onDrop(d, target) : 'refused';
    if (!d.keyboard || outcome === 'asked') return;
    // A keyboard drop keeps the focus on the cell it landed on; a refused one goes back to the card.
    if (outcome === 'saved' && target) focusCard(scrollRef.current, keyOf(target), d.from);
    else requestAnimationFrame(() => d.from?.focus());
  };

  const onDragCancel = () => {
    const d = dragRef.current;
    endDrag();
    if (d?.keyboard) requestAnimationFrame(() => d.from?.focus());
  };

  const announcements: Announcements = {
    onDragStart: ({ active }) => {
      const s = sourceOf(active.id);
      const name = s ? variantName(s.variantId) : 'the card';
      return `Picked up ${name}. Arrow keys move between cells and say whether a drop is clean; Space drops it, Escape puts it back.`;
    },
    onDragOver: ({ active, over }) => {
      const s = dragRef.current?.source;
      const name = s ? variantName(s.variantId) : String(active.id);
      const cell = cellOfDndId(over?.id);
      if (!cell) return `${name} is not over a cell.`;
      const r = dragRef.current?.ratings.get(keyOf(cell));
      const why = r ? [...r.breaks, ...r.warnings][0] : undefined;
      return `${labelOf(cell)}: ${r ? STATUS_WORDS[r.status] : 'not a target'}${why ? ` (${why})` : ''}.`;
    },
    onDragEnd: ({ active, over }) => {
      const cell = cellOfDndId(over?.id);
      const s = sourceOf(active.id);
      const name = s ? variantName(s.variantId) : 'The card';
      return cell ? `${name} dropped on ${labelOf(cell)}.` : `${name} was not dropped on a cell and went back.`;
    },
    onDragCancel: ({ active }) => {
      const s = sourceOf(active.id);
      return `Cancelled: ${s ? variantName(s.variantId) : 'the card'} went back.`;
    },
  };

  /** True while a card is carried or just after it was dropped: the click that ended it opens nothing. */
  const justDragged = useCallback(() => !!dragRef.current || performance.now() - lastDragEnd.current < 400, []);

  return {
    drag,
    shownRatings,
    sensors: disabled ? NO_SENSORS : sensors,
    onDragStart,
    onDragEnd,
    onDragCancel,
    announcements,
    justDragged,
  };
}
