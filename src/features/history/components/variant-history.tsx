// Records per variant, most recently trained first; each opens to its top sets.
import { LIFT_LABEL } from '../../../../shared/labels';
import { useState } from 'react';
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import type { TopSet, VariantHistory as VariantHistoryRow } from '../../../../shared/schemas';
import { useTopSets } from '../api/queries';

function setText(s: TopSet, unit: WeightUnit): string {
  return `${s.reps} × ${formatWeight(s.weightKg, unit, { decimals: 1 })}${s.rpe ? ` @ RPE ${s.rpe}` : ''}`;
}

function Sets({ variantId, athleteId, unit }: { variantId: number; athleteId?: number; unit: WeightUnit }) {
  const { data, error } = useTopSets({ variantId, ...(athleteId ? { athleteId } : {}) });
  if (error) return <p className="text-sm text-breach-700">{error.message}</p>;
  if (!data) return <p className="text-sm text-ink-500">Loading…</p>;
  return (
    <ol className="flex flex-col divide-y divide-ink-200 text-sm">
      {data.items.map((s) => (
        <li key={s.id} className="flex flex-wrap justify-between gap-x-3 py-1">
          <span className="text-ink-600">{s.performedOn}</span>
          <span className="font-semibold text-ink-900">{setText(s, unit)}</span>
          <span className="text-ink-700">e1RM {formatWeight(s.e1rmKg, unit, { decimals: 1 })}</span>
        </li>
      ))}
    </ol>
  );
}

export function VariantHistory({
  variants,
  unit,
  athleteId,
}: {
  variants: VariantHistoryRow[];
  unit: WeightUnit;
  athleteId?: number;
}) {
  const [open, setOpen] = useState<number | null>(null);
  return (
    <section aria-labelledby="variants-heading" className="flex flex-col gap-3">
      <h2 id="variants-heading" className="text-xl font-bold text-ink-900">
        History per variant
      </h2>
      {variants.length === 0 ? <p className="text-ink-600">No top sets logged yet.</p> : null}
      <ul className="flex flex-col gap-2">
        {variants.map((v) => {
          const expanded = open === v.variantId;
          const best = v.record.bestE1rm;
          return (
            <li key={v.variantId} className="rounded-lg border border-ink-200 bg-chalk-50">
              <button
                type="button"
                aria-expanded={expanded}
                onClick={() => setOpen(expanded ? null : v.variantId)}
                className="flex min-h-11 w-full flex-col items-start gap-1 px-3 py-2 text-left hover:bg-chalk-100"
              >
                <span className="font-semibold text-ink-900">{v.variantName}</span>
                <span className="text-sm text-ink-700">
                  {LIFT_LABEL[v.lift]} · {v.count} {v.count === 1 ? 'set' : 'sets'} · last {v.lastOn}
                  {best ? ` · best e1RM ${formatWeight(best.e1rmKg, unit, { decimals: 1 })}` : ''}
                  {v.record.heaviest ? ` · heaviest ${setText(v.record.heaviest, unit)}` : ''}
                </span>
              </button>
              {expanded ? (
                <div className="border-t border-ink-200 px-3 py-2">
                  <Sets variantId={v.variantId} unit={unit} {...(athleteId ? { athleteId } : {})} />
                </div>
              ) : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
