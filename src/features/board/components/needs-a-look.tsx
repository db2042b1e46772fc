// "Needs a look": every pick with a warning or a rule break in the weeks just planned, and every cell a
// save turned, each a link that takes the coach to the cell. Fixed cells drop off the list as the board
// changes.
import { BreakIcon, WarningIcon } from '../../../components/ui/icons';
import { Button } from '../../../components/ui/button';
import { cellLabel, type BoardModel, type CellKey } from '../model/board-model';
import type { CellReview } from '../model/review';

export function NeedsALook({
  items,
  model,
  weeks,
  onGo,
  onClose,
}: {
  items: CellReview[];
  model: BoardModel;
  /** What the list covers, as the coach reads it ("2026-W50"). */
  weeks: string;
  onGo: (key: CellKey) => void;
  onClose: () => void;
}) {
  const breaks = items.filter((i) => i.status === 'break').length;
  return (
    <section
      aria-labelledby="needs-a-look-title"
      className="mb-3 rounded-md border-2 border-caution-600 bg-chalk-50 p-3 text-sm"
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 id="needs-a-look-title" className="font-bold text-ink-900">
            Needs a look ({items.length})
          </h2>
          <p className="text-ink-700">
            {items.length === 0
              ? `Nothing needs a look in ${weeks}: every pick there is within the rules with room to spare.`
              : `${weeks}: ${breaks} ${breaks === 1 ? 'pick breaks' : 'picks break'} a rule, ${items.length - breaks} worth a look. Open one to see what fits there.`}
          </p>
        </div>
        <Button variant="ghost" size="sm" onClick={onClose}>
          Hide list
        </Button>
      </div>
      {items.length ? (
        <ul className="mt-2 max-h-56 space-y-1 overflow-y-auto">
          {items.map((i) => {
            const variant = model.variantById.get(i.variantId)?.name ?? `variant ${i.variantId}`;
            const breaksRule = i.status === 'break';
            return (
              <li key={i.key}>
                <a
                  href={`#cell-${i.key}`}
                  data-look={i.key}
                  data-status={i.status}
                  data-explained={i.explained ? true : undefined}
                  onClick={(e) => {
                    e.preventDefault();
                    onGo(i.key);
                  }}
                  className="flex items-start gap-1.5 rounded px-1 py-0.5 text-ink-900 underline-offset-2 hover:bg-chalk-200 hover:underline"
                >
                  {breaksRule ? (
                    <BreakIcon width={14} height={14} className="mt-0.5 shrink-0 text-breach-700" />
                  ) : (
                    <WarningIcon width={14} height={14} className="mt-0.5 shrink-0 text-caution-700" />
                  )}
                  <span>
                    <span className="font-semibold">{cellLabel(model, i.cell)}</span>: {variant} —{' '}
                    <span className={breaksRule ? 'text-breach-700' : 'text-caution-700'}>
                      {breaksRule ? (i.explained ? 'breaks a rule (reason given)' : 'breaks a rule') : 'worth a look'}
                    </span>
                    <span className="block text-xs text-ink-700">{i.reasons[0]}</span>
                  </span>
                </a>
              </li>
            );
          })}
        </ul>
      ) : null}
    </section>
  );
}
