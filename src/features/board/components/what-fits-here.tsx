// "What fits here": the library ranked for one cell — clean, then worth a look, then breaks a rule, each
// with its reasons — and one click to put a variant in the cell. Says plainly when nothing clean fits.
import { useId, useMemo, useState } from 'react';
import { reasonField } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { BreakIcon, CleanIcon, WarningIcon } from '../../../components/ui/icons';
import type { BoardModel, CellRef } from '../model/board-model';
import { alternativesOf } from '../model/review';
import { RULE_WORDS } from '../model/words';

const LOOK = {
  clean: { Icon: CleanIcon, text: 'text-clean-700', word: 'Clean' },
  warning: { Icon: WarningIcon, text: 'text-caution-700', word: 'Worth a look' },
  break: { Icon: BreakIcon, text: 'text-breach-700', word: 'Breaks a rule' },
} as const;

export function WhatFitsHere({
  model,
  cell,
  onApply,
}: {
  model: BoardModel;
  cell: CellRef;
  /** `reason` is given for a variant that breaks a rule when the coach wrote one here first. */
  onApply: (variantId: number, status: 'clean' | 'warning' | 'break', reasons: string[], reason?: string) => void;
}) {
  const { items, summary } = useMemo(() => alternativesOf(model, cell), [model, cell]);
  const [reason, setReason] = useState('');
  const reasonId = useId();
  const valid = reasonField.safeParse(reason);
  return (
    <section className="mt-4" aria-labelledby="what-fits-title">
      <h3 id="what-fits-title" className="text-sm font-semibold text-ink-700">
        What fits here
      </h3>
      <p className="text-sm text-ink-700" role="note">
        {summary.clean > 0
          ? `${summary.clean} clean, ${summary.warning} worth a look, ${summary.break} break a rule.`
          : items.length === 0
            ? 'No variant in the library suits this slot.'
            : `Nothing clean fits here. ${summary.warning ? `${summary.warning} are within the rules but worth a look; ` : ''}${
                summary.blockedBy.length
                  ? `what blocks the rest: ${summary.blockedBy.map((b) => `${RULE_WORDS[b.rule]} (${b.count})`).join(', ')}.`
                  : ''
              }`}
      </p>
      {summary.break > 0 ? (
        <div className="mt-2">
          <label htmlFor={reasonId} className="block text-sm font-semibold text-ink-800">
            Reason to keep a pick that breaks a rule (optional)
          </label>
          <input
            id={reasonId}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            maxLength={500}
            className="mt-1 min-h-9 w-full rounded-md border border-ink-300 bg-chalk-50 px-2 text-sm text-ink-900"
            aria-describedby={`${reasonId}-hint`}
          />
          <p id={`${reasonId}-hint`} className="text-xs text-ink-700">
            With a reason here, “Use” keeps a rule-breaking variant as a pinned coach pick; without one you are asked.
          </p>
        </div>
      ) : null}
      <ol className="mt-2 max-h-72 space-y-1 overflow-y-auto" aria-label="Variants ranked for this cell">
        {items.map((item) => {
          const look = LOOK[item.status];
          return (
            <li
              key={item.variantId}
              data-alternative={item.status}
              className="flex items-start justify-between gap-2 rounded border border-ink-200 bg-chalk-50 px-2 py-1"
            >
              <div className="min-w-0 text-sm">
                <p className="font-semibold text-ink-900">
                  {item.name}
                  {item.current ? <span className="font-normal text-ink-700"> (in the cell now)</span> : null}
                </p>
                <p className={`flex items-center gap-1 text-xs font-semibold ${look.text}`}>
                  <look.Icon width={12} height={12} /> {look.word}
                </p>
                <ul className="text-xs text-ink-700">
                  {item.reasons.slice(0, 3).map((r) => (
                    <li key={r}>{r}</li>
                  ))}
                </ul>
              </div>
              {item.current ? null : (
                <Button
                  size="sm"
                  variant={item.status === 'clean' ? 'primary' : 'secondary'}
                  aria-label={`Use ${item.name}`}
                  onClick={() =>
                    onApply(
                      item.variantId,
                      item.status,
                      item.reasons,
                      item.status === 'break' && valid.success ? valid.data : undefined,
                    )
                  }
                >
                  Use
                </Button>
              )}
            </li>
          );
        })}
      </ol>
    </section>
  );
}
