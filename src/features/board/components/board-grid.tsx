// The board's grid: a row per athlete, a column per week (past weeks greyed, this week marked), a slot
// target per max-effort slot in every cell, and the athlete's joint-load strip under the week columns.
// Rows have one fixed height, and only the rows in and near the scrolled view are in the document, so a
// big team draws and drags as fast as a small one.
import { memo, useEffect, useLayoutEffect, useMemo, useState, type RefObject } from 'react';
import { SortableContext } from '@dnd-kit/sortable';
import { BreakIcon, CleanIcon, WarningIcon } from '../../../components/ui/icons';
import { restrictionTag } from '../../../../shared/planning/words';
import { BOARD_DATA_MARK } from '../api/queries';
import type { BoardAthlete } from '../../../../shared/schemas';
import { cellKey, type AthleteView, type BoardModel, type CellKey, type Ratings } from '../model/board-model';
import { cellDndId } from '../model/dnd';
import { reviewOf } from '../model/review';
import { jointWords, percent, shortWeek, weekStart } from '../model/words';
import { JointBars, loadState } from './joint-strip';
import { RestWeekControl } from './rest-week-control';
import { EditableSlot, PastSlot } from './slot-target';

/** Column widths in px: fixed, so rows line up and the view can be placed without measuring. */
export const NAME_WIDTH = 208;
export const WEEK_WIDTH = 144;

/** Cells stay where they are while dragging; the drag preview moves instead. */
const noSorting = () => null;

export const BOARD_DRAWN_MARK = 'board:drawn';
/** Snapshot arrival → grid committed to the document. */
export const BOARD_RENDER_MEASURE = 'board:render';
/** Snapshot arrival → the first frame after the commit has been laid out and painted. */
export const BOARD_PAINT_MEASURE = 'board:paint';

/**
 * Every athlete row has the same height (its slots and the joint strip), so rows far off screen can be
 * left out of the document and replaced by one spacer of the right height.
 */
export const rowHeight = (slots: number, compact = false) => (compact ? 12 + 40 * slots : 80 + 62 * slots); // 24 of it for the rest-week line, 12 for joint names
const HEAD_HEIGHT = 52;
/** Rows kept in the document beyond the visible ones, above and below (px). */
const OVERSCAN = 200;

/** Which rows [start, end) the scrolled view needs, with some to spare on both sides. */
export function rowWindow(scrollTop: number, height: number, rows: number, rowH: number): [number, number] {
  const start = Math.max(0, Math.floor((scrollTop - HEAD_HEIGHT - OVERSCAN) / rowH));
  const end = Math.min(rows, Math.ceil((scrollTop + height + OVERSCAN) / rowH));
  return [Math.min(start, end), end];
}

function useRowWindow(scrollRef: RefObject<HTMLElement | null>, rows: number, rowH: number): [number, number] {
  const [view, setView] = useState(() => ({
    top: 0,
    height: typeof window === 'undefined' ? 900 : window.innerHeight,
  }));
  useEffect(() => {
    const box = scrollRef.current;
    if (!box) return;
    let frame = 0;
    const read = () => {
      frame = 0;
      setView((v) =>
        v.top === box.scrollTop && v.height === box.clientHeight ? v : { top: box.scrollTop, height: box.clientHeight },
      );
    };
    const onScroll = () => {
      if (!frame) frame = requestAnimationFrame(read);
    };
    const resize = new ResizeObserver(onScroll);
    resize.observe(box);
    box.addEventListener('scroll', onScroll, { passive: true });
    return () => {
      box.removeEventListener('scroll', onScroll);
      resize.disconnect();
      cancelAnimationFrame(frame);
    };
  }, [scrollRef]);
  const [start, end] = rowWindow(view.top, view.height, rows, rowH);
  return useMemo(() => [start, end], [start, end]);
}

interface GridProps {
  model: BoardModel;
  /** The athletes whose rows are shown (all of them, or those the filters keep), in board order. */
  rows: readonly BoardAthlete[];
  /** On a phone: nothing to drop on, cells only open their details. */
  readOnly: boolean;
  /** Compact rows: one line per pick, no joint strip or rest-week line, so more athletes fit on screen. */
  compact: boolean;
  ratings: Ratings | null;
  pending: ReadonlySet<CellKey>;
  /** Cells whose status the last save changed. */
  flagged: ReadonlySet<CellKey>;
  onOpen: (key: CellKey) => void;
  scrollRef: RefObject<HTMLElement | null>;
  /** Told which athletes' rows are in the document, so a drag can rate those cells first. */
  shownRef: RefObject<number[]>;
}

export const BoardGrid = memo(function BoardGrid({
  model,
  rows,
  readOnly,
  compact,
  ratings,
  pending,
  flagged,
  onOpen,
  scrollRef,
  shownRef,
}: GridProps) {
  // Time from the snapshot's arrival to the grid being in the document, and to its first painted frame.
  useLayoutEffect(() => {
    const arrived = performance.getEntriesByName(BOARD_DATA_MARK).at(-1)?.startTime;
    if (arrived === undefined) return;
    performance.mark(BOARD_DRAWN_MARK);
    performance.measure(BOARD_RENDER_MEASURE, { start: arrived, end: BOARD_DRAWN_MARK });
    performance.clearMarks(BOARD_DATA_MARK);
    // A task queued from the next animation frame runs once that frame has been painted.
    requestAnimationFrame(() => setTimeout(() => performance.measure(BOARD_PAINT_MEASURE, { start: arrived })));
  }, [model]);

  const rowH = rowHeight(model.slots.length, compact);
  const [start, end] = useRowWindow(scrollRef, rows.length, rowH);
  const shown = rows.slice(start, end);
  useEffect(() => {
    shownRef.current = rows.slice(start, end).map((a) => a.id);
  }, [rows, start, end, shownRef]);
  const targetIds = useMemo(() => {
    const ids = new Set(shown.map((a) => a.id));
    return model.targets.filter((t) => ids.has(t.athleteId)).map(cellDndId);
    // `shown` is derived from these three.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [model.targets, rows, start, end]);

  const current = model.data.currentWeek;
  const cols = model.weeks.length + 1;
  return (
    <SortableContext id="board" items={targetIds} strategy={noSorting}>
      <table
        data-compact={compact}
        className="group/board w-max table-fixed border-separate border-spacing-0 text-left"
        aria-rowcount={rows.length + 1}
      >
        <caption className="sr-only">
          Plan by athlete and week. Past weeks are read-only; drag a card from the library or from another cell onto a
          slot to change it.
        </caption>
        <colgroup>
          <col style={{ width: NAME_WIDTH }} />
          {model.weeks.map((w) => (
            <col key={w} style={{ width: WEEK_WIDTH }} />
          ))}
        </colgroup>
        <thead>
          <tr aria-rowindex={1} style={{ height: HEAD_HEIGHT }}>
            <th
              scope="col"
              className="sticky left-0 top-0 z-30 border-b border-ink-300 bg-chalk-100 px-2 py-2 text-sm font-semibold text-ink-700"
            >
              Athlete
            </th>
            {model.weeks.map((w) => {
              const past = w < current;
              const now = w === current;
              return (
                <th
                  key={w}
                  scope="col"
                  aria-current={now ? 'date' : undefined}
                  className={`sticky top-0 z-20 border-b px-2 py-1.5 text-sm ${
                    now
                      ? 'border-b-2 border-rust-500 bg-chalk-50 text-ink-900'
                      : past
                        ? 'border-ink-300 bg-chalk-200 text-ink-500'
                        : 'border-ink-300 bg-chalk-100 text-ink-800'
                  }`}
                >
                  <span className="block font-bold">{shortWeek(w)}</span>
                  <span className="block text-xs font-normal">
                    {now ? <span className="font-semibold text-rust-600">This week · </span> : null}
                    {past ? 'Done · ' : null}
                    from {weekStart(w)}
                  </span>
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={cols} className="sticky left-0 p-4 text-ink-700">
                No athlete matches these filters.
              </td>
            </tr>
          ) : null}
          {start > 0 ? (
            <tr aria-hidden style={{ height: start * rowH }}>
              <td colSpan={cols} />
            </tr>
          ) : null}
          {shown.map((athlete, i) => (
            <AthleteRow
              key={athlete.id}
              index={start + i}
              height={rowH}
              view={model.view(athlete.id)}
              model={model}
              ratings={ratings}
              pending={pending}
              flagged={flagged}
              readOnly={readOnly}
              onOpen={onOpen}
            />
          ))}
          {end < rows.length ? (
            <tr aria-hidden style={{ height: (rows.length - end) * rowH }}>
              <td colSpan={cols} />
            </tr>
          ) : null}
        </tbody>
      </table>
    </SortableContext>
  );
});

function PeakLine({ view }: { view: AthleteView }) {
  const p = view.peak;
  if (!p) return null;
  const state = loadState(p.ratio);
  const Icon = state === 'breach' ? BreakIcon : state === 'caution' ? WarningIcon : CleanIcon;
  const tone = state === 'breach' ? 'text-breach-700' : state === 'caution' ? 'text-caution-700' : 'text-clean-700';
  return (
    <span className={`mt-1 flex items-center gap-1 text-xs group-data-[compact=true]/board:hidden ${tone}`}>
      <Icon width={13} height={13} />
      Peak load: {jointWords(p.joint)} {percent(p.ratio)} ({shortWeek(p.week)})
    </span>
  );
}

interface RowProps {
  index: number;
  height: number;
  view: AthleteView;
  model: BoardModel;
  ratings: Ratings | null;
  pending: ReadonlySet<CellKey>;
  flagged: ReadonlySet<CellKey>;
  readOnly: boolean;
  onOpen: (key: CellKey) => void;
}

const AthleteRow = memo(function AthleteRow({
  index,
  height,
  view,
  model,
  ratings,
  pending,
  flagged,
  readOnly,
  onOpen,
}: RowProps) {
  const a = view.athlete;
  const current = model.data.currentWeek;
  return (
    <tr className="align-top" aria-rowindex={index + 2} style={{ height }}>
      <th
        scope="row"
        tabIndex={-1}
        data-athlete={a.id}
        className="sticky left-0 z-10 overflow-hidden border-b border-r border-ink-200 bg-chalk-50 px-2 py-2 text-left font-normal"
      >
        <span className="block font-semibold text-ink-900">{a.name}</span>
        {a.meet ? (
          <span className="mt-0.5 block text-xs text-ink-600">
            Meet {shortWeek(a.meet.week)}: {a.meet.name}
          </span>
        ) : null}
        {a.restrictions.map((r) => (
          <span
            key={`${restrictionTag(r)}${r.fromDate}`}
            className="mr-1 mt-0.5 inline-flex items-center gap-0.5 rounded bg-caution-100 px-1 text-[11px] font-semibold text-caution-700"
            title={r.note ?? undefined}
          >
            <WarningIcon width={11} height={11} />
            {restrictionTag(r)}
          </span>
        ))}
        <PeakLine view={view} />
        {view.loads[0]?.length ? (
          <span
            className="absolute bottom-1.5 left-2 group-data-[compact=true]/board:hidden text-[10px] font-semibold uppercase tracking-wide text-ink-500"
            title={`Bars per week, left to right: ${view.loads[0].map((p) => jointWords(p.joint)).join(', ')}; the line is the budget`}
          >
            Joint load ▸
          </span>
        ) : null}
      </th>
      {model.weeks.map((week, wi) => {
        const past = week < current;
        return (
          <td
            key={week}
            className={`space-y-2 border-b border-ink-200 px-1 pb-1 pt-2 group-data-[compact=true]/board:space-y-1 group-data-[compact=true]/board:pt-1 ${
              past
                ? 'bg-chalk-200/70'
                : week === current
                  ? 'border-x-2 border-x-rust-300/70 bg-chalk-50'
                  : 'bg-chalk-100'
            }`}
          >
            <div className="group-data-[compact=true]/board:hidden">
              <RestWeekControl athlete={a} week={week} editable={!past && !readOnly} />
            </div>
            {model.slots.map((slot) => {
              const key = cellKey(a.id, week, slot.id);
              const entry = model.entryAt.get(key);
              const props = {
                athleteId: a.id,
                week,
                slotId: slot.id,
                cellKey: key,
                label: `${a.name} · ${week} · ${slot.label}`,
                slotLabel: slot.label,
                entry,
                variant: entry?.variantId != null ? model.variantById.get(entry.variantId) : undefined,
                review: past ? undefined : reviewOf(model, key),
                flagged: flagged.has(key),
                onOpen,
              };
              return past || readOnly ? (
                <PastSlot key={slot.id} {...props} past={past} />
              ) : (
                <EditableSlot key={slot.id} {...props} rating={ratings?.get(key)} pending={pending.has(key)} />
              );
            })}
            <div className="group-data-[compact=true]/board:hidden">
              <JointBars points={view.loads[wi] ?? []} week={week} />
            </div>
          </td>
        );
      })}
    </tr>
  );
});
