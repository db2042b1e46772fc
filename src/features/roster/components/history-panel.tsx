// The athlete's history of picks and results: every week's pick per slot with the top set done on it
// (read-only; picks change on the board).
import { useQuery } from '@tanstack/react-query';
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import type { AthleteHistory } from '../../../../shared/schemas';
import { PinIcon } from '../../../components/ui/icons';
import { Loading, Notice } from '../../../components/ui/page';
import { athleteHistoryOptions } from '../api/queries';
import { Panel } from './panel';

export function HistoryPanel({
  athleteId,
  unit,
  slotLabels,
}: {
  athleteId: number;
  unit: WeightUnit;
  slotLabels: Record<string, string>;
}) {
  const { data, error, isPending } = useQuery(athleteHistoryOptions(athleteId));
  return (
    <Panel title="History of picks and results" className="lg:col-span-2">
      {isPending ? <Loading /> : null}
      {error ? <Notice tone="error">{error.message}</Notice> : null}
      {data ? <HistoryBody h={data} unit={unit} slotLabels={slotLabels} /> : null}
    </Panel>
  );
}

function HistoryBody({
  h,
  unit,
  slotLabels,
}: {
  h: AthleteHistory;
  unit: WeightUnit;
  slotLabels: Record<string, string>;
}) {
  const setsByPick = new Map(h.topSets.map((s) => [`${s.week}:${s.variantId}`, s]));
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-600">
        Every week&apos;s pick per slot, newest first, with the top set done on it. Picks change on the board.
      </p>
      {/* Scrolls on its own, so it takes focus and the arrow keys can scroll it. */}
      <div
        tabIndex={0}
        role="region"
        aria-label="Pick history"
        className="max-h-[32rem] overflow-auto rounded-md border border-chalk-300"
      >
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Picks and top sets by week, newest first</caption>
          <thead className="sticky top-0 bg-chalk-200">
            <tr>
              {['Week', 'Slot', 'Variant', 'Picked by', 'Top set', 'e1RM'].map((h) => (
                <th key={h} scope="col" className="px-2 py-1.5">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {h.picks.length === 0 ? (
              <tr>
                <td colSpan={6} className="px-2 py-4 text-center text-ink-600">
                  Nothing planned yet.
                </td>
              </tr>
            ) : null}
            {h.picks.map((p) => {
              const set = p.variantId ? setsByPick.get(`${p.week}:${p.variantId}`) : undefined;
              return (
                <tr key={p.id} className="border-t border-chalk-300 align-top">
                  <td className="whitespace-nowrap px-2 py-1.5 tabular-nums">{p.week}</td>
                  <td className="px-2 py-1.5">{slotLabels[p.slotId] ?? p.slotId}</td>
                  <td className="px-2 py-1.5">
                    {p.variantName ?? <span className="text-ink-500">Empty</span>}
                    {p.variantArchived ? <span className="ml-1 text-xs text-ink-500">(archived)</span> : null}
                  </td>
                  <td className="px-2 py-1.5">
                    {p.source === 'coach' ? (
                      <span className="inline-flex items-center gap-1" title={p.reason ?? undefined}>
                        {p.pinned ? <PinIcon className="shrink-0" /> : null} Coach
                        {p.reason ? <span className="text-ink-600">: {p.reason}</span> : null}
                      </span>
                    ) : (
                      'Engine'
                    )}
                  </td>
                  <td className="whitespace-nowrap px-2 py-1.5">
                    {set
                      ? `${formatWeight(set.weightKg, unit)} × ${set.reps}${set.rpe ? ` @ RPE ${set.rpe}` : ''}`
                      : '—'}
                  </td>
                  <td className="whitespace-nowrap px-2 py-1.5 tabular-nums">
                    {set ? formatWeight(set.e1rmKg, unit, { decimals: 1 }) : '—'}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
