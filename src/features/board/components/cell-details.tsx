// A cell's pick in full: who chose it and why, the rules it breaks, what else fits the cell (one click to
// use it), every change to the cell, and clearing it.
import type { ReactNode } from 'react';
import type { BoardVariant, PlanEntryDto } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { WarningIcon } from '../../../components/ui/icons';
import { useCellHistory } from '../api/queries';
import type { BoardModel, CellRef } from '../model/board-model';
import type { CellReview } from '../model/review';
import { WhatFitsHere } from './what-fits-here';

const stamp = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

function when(iso: string): string {
  return stamp.format(new Date(iso));
}

export function CellDetails({
  model,
  cell,
  label,
  entry,
  variant,
  review,
  editable,
  onApply,
  onClear,
  onClose,
  extras,
}: {
  model: BoardModel;
  cell: CellRef;
  label: string;
  entry: PlanEntryDto | undefined;
  variant: BoardVariant | undefined;
  review: CellReview | undefined;
  editable: boolean;
  onApply: (variantId: number, status: 'clean' | 'warning' | 'break', reasons: string[], reason?: string) => void;
  onClear: () => void;
  onClose: () => void;
  /** More sections from the page (messages about this athlete's week). */
  extras?: ReactNode;
}) {
  const history = useCellHistory(cell);
  const breaks = review?.status === 'break';
  return (
    <Dialog open title={variant?.name ?? 'Empty slot'} description={label} onClose={onClose} size="md">
      {entry && variant ? (
        <dl className="mt-3 grid grid-cols-[8rem_1fr] gap-x-3 gap-y-1 text-sm">
          <dt className="font-semibold text-ink-700">Picked by</dt>
          <dd>
            {entry.source === 'engine' ? 'The engine' : 'A coach'}
            {entry.pinned ? ' (pinned: the engine keeps it as it is)' : ''}
          </dd>
          {entry.reason ? (
            <>
              <dt className="font-semibold text-ink-700">Coach's reason</dt>
              <dd>{entry.reason}</dd>
            </>
          ) : null}
          <dt className="font-semibold text-ink-700">Variant</dt>
          <dd>
            {variant.lift} · {variant.family} · {variant.bar} bar · risk {variant.risk} · top {variant.scheme}
          </dd>
          {entry.updatedByName ? (
            <>
              <dt className="font-semibold text-ink-700">Last change</dt>
              <dd>
                {entry.updatedByName}, {when(entry.updatedAt)}
              </dd>
            </>
          ) : null}
        </dl>
      ) : null}
      {review && review.status !== 'clean' ? (
        <div
          className={`mt-3 rounded-md border p-2 text-sm ${
            breaks ? 'border-breach-600/40 bg-breach-100' : 'border-caution-600/40 bg-caution-100'
          }`}
        >
          <p className={`flex items-center gap-1 font-semibold ${breaks ? 'text-breach-700' : 'text-caution-700'}`}>
            <WarningIcon width={16} height={16} /> {breaks ? 'Breaks a rule' : 'Worth a look'}
          </p>
          <ul className="mt-1 list-disc pl-5">
            {review.reasons.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {editable ? <WhatFitsHere model={model} cell={cell} onApply={onApply} /> : null}
      {entry?.reasons.length ? (
        <div className="mt-3 text-sm">
          <p className="font-semibold text-ink-700">Why this pick</p>
          <ul className="mt-1 list-disc pl-5 text-ink-800">
            {entry.reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </div>
      ) : null}
      <section className="mt-4" aria-label="Changes to this cell">
        <h3 className="text-sm font-semibold text-ink-700">Changes</h3>
        {history.isPending ? (
          <p className="text-sm text-ink-500">Loading…</p>
        ) : history.data?.items.length ? (
          <ol className="mt-1 max-h-48 space-y-1 overflow-y-auto text-sm">
            {history.data.items.map((h) => (
              <li key={h.id} className="border-b border-ink-200 pb-1">
                <span className="font-semibold">{h.newVariantName ?? 'cleared'}</span>
                {h.oldVariantName ? <span className="text-ink-600"> (was {h.oldVariantName})</span> : null}
                <span className="block text-xs text-ink-500">
                  {h.source === 'engine' ? 'engine' : 'coach'}
                  {h.pinned ? ', pinned' : ''} · {h.changedByName ?? 'someone'} · {when(h.changedAt)}
                  {h.reason ? ` · “${h.reason}”` : ''}
                </span>
              </li>
            ))}
          </ol>
        ) : (
          <p className="text-sm text-ink-500">No changes yet.</p>
        )}
      </section>
      {extras ? <div className="mt-4">{extras}</div> : null}
      <div className="mt-4 flex justify-end gap-2">
        {editable && entry?.variantId != null ? (
          <Button variant="danger" onClick={onClear}>
            Clear cell
          </Button>
        ) : null}
        <Button variant="secondary" onClick={onClose}>
          Close
        </Button>
      </div>
    </Dialog>
  );
}
