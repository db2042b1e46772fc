// One max-effort slot of one athlete in one week: a labelled drop target holding the pick's card, and,
// while something is dragged, whether dropping it here is clean, a warning or a rule break, and why.
import { memo, useCallback, useMemo, type HTMLAttributes } from 'react';
import { useSortable } from '@dnd-kit/sortable';
import type { DraggableAttributes, DraggableSyntheticListeners } from '@dnd-kit/core';
import type { BoardVariant, PlanEntryDto } from '../../../../shared/schemas';
import { BreakIcon, CleanIcon, PinIcon, WarningIcon } from '../../../components/ui/icons';
import type { CellKey, DropRating, DropStatus } from '../model/board-model';
import type { CellReview } from '../model/review';
import { DROP_ATTR, cellDndId } from '../model/dnd';
import { STATUS_WORDS, shortSlot } from '../model/words';

export interface SlotProps {
  athleteId: number;
  week: string;
  slotId: string;
  cellKey: CellKey;
  /** "<athlete> · <ISO week> · <slot>", the drop target's accessible name. */
  label: string;
  slotLabel: string;
  entry: PlanEntryDto | undefined;
  variant: BoardVariant | undefined;
  /** The pick's own status where it stands: its badge, distinct from the athlete's restriction chips. */
  review: CellReview | undefined;
  /** A save elsewhere changed this cell's status. */
  flagged?: boolean;
  rating: DropRating | undefined;
  pending: boolean;
  onOpen: (key: CellKey) => void;
}

const STATUS_STYLE: Record<DropStatus, string> = {
  clean: 'border-clean-600 bg-clean-100',
  warning: 'border-caution-600 bg-caution-100',
  break: 'border-breach-600 bg-breach-100',
  wrongLift: 'border-ink-300 bg-chalk-200',
  source: 'border-dashed border-ink-400 bg-chalk-100',
};

const STATUS_TEXT: Record<DropStatus, string> = {
  clean: 'text-clean-700',
  warning: 'text-caution-700',
  break: 'text-breach-700',
  wrongLift: 'text-ink-500',
  source: 'text-ink-600',
};

function StatusIcon({ status, className }: { status: DropStatus; className?: string }) {
  if (status === 'clean') return <CleanIcon width={14} height={14} className={className} />;
  if (status === 'warning') return <WarningIcon width={14} height={14} className={className} />;
  if (status === 'break' || status === 'wrongLift') return <BreakIcon width={14} height={14} className={className} />;
  return null;
}

function RatingBadge({ rating }: { rating: DropRating }) {
  return (
    <span
      className={`pointer-events-none absolute -top-2 right-1 z-10 inline-flex items-center gap-0.5 rounded border border-current bg-chalk-50 px-1 text-[10px] font-semibold leading-[14px] ${STATUS_TEXT[rating.status]}`}
    >
      <StatusIcon status={rating.status} />
      {STATUS_WORDS[rating.status]}
    </span>
  );
}

/** The reasons for the cell under the pointer. */
function Reasons({ rating }: { rating: DropRating }) {
  const lines = [...rating.breaks, ...rating.warnings];
  const head =
    rating.status === 'clean'
      ? 'Clean: within every rule'
      : rating.status === 'warning'
        ? 'Warning: allowed, but worth a look'
        : rating.status === 'break'
          ? 'Breaks a rule: you will be asked why'
          : rating.status === 'wrongLift'
            ? 'Wrong lift for this slot'
            : 'The pick being moved';
  return (
    <div className="pointer-events-none absolute bottom-full left-0 z-40 mb-1 w-64 rounded-md bg-ink-900 p-2 text-xs text-chalk-50 shadow-lg">
      <p className="flex items-center gap-1 font-semibold">
        <StatusIcon status={rating.status} />
        {head}
      </p>
      {lines.length ? (
        <ul className="mt-1 list-disc space-y-0.5 pl-4">
          {rating.breaks.map((r) => (
            <li key={`b${r}`} className="text-rust-300">
              {r}
            </li>
          ))}
          {rating.warnings.map((r) => (
            <li key={`w${r}`}>{r}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

interface CardProps {
  slotShort: string;
  variant: BoardVariant;
  entry: PlanEntryDto;
  review: CellReview | undefined;
  past: boolean;
  handle?:
    | {
        setRef: (el: HTMLElement | null) => void;
        listeners: DraggableSyntheticListeners;
        attributes: DraggableAttributes;
      }
    | undefined;
  onOpen: () => void;
}

/** The pick: a button named after the variant, showing who chose it and any rule it breaks. */
/** The pick's own badge: an outlined tag on the card (restriction chips are filled, in the row header). */
function PickBadge({ review }: { review: CellReview }) {
  const breaks = review.status === 'break';
  return (
    <span
      data-pick-status={review.status}
      className={`inline-flex items-center gap-0.5 rounded-sm border border-current px-0.5 ${
        breaks ? 'text-breach-700' : 'text-caution-700'
      }`}
      title={review.reasons.join('\n')}
    >
      {breaks ? <BreakIcon width={10} height={10} /> : <WarningIcon width={10} height={10} />}
      {breaks ? 'Breaks rule' : 'Check'}
    </span>
  );
}

function PlanCard({ slotShort, variant, entry, review, past, handle, onOpen }: CardProps) {
  const flaggedStatus = review && review.status !== 'clean' ? review : undefined;
  const coach = entry.source === 'coach';
  const sourceText = coach ? (entry.pinned ? 'Coach pick, pinned' : 'Coach pick') : 'Engine pick';
  const attrs: HTMLAttributes<HTMLButtonElement> = handle ? { ...handle.attributes, ...handle.listeners } : {};
  return (
    <>
      <button
        type="button"
        ref={handle?.setRef}
        {...attrs}
        aria-label={variant.name}
        aria-description={`${sourceText}${entry.reason ? `: ${entry.reason}` : ''}.${
          flaggedStatus
            ? ` ${flaggedStatus.status === 'break' ? 'Breaks a rule' : 'Worth a look'}: ${flaggedStatus.reasons.join('; ')}.`
            : ''
        }`}
        aria-roledescription={handle ? 'movable pick' : undefined}
        onClick={onOpen}
        className={`flex h-full w-full flex-col overflow-hidden rounded border px-1.5 py-[3px] text-left ${
          past
            ? 'border-ink-200 bg-chalk-100 text-ink-500'
            : coach
              ? 'border-rust-300 bg-chalk-50'
              : 'border-ink-200 bg-chalk-50'
        } ${handle ? 'cursor-grab touch-manipulation hover:border-ink-500 active:cursor-grabbing' : ''}`}
      >
        <span
          className={`line-clamp-2 text-[12.5px] group-data-[compact=true]/board:line-clamp-1 font-semibold leading-[15px] ${past ? '' : 'text-ink-900'}`}
        >
          {variant.name}
        </span>
      </button>
      {/* Beside the button, not in it, so the button's name is the variant's name and nothing else (the
        description says who picked it and why it needs a look). */}
      <span
        aria-hidden
        className="pointer-events-none absolute bottom-[5px] left-2 flex group-data-[compact=true]/board:hidden items-center gap-x-1.5 whitespace-nowrap text-[10px] font-semibold uppercase leading-3 tracking-wide"
      >
        <span className="text-ink-500">{slotShort}</span>
        <span className={coach ? 'inline-flex items-center gap-0.5 text-rust-600' : 'text-ink-500'}>
          {coach && entry.pinned ? <PinIcon width={11} height={11} /> : null}
          {coach ? 'Coach' : 'Engine'}
        </span>
        {flaggedStatus ? <PickBadge review={flaggedStatus} /> : null}
      </span>
    </>
  );
}

interface BodyProps {
  slotLabel: string;
  entry: PlanEntryDto | undefined;
  variant: BoardVariant | undefined;
  review: CellReview | undefined;
  rating: DropRating | undefined;
  isOver: boolean;
  past: boolean;
  pending: boolean;
  handle: CardProps['handle'];
  onOpen: () => void;
}

const SlotBody = memo(function SlotBody({
  slotLabel,
  entry,
  variant,
  review,
  rating,
  isOver,
  past,
  pending,
  handle,
  onOpen,
}: BodyProps) {
  const slotShort = shortSlot(slotLabel);
  return (
    <>
      {entry && variant ? (
        <PlanCard
          slotShort={slotShort}
          variant={variant}
          entry={entry}
          review={review}
          past={past}
          handle={handle}
          onOpen={onOpen}
        />
      ) : (
        <span className="block h-full rounded border border-dashed border-ink-200 px-1.5 py-1.5 text-[11px] text-ink-600">
          <span className="font-semibold uppercase tracking-wide">{slotShort}</span> · {past ? 'no pick' : 'empty'}
        </span>
      )}
      {pending ? (
        <span className="pointer-events-none absolute bottom-1 right-1 rounded bg-ink-800 px-1 text-[10px] text-chalk-50">
          saving…
        </span>
      ) : null}
      {rating ? <RatingBadge rating={rating} /> : null}
      {rating && isOver ? <Reasons rating={rating} /> : null}
    </>
  );
});

const noop = () => undefined;

/** A slot in a past week, or any slot on a phone (where the board is read-only): shown, not a drop target. */
export const PastSlot = memo(function PastSlot(p: Omit<SlotProps, 'rating' | 'pending'> & { past?: boolean }) {
  const past = p.past ?? true;
  const open = () => p.onOpen(p.cellKey);
  return (
    <div
      role="group"
      aria-label={p.label}
      data-cell={p.cellKey}
      className="relative h-[54px] rounded-md border-2 border-transparent group-data-[compact=true]/board:h-9"
    >
      <SlotBody
        slotLabel={p.slotLabel}
        entry={p.entry}
        variant={p.variant}
        review={past ? undefined : p.review}
        rating={undefined}
        isOver={false}
        past={past}
        pending={false}
        handle={undefined}
        onOpen={p.entry ? open : noop}
      />
    </div>
  );
});

/** A slot that can still be planned: a drop target, and its pick can be dragged to another cell. */
export const EditableSlot = memo(function EditableSlot(p: SlotProps) {
  const { onOpen, cellKey } = p;
  const hasPick = !!p.entry && p.entry.variantId !== null && !!p.variant;
  const id = cellDndId(p);
  const { setDroppableNodeRef, setDraggableNodeRef, listeners, attributes, isOver } = useSortable({
    id,
    disabled: { draggable: !hasPick || p.pending, droppable: p.pending },
    // Cells do not change size while dragging; watching each one would cost more than it saves.
    resizeObserverConfig: { disabled: true },
  });
  // Stable props, so the body only redraws when this cell's own state changes, not on every drag move.
  const handle = useMemo(
    () => (hasPick ? { setRef: setDraggableNodeRef, listeners, attributes } : undefined),
    [hasPick, setDraggableNodeRef, listeners, attributes],
  );
  const open = useCallback(() => onOpen(cellKey), [onOpen, cellKey]);
  // Cells whose slot does not take the carried card's lift stay quiet, unless the card is right over one.
  const rating = p.rating?.status === 'wrongLift' && !isOver ? undefined : p.rating;
  return (
    <div
      ref={setDroppableNodeRef}
      {...{ [DROP_ATTR]: id }}
      role="group"
      aria-label={p.label}
      data-cell={p.cellKey}
      data-rating={rating?.status}
      data-over={isOver || undefined}
      data-flagged={p.flagged || undefined}
      className={`relative h-[54px] rounded-md border-2 group-data-[compact=true]/board:h-9 ${
        rating ? STATUS_STYLE[rating.status] : p.flagged ? 'border-caution-600 border-dashed' : 'border-transparent'
      } ${isOver ? 'ring-2 ring-ink-800' : ''}`}
    >
      <SlotBody
        slotLabel={p.slotLabel}
        entry={p.entry}
        variant={p.variant}
        review={p.review}
        rating={rating}
        isOver={isOver}
        past={false}
        pending={p.pending}
        handle={handle}
        onOpen={open}
      />
    </div>
  );
});
