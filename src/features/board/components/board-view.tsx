// The coach's board: the grid and the library inside one drag-and-drop context, live rule checks while
// dragging, saves that show at once, reasons for rule breaks, conflicts with another coach, plan runs and undo.
import {
  useCallback,
  useEffect,
  useLayoutEffect,
  useMemo,
  useReducer,
  useRef,
  useState,
  useSyncExternalStore,
  type FocusEvent as ReactFocusEvent,
  type ReactNode,
} from 'react';
import { DndContext, DragOverlay, MeasuringStrategy } from '@dnd-kit/core';
import { useQueryClient } from '@tanstack/react-query';
import type { BoardData, GenerateBody, PlanEntryDto } from '../../../../shared/schemas';
import { Notice, PageHeader, TrainingCaution } from '../../../components/ui/page';
import { isApiError, type ApiError } from '../../../lib/api-client';
import { decodeConflict, decodeRuleBreak } from '../api/errors';
import { planKeys, useBoard, type BoardRange } from '../api/queries';
import { useGeneratePlan } from '../api/use-generate-plan';
import { useSavePlanEntries } from '../api/use-save-plan-entries';
import {
  breaksAfter,
  buildBoardModel,
  cellKey,
  cellLabel,
  keyOf,
  parseCellKey,
  type BoardModel,
  type CellKey,
  type CellRef,
} from '../model/board-model';
import { inverseChange, type CellChange } from '../model/changes';
import { OVERLAY_CLASS, boardCollision, DROP_ATTR } from '../model/dnd';
import { needsALook, reviewOf } from '../model/review';
import { STATUS_WORDS } from '../model/words';
import { NO_FILTER, filterAthletes, restrictionTags, type BoardFilter } from '../model/filters';
import { BoardFilters } from './board-filters';
import { BoardGrid, NAME_WIDTH, WEEK_WIDTH, rowHeight } from './board-grid';
import { BoardToolbar } from './board-toolbar';
import { CellDetails } from './cell-details';
import { ConflictNotice, type ConflictView } from './conflict-notice';
import { GenerateReport } from './generate-report';
import { LibraryDrawer } from './library-drawer';
import { NeedsALook } from './needs-a-look';
import { ReasonDialog } from './reason-dialog';
import { editorReducer, initialEditor, type EditorNotice, type RunKind } from './board-editor';
import { useBoardDrag, type DragState, type DropOutcome } from './use-board-drag';

const PHONE = '(max-width: 767.98px)';
/** True on a phone-sized screen, and kept up to date when the window is resized or turned. */
function usePhone(): boolean {
  return useSyncExternalStore(
    (notify) => {
      const q = window.matchMedia(PHONE);
      q.addEventListener('change', notify);
      return () => q.removeEventListener('change', notify);
    },
    () => window.matchMedia(PHONE).matches,
    () => false,
  );
}

const COMPACT_KEY = 'rackturn.board.compact';
/** Compact rows, remembered on this device. */
function useCompactRows(): [boolean, (on: boolean) => void] {
  const [compact, setCompact] = useState(() => {
    try {
      return window.localStorage.getItem(COMPACT_KEY) === '1';
    } catch {
      return false;
    }
  });
  const set = useCallback((on: boolean) => {
    setCompact(on);
    try {
      window.localStorage.setItem(COMPACT_KEY, on ? '1' : '0');
    } catch {
      // Private browsing may refuse storage: the choice then lasts until the page is left.
    }
  }, []);
  return [compact, set];
}

const RUNS: Record<RunKind, { body: GenerateBody; title: string }> = {
  fill: { body: { weeks: 'next' }, title: 'Fill next week' },
  meet: { body: { weeks: 'toMeet' }, title: 'Plan to meet' },
  reshuffle: { body: { weeks: 'ahead', reshuffle: true }, title: 'Reshuffle' },
};

export const MODEL_MEASURE = 'board:model';

function timedModel(data: BoardData, prev?: BoardModel): BoardModel {
  performance.mark(`${MODEL_MEASURE}:start`);
  const model = buildBoardModel(data, prev);
  performance.measure(MODEL_MEASURE, `${MODEL_MEASURE}:start`);
  return model;
}

function useBoardModel(range: BoardRange): BoardModel {
  const { data } = useBoard(range);
  // The route's loader has put the snapshot in the cache before this renders.
  const snapshot = data!;
  const [model, setModel] = useState(() => timedModel(snapshot));
  if (model.data !== snapshot) {
    const next = timedModel(snapshot, model);
    setModel(next);
    return next;
  }
  return model;
}

export function BoardView({
  range,
  weekActions,
  openCell,
  cellExtras,
}: {
  range: BoardRange;
  weekActions?: ReactNode;
  /** A cell to open on arrival (a link from elsewhere names it). */
  openCell?: CellRef | null;
  /** More to show in a cell's details, below its own sections. */
  cellExtras?: (cell: CellRef, label: string) => ReactNode;
}) {
  const queryClient = useQueryClient();
  const model = useBoardModel(range);
  const modelRef = useRef(model);
  useLayoutEffect(() => {
    modelRef.current = model;
  }, [model]);

  const scrollRef = useRef<HTMLDivElement>(null);
  const shownRef = useRef<number[]>([]);
  const saveMutation = useSavePlanEntries();
  const generateMutation = useGeneratePlan();
  const [editor, dispatch] = useReducer(editorReducer, undefined, initialEditor);
  const { pending, undoStack, ask, conflict, notice, status, busy, report, lookWeeks, flagged } = editor;
  const [details, setDetails] = useState<CellKey | null>(null);
  // On a phone the board is read-only (no drag; a card opens its details) and the library stays hidden,
  // so the grid has the whole width.
  const phone = usePhone();
  const [libraryWanted, setLibraryOpen] = useState(true);
  const libraryOpen = libraryWanted && !phone;
  const flaggedKeys = useMemo(() => new Set(flagged.keys()), [flagged]);
  const lookItems = useMemo(
    () => (lookWeeks || flagged.size ? needsALook(model, lookWeeks ?? [], flaggedKeys) : []),
    [model, lookWeeks, flagged.size, flaggedKeys],
  );

  // The rows shown: every athlete, or those the filters keep.
  const [filter, setFilter] = useState<BoardFilter>(NO_FILTER);
  const rows = useMemo(() => filterAthletes(model, filter, flaggedKeys), [model, filter, flaggedKeys]);
  const rowsRef = useRef(rows);
  useLayoutEffect(() => {
    rowsRef.current = rows;
  }, [rows]);
  const tags = useMemo(() => restrictionTags(model.athletes), [model.athletes]);
  const [compact, setCompact] = useCompactRows();
  const rowHRef = useRef(0);
  useLayoutEffect(() => {
    rowHRef.current = rowHeight(model.slots.length, compact);
  }, [model.slots.length, compact]);

  const labelOf = useCallback((c: CellRef) => cellLabel(modelRef.current, c), []);
  const variantName = useCallback(
    (id: number | null) => (id === null ? 'nothing' : (modelRef.current.variantById.get(id)?.name ?? `variant ${id}`)),
    [],
  );

  const conflictView = useCallback(
    (err: ApiError, changes: CellChange[], label: string): ConflictView => {
      const decoded = decodeConflict(err);
      const now = new Map<CellKey, PlanEntryDto | null>();
      if ('cells' in decoded) {
        for (const c of decoded.cells) now.set(cellKey(c.athleteId, c.week, c.slotId), c.entry);
      } else if (changes[0]) now.set(keyOf(changes[0]), decoded.single);
      return {
        label,
        cells: changes
          .filter((c) => now.has(keyOf(c)))
          .map((c) => {
            const theirs = now.get(keyOf(c)) ?? null;
            return {
              cell: labelOf(c),
              theirs: variantName(theirs?.variantId ?? null),
              by: theirs?.updatedByName ?? null,
              mine: c.variantId === null ? 'an empty cell' : variantName(c.variantId),
            };
          }),
      };
    },
    [labelOf, variantName],
  );

  const save = useCallback(
    async (changes: CellChange[], label: string, undoable: boolean) => {
      const before = new Map(changes.map((c) => [keyOf(c), modelRef.current.entryAt.get(keyOf(c))]));
      const keys = changes.map(keyOf);
      dispatch({ type: 'saveStarted', keys });
      try {
        const { saved, affected } = await saveMutation.mutateAsync({ changes });
        let notice: EditorNotice | null = null;
        if (affected.length) {
          const turned = affected.filter((a) => a.to !== 'clean').length;
          notice = {
            tone: 'info',
            text: `This save also changed ${affected.length} other ${affected.length === 1 ? 'cell' : 'cells'}${
              turned ? ` (${turned} now ${turned === 1 ? 'needs' : 'need'} a look)` : ''
            }: ${affected.map((a) => `${labelOf(a)} is now ${STATUS_WORDS[a.to].toLowerCase()}`).join('; ')}. They are marked on the board and listed under Needs a look.`,
          };
        }
        const undo = undoable
          ? {
              label,
              changes: saved.map((e) => inverseChange(e, before.get(cellKey(e.athleteId, e.week, e.slotId)))),
            }
          : null;
        dispatch({ type: 'saved', keys, affected, notice, undo, status: `Saved: ${label}.` });
      } catch (err) {
        if (isApiError(err, 409)) {
          dispatch({
            type: 'conflict',
            conflict: { view: conflictView(err, changes, label), changes, label, undoable },
          });
          await queryClient.invalidateQueries({ queryKey: planKeys.boards() });
        } else if (isApiError(err, 422) && err.code === 'rule_break') {
          const violations = decodeRuleBreak(err);
          const byCell = new Map<CellKey, string[]>();
          for (const v of violations) {
            const k = cellKey(v.athleteId, v.week, v.slotId);
            byCell.set(k, [...(byCell.get(k) ?? []), v.message]);
          }
          dispatch({
            type: 'ask',
            ask: {
              ask: {
                label,
                breaks: [...byCell].map(([k, rules]) => ({ cell: labelOf(parseCellKey(k)), rules })),
              },
              changes,
              breakKeys: new Set(byCell.keys()),
              label,
              undoable,
            },
          });
        } else {
          const why = err instanceof Error ? err.message : 'unknown error';
          dispatch({
            type: 'notice',
            notice: { tone: 'error', text: `Not saved (${label}): ${why} The board shows what is stored.` },
          });
        }
      } finally {
        dispatch({ type: 'saveEnded', keys });
      }
    },
    [saveMutation, conflictView, queryClient, labelOf],
  );

  const undo = useCallback(() => {
    const item = undoStack[undoStack.length - 1];
    if (!item) return;
    dispatch({ type: 'undoTaken' });
    void save(item.changes, `undo ${item.label}`, false);
  }, [undoStack, save]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t && /^(INPUT|TEXTAREA|SELECT)$/.test(t.tagName)) return;
      if ((e.ctrlKey || e.metaKey) && !e.shiftKey && e.key.toLowerCase() === 'z') {
        e.preventDefault();
        undo();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [undo]);

  const run = useCallback(
    async (kind: RunKind) => {
      dispatch({ type: 'runStarted', kind });
      try {
        const result = await generateMutation.mutateAsync(RUNS[kind].body);
        dispatch({
          type: 'ran',
          title: RUNS[kind].title,
          result,
          undo: { label: RUNS[kind].title, changes: result.changes.map((c) => inverseChange(c.entry, c.previous)) },
          status: `${RUNS[kind].title}: ${result.changes.length} cells changed, ${result.unfilled.length} not filled.`,
        });
      } catch (err) {
        const why = err instanceof Error ? err.message : 'unknown error';
        dispatch({ type: 'notice', notice: { tone: 'error', text: `${RUNS[kind].title} did not run: ${why}` } });
      } finally {
        dispatch({ type: 'runEnded' });
      }
    },
    [generateMutation],
  );

  /** Saves a drop, or asks for a reason first; says which. */
  const drop = (d: DragState, target: CellRef): DropOutcome => {
    const m = modelRef.current;
    const key = keyOf(target);
    const rating = d.ratings.get(key);
    const variant = m.variantById.get(d.source.variantId);
    if (!rating || !variant || rating.status === 'source' || pending.has(key)) return 'refused';
    const slot = m.slots.find((s) => s.id === target.slotId);
    if (rating.status === 'wrongLift') {
      dispatch({
        type: 'notice',
        notice: {
          tone: 'info',
          text: `${variant.name} is a ${variant.lift} variant; ${slot?.label ?? 'this slot'} takes ${slot?.lifts.join(' or ')}.`,
        },
      });
      return 'refused';
    }
    const targetEntry = m.entryAt.get(key);
    let changes: CellChange[];
    let label: string;
    let breaks: Map<CellKey, string[]>;
    if (d.source.kind === 'library') {
      if (targetEntry?.variantId === variant.id) return 'refused';
      changes = [{ ...target, variantId: variant.id, version: targetEntry?.version ?? 0 }];
      label = `${variant.name} to ${labelOf(target)}`;
      breaks = rating.status === 'break' ? new Map([[key, rating.breaks]]) : new Map();
    } else {
      const from = d.source.cell;
      const back = targetEntry?.variantId ?? null;
      const backVariant = back === null ? undefined : m.variantById.get(back);
      const fromSlot = m.slots.find((s) => s.id === from.slotId);
      if (backVariant && !fromSlot?.lifts.includes(backVariant.lift)) {
        dispatch({
          type: 'notice',
          notice: {
            tone: 'info',
            text: `Cannot swap: ${backVariant.name} does not fit ${fromSlot?.label ?? from.slotId}.`,
          },
        });
        return 'refused';
      }
      changes = [
        { ...target, variantId: variant.id, version: targetEntry?.version ?? 0 },
        { ...from, variantId: back, version: d.source.entry.version },
      ];
      label =
        back === null ? `move ${variant.name} to ${labelOf(target)}` : `swap ${variant.name} and ${backVariant?.name}`;
      breaks = breaksAfter(m, [
        { cell: target, variantId: variant.id },
        { cell: from, variantId: back },
      ]);
    }
    if (breaks.size) {
      dispatch({
        type: 'ask',
        ask: {
          ask: { label, breaks: [...breaks].map(([k, rules]) => ({ cell: labelOf(parseCellKey(k)), rules })) },
          changes,
          breakKeys: new Set(breaks.keys()),
          label,
          undoable: true,
        },
      });
      return 'asked';
    }
    void save(changes, label, true);
    return 'saved';
  };

  const dragging = useBoardDrag({
    modelRef,
    shownRef,
    scrollRef,
    labelOf,
    variantName,
    onDrop: drop,
    disabled: phone,
  });

  // Opens with one past week to the left of this week, so the weeks still to plan are in view on a
  // tablet too. Set before the first paint (no jump); the layout it needs is the one that paint needs.
  const currentIndex = model.weeks.indexOf(model.data.currentWeek);
  useLayoutEffect(() => {
    if (scrollRef.current && currentIndex > 0) scrollRef.current.scrollLeft = (currentIndex - 1) * WEEK_WIDTH;
    // Only on opening the board; later the coach decides where to look.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const { justDragged } = dragging;
  const openDetails = useCallback(
    (key: CellKey) => {
      if (justDragged()) return;
      setDetails(key);
    },
    [justDragged],
  );
  /** Brings a cell into view (its row may not be drawn yet) and puts the focus on its card. */
  const goToCell = useCallback((key: CellKey, then?: () => void) => {
    const m = modelRef.current;
    const box = scrollRef.current;
    const c = parseCellKey(key);
    if (!box) return;
    const col = m.weeks.indexOf(c.week);
    if (col < 0 || !m.athleteById.has(c.athleteId)) return;
    /** Scrolls to the cell once its row is among those shown. */
    const place = () => {
      const row = rowsRef.current.findIndex((a) => a.id === c.athleteId);
      if (row >= 0) box.scrollTo({ top: row * rowHRef.current, left: Math.max(0, col - 1) * WEEK_WIDTH });
      return row >= 0;
    };
    let placed = place();
    // The athlete's row is filtered out: show everyone, then go there.
    if (!placed) setFilter(NO_FILTER);
    let tries = 0;
    const attempt = () => {
      if (!placed) {
        placed = place();
        if (tries++ < 30) requestAnimationFrame(attempt);
        return;
      }
      const el = box.querySelector<HTMLElement>(`[data-cell="${key}"]`);
      const target = el?.querySelector<HTMLElement>('button') ?? null;
      if (target) {
        target.focus();
        target.scrollIntoView({ block: 'nearest', inline: 'nearest' });
        then?.();
        return;
      }
      if (tries++ < 30) requestAnimationFrame(attempt);
    };
    requestAnimationFrame(attempt);
  }, []);

  /** Scrolls an athlete's row into view and puts the focus on its name. */
  const jumpTo = useCallback((athleteId: number) => {
    const box = scrollRef.current;
    const row = rowsRef.current.findIndex((a) => a.id === athleteId);
    if (!box || row < 0) return;
    box.scrollTo({ top: row * rowHRef.current });
    let tries = 0;
    const attempt = () => {
      const th = box.querySelector<HTMLElement>(`th[data-athlete="${athleteId}"]`);
      if (th) {
        th.focus();
        th.scrollIntoView({ block: 'nearest' });
      } else if (tries++ < 30) requestAnimationFrame(attempt);
    };
    requestAnimationFrame(attempt);
  }, []);

  const applyAlternative = (
    cell: CellRef,
    variantId: number,
    status: 'clean' | 'warning' | 'break',
    why: string[],
    reason?: string,
  ) => {
    const m = modelRef.current;
    const key = keyOf(cell);
    const entry = m.entryAt.get(key);
    const name = m.variantById.get(variantId)?.name ?? `variant ${variantId}`;
    const label = `${name} to ${labelOf(cell)}`;
    const changes: CellChange[] = [
      { ...cell, variantId, version: entry?.version ?? 0, ...(reason ? { reason, pinned: true } : {}) },
    ];
    setDetails(null);
    if (status === 'break' && !reason) {
      dispatch({
        type: 'ask',
        ask: {
          ask: { label, breaks: [{ cell: labelOf(cell), rules: why }] },
          changes,
          breakKeys: new Set([key]),
          label,
          undoable: true,
        },
      });
      return;
    }
    void save(changes, label, true);
    // Back to the cell, so the coach carries on from where they were.
    requestAnimationFrame(() => goToCell(key));
  };

  // A link named a cell: go there and open its details, once per cell named.
  const openKey = openCell ? cellKey(openCell.athleteId, openCell.week, openCell.slotId) : null;
  useEffect(() => {
    if (!openKey) return;
    const m = modelRef.current;
    const c = parseCellKey(openKey);
    if (!m.weeks.includes(c.week) || !m.athleteById.has(c.athleteId) || !m.slots.some((x) => x.id === c.slotId)) return;
    goToCell(openKey, () => setDetails(openKey));
  }, [openKey, goToCell]);

  // The page's skip link ("Skip to the board") lands on the grid itself: hand the focus on to the first
  // card still to plan, so one Tab and Enter reach it.
  const onGridFocus = (e: ReactFocusEvent<HTMLDivElement>) => {
    if (e.target !== e.currentTarget) return;
    const box = e.currentTarget;
    const first =
      box.querySelector<HTMLElement>(`[${DROP_ATTR}] button`) ?? box.querySelector<HTMLElement>('[data-cell] button');
    first?.focus();
  };

  const detailCell = details ? parseCellKey(details) : null;
  const detailEntry = details ? model.entryAt.get(details) : undefined;
  const dragged = dragging.drag ? model.variantById.get(dragging.drag.source.variantId) : undefined;
  const top = undoStack[undoStack.length - 1];

  return (
    <section>
      <PageHeader
        title="Board"
        subtitle={`${model.weeks[0]} to ${model.weeks[model.weeks.length - 1]} · ${model.athletes.length} athletes`}
      />
      <BoardToolbar
        busy={busy}
        onFill={() => void run('fill')}
        onPlanToMeet={() => void run('meet')}
        onReshuffle={() => void run('reshuffle')}
        undoLabel={top?.label ?? null}
        undoCount={undoStack.length}
        onUndo={undo}
        libraryOpen={libraryOpen}
        onToggleLibrary={() => setLibraryOpen((o) => !o)}
        extra={weekActions}
        readOnly={phone}
      />
      <BoardFilters
        filter={filter}
        onChange={setFilter}
        tags={tags}
        rows={rows}
        total={model.athletes.length}
        onJump={jumpTo}
        compact={compact}
        onCompact={setCompact}
      />
      <p role="status" className="sr-only">
        {status}
      </p>
      {conflict ? (
        <ConflictNotice
          conflict={conflict.view}
          busy={saveMutation.isPending}
          onDismiss={() => dispatch({ type: 'conflict', conflict: null })}
          onReapply={() => {
            const c = conflict;
            dispatch({ type: 'conflict', conflict: null });
            const m = modelRef.current;
            const again = c.changes.map((ch) => ({ ...ch, version: m.entryAt.get(keyOf(ch))?.version ?? 0 }));
            void save(again, c.label, c.undoable);
          }}
        />
      ) : null}
      {notice ? (
        <div className="mb-3">
          <Notice tone={notice.tone}>{notice.text}</Notice>
        </div>
      ) : null}
      {lookWeeks || flagged.size ? (
        <NeedsALook
          items={lookItems}
          model={model}
          weeks={
            lookWeeks?.length
              ? lookWeeks.length === 1
                ? lookWeeks[0]!
                : `${lookWeeks[0]} to ${lookWeeks[lookWeeks.length - 1]}`
              : 'the cells your last save changed'
          }
          // To the cell, with its details open on "What fits here"; closing them leaves the focus on the card.
          onGo={(key) => goToCell(key, () => setDetails(key))}
          onClose={() => {
            dispatch({ type: 'lookClosed' });
          }}
        />
      ) : null}
      {report ? (
        <GenerateReport
          title={report.title}
          result={report.result}
          model={model}
          onClose={() => dispatch({ type: 'reportClosed' })}
        />
      ) : null}
      <DndContext
        sensors={dragging.sensors}
        collisionDetection={boardCollision}
        measuring={{ droppable: { strategy: MeasuringStrategy.WhileDragging } }}
        // Scroll only when the pointer is close to the board's edge, so a drop on a cell in view stays put.
        autoScroll={{ threshold: { x: 0.08, y: 0.12 } }}
        accessibility={{
          announcements: dragging.announcements,
          // The board puts the focus where the card went (see onDragEnd), not back on where it came from.
          restoreFocus: false,
          screenReaderInstructions: {
            draggable:
              'To move this pick, press Space, then use the arrow keys to reach a cell; each cell says whether the drop is clean, a warning or a rule break. Press Space to drop, Escape to cancel.',
          },
        }}
        onDragStart={dragging.onDragStart}
        onDragEnd={dragging.onDragEnd}
        onDragCancel={dragging.onDragCancel}
      >
        <div className="flex h-[calc(100dvh-13rem)] min-h-[28rem] overflow-hidden rounded-lg border border-ink-200 bg-chalk-100">
          <div
            ref={scrollRef}
            id="board-grid"
            tabIndex={-1}
            onFocus={onGridFocus}
            // Cells brought into view land clear of the sticky names and week headings.
            style={{ scrollPaddingLeft: NAME_WIDTH + 8, scrollPaddingTop: 60 }}
            className="min-w-0 flex-1 overflow-auto"
            data-board-scroll
          >
            <BoardGrid
              model={model}
              rows={rows}
              readOnly={phone}
              compact={compact}
              ratings={dragging.shownRatings}
              pending={pending}
              flagged={flaggedKeys}
              onOpen={openDetails}
              scrollRef={scrollRef}
              shownRef={shownRef}
            />
          </div>
          {libraryOpen ? <LibraryDrawer variants={model.data.variants} /> : null}
        </div>
        <DragOverlay dropAnimation={null} className={OVERLAY_CLASS} style={{ pointerEvents: 'none' }}>
          {dragged ? (
            <div className="w-36 rotate-1 rounded-md border-2 border-ink-800 bg-chalk-50 px-2 py-1.5 text-sm font-semibold text-ink-900 shadow-xl">
              {dragged.name}
              <span className="block text-xs font-normal text-ink-600">
                {dragged.lift} · {dragged.family}
              </span>
            </div>
          ) : null}
        </DragOverlay>
      </DndContext>
      <TrainingCaution className="mt-3" />
      {ask ? (
        <ReasonDialog
          ask={ask.ask}
          saving={saveMutation.isPending}
          onCancel={() => dispatch({ type: 'ask', ask: null })}
          onSubmit={(reason) => {
            const a = ask;
            dispatch({ type: 'ask', ask: null });
            const changes = a.changes.map((c) => (a.breakKeys.has(keyOf(c)) ? { ...c, reason, pinned: true } : c));
            void save(changes, a.label, a.undoable);
          }}
        />
      ) : null}
      {detailCell && details ? (
        <CellDetails
          model={model}
          cell={detailCell}
          label={cellLabel(model, detailCell)}
          entry={detailEntry}
          variant={detailEntry?.variantId != null ? model.variantById.get(detailEntry.variantId) : undefined}
          review={reviewOf(model, details)}
          editable={!phone && detailCell.week >= model.editableFrom}
          onApply={(variantId, status, why, reason) => applyAlternative(detailCell, variantId, status, why, reason)}
          onClose={() => setDetails(null)}
          extras={cellExtras?.(detailCell, cellLabel(model, detailCell))}
          onClear={() => {
            setDetails(null);
            if (detailEntry) {
              void save(
                [{ ...detailCell, variantId: null, version: detailEntry.version }],
                `clear ${labelOf(detailCell)}`,
                true,
              );
            }
          }}
        />
      ) : null}
    </section>
  );
}
