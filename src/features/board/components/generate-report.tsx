// What the last Fill / Plan to meet / Reshuffle did: what was filled, what was swapped and why, and what
// could not be filled and why.
import type { ReactNode } from 'react';
import type { GenerateResult } from '../../../../shared/schemas';
import { BreakIcon, CleanIcon, WarningIcon } from '../../../components/ui/icons';
import { Button } from '../../../components/ui/button';
import { cellLabel, type BoardModel, type CellRef } from '../model/board-model';
import { RULE_WORDS } from '../model/words';

const TONES = {
  clean: { Icon: CleanIcon, text: 'text-clean-700' },
  caution: { Icon: WarningIcon, text: 'text-caution-700' },
  breach: { Icon: BreakIcon, text: 'text-breach-700' },
};

function Section({
  tone,
  title,
  count,
  open,
  children,
}: {
  tone: keyof typeof TONES;
  title: string;
  count: number;
  open: boolean;
  children: ReactNode;
}) {
  const { Icon, text } = TONES[tone];
  return (
    <details open={open}>
      <summary className={`flex cursor-pointer items-center gap-1 font-semibold ${text}`}>
        <Icon width={15} height={15} /> {title} ({count})
      </summary>
      <ul className="mt-1 max-h-48 space-y-1 overflow-y-auto">{children}</ul>
    </details>
  );
}

function Line({ cell, model, what, why }: { cell: CellRef; model: BoardModel; what: ReactNode; why?: ReactNode }) {
  return (
    <li>
      <span className="font-semibold">{cellLabel(model, cell)}:</span> {what}
      {why ? <span className="block text-xs text-ink-600">{why}</span> : null}
    </li>
  );
}

export function GenerateReport({
  title,
  result,
  model,
  onClose,
}: {
  title: string;
  result: GenerateResult;
  model: BoardModel;
  onClose: () => void;
}) {
  const name = (id: number) => model.athleteById.get(id)?.name ?? `Athlete ${id}`;
  const variant = (id: number | null) =>
    id === null ? 'nothing' : (model.variantById.get(id)?.name ?? `variant ${id}`);
  const filled = result.changes.filter((c) => c.entry.variantId !== null && !c.swap);
  const swapped = result.changes.filter((c) => c.swap);
  const weeks =
    result.weeks.length === 0
      ? 'no weeks'
      : result.weeks.length === 1
        ? result.weeks[0]
        : `${result.weeks[0]} to ${result.weeks[result.weeks.length - 1]}`;
  return (
    <section aria-label="Plan run" className="mb-3 rounded-md border border-ink-300 bg-chalk-50 p-3 text-sm">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 className="font-bold text-ink-900">
            {title}: {weeks}
          </h2>
          <p role="status" className="text-ink-700">
            {filled.length} filled · {swapped.length} swapped · {result.unfilled.length} could not be filled ·{' '}
            {result.kept} kept as they were
          </p>
        </div>
        <Button variant="ghost" size="sm" onClick={onClose}>
          Close report
        </Button>
      </div>
      <div className="mt-2 grid gap-3 md:grid-cols-3">
        <Section tone="clean" title="Filled" count={filled.length} open={filled.length <= 8}>
          {filled.map((c) => (
            <Line
              key={c.entry.id}
              cell={c.entry}
              model={model}
              what={variant(c.entry.variantId)}
              why={c.entry.reasons.join('; ')}
            />
          ))}
        </Section>
        <Section tone="caution" title="Swapped" count={swapped.length} open>
          {swapped.map((c) => (
            <Line
              key={c.entry.id}
              cell={c.entry}
              model={model}
              what={`${variant(c.swap!.from)} → ${variant(c.entry.variantId)}`}
              why={`because of the ${RULE_WORDS[c.swap!.rule]} rule. ${c.entry.reasons[0] ?? ''}`}
            />
          ))}
          {swapped.length === 0 ? <li className="text-ink-500">Nothing had to change.</li> : null}
        </Section>
        <Section tone="breach" title="Not filled" count={result.unfilled.length} open>
          {result.unfilled.map((u) => (
            <Line
              key={`${u.athleteId}|${u.week}|${u.slotId}`}
              cell={u}
              model={model}
              what={`no variant fits (${u.blockedBy.map((r) => RULE_WORDS[r]).join(', ')})`}
              why={u.dropped ? `${variant(u.dropped.variantId)} was taken out: ${u.dropped.message}` : undefined}
            />
          ))}
          {result.unfilled.length === 0 ? <li className="text-ink-500">Every cell was filled.</li> : null}
          {result.skipped.map((s) => (
            <li key={`skip${s.athleteId}`} className="text-ink-600">
              {name(s.athleteId)} left out: {s.reason}
            </li>
          ))}
        </Section>
      </div>
    </section>
  );
}
