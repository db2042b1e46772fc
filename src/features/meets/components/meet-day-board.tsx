// The Meet day screen's body: pick the lift, see each flight in lifting order, mark attempts. Marks go
// through the local queue, so a lost connection or a reload loses nothing.
import { useState } from 'react';
import { MEET_LIFTS, type MeetLift } from '../../../../shared/calc';
import type { MeetDay } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { WarningIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { useMarkQueue } from '../api/mark-queue';
import { LIFT_NAME, flightsOf, lifterView, liftingOrder, type LifterView } from './day-model';
import { LifterCard } from './lifter-card';

export function MeetDayBoard({ day }: { day: MeetDay }) {
  const queue = useMarkQueue(day.meet.id);
  const [lift, setLift] = useState<MeetLift>('squat');
  const [chosen, setChosen] = useState<Record<string, number | null>>({});
  const [records, setRecords] = useState<Record<string, boolean>>({});
  const closed = day.meet.resultsSavedAt !== null;
  const views = day.entries.map((e) => lifterView(day, e, queue.waiting));
  const slot = (v: LifterView) => `${v.entry.entryId}-${lift}-${v.offers[lift]?.attemptNo ?? 0}`;
  const chosenKg = (v: LifterView) => {
    const k = slot(v);
    return k in chosen ? chosen[k]! : (v.offers[lift]?.suggestedKg ?? null);
  };

  return (
    <div className="flex flex-col gap-4">
      <div role="status" aria-live="polite">
        {queue.waiting.length ? (
          <div className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-caution-600 bg-caution-100 p-3 text-base">
            <span className="flex items-center gap-2">
              <WarningIcon className="text-caution-700" />
              {queue.waiting.length === 1 ? '1 mark' : `${queue.waiting.length} marks`} kept on this device,{' '}
              {queue.offline ? 'waiting for the connection' : 'sending'}. They are safe through a reload.
            </span>
            <Button size="sm" variant="secondary" onClick={queue.sendNow}>
              Send now
            </Button>
          </div>
        ) : (
          <p className="text-sm text-ink-700">Every mark is saved.</p>
        )}
      </div>
      {queue.refused.length ? (
        <Notice tone="error">
          <span className="flex flex-col gap-1">
            {queue.refused.map((m, i) => (
              <span key={i}>{m}</span>
            ))}
            <Button size="sm" variant="ghost" onClick={queue.dismiss}>
              Dismiss
            </Button>
          </span>
        </Notice>
      ) : null}
      {closed ? (
        <Notice tone="info">The results are in the athletes’ histories; the attempts can no longer change.</Notice>
      ) : null}

      <div role="group" aria-label="Lift" className="grid grid-cols-3 gap-2">
        {MEET_LIFTS.map((l) => (
          <button
            key={l}
            type="button"
            aria-pressed={l === lift}
            onClick={() => setLift(l)}
            className={`min-h-14 rounded-md border-2 text-lg font-bold ${
              l === lift ? 'border-ink-900 bg-ink-900 text-chalk-50' : 'border-ink-300 bg-chalk-50 text-ink-900'
            }`}
          >
            {LIFT_NAME[l]}
          </button>
        ))}
      </div>

      {views.length === 0 ? <p className="text-ink-700">Nobody is entered in this meet yet.</p> : null}
      {flightsOf(views).map(([flight, list]) => (
        <section key={flight} aria-label={`Flight ${flight}`} className="flex flex-col gap-3">
          <h2 className="text-xl font-bold">
            Flight {flight} · {LIFT_NAME[lift]} · lifting order
          </h2>
          <ol className="flex flex-col gap-3">
            {liftingOrder(list, lift, chosenKg).map((v) => (
              <li key={v.entry.entryId}>
                <LifterCard
                  day={day}
                  view={v}
                  lift={lift}
                  closed={closed}
                  chosenKg={chosenKg(v)}
                  onChoose={(kg) => setChosen((c) => ({ ...c, [slot(v)]: kg }))}
                  record={records[slot(v)] ?? false}
                  onRecord={(r) => setRecords((c) => ({ ...c, [slot(v)]: r }))}
                  onMark={queue.enqueue}
                />
              </li>
            ))}
          </ol>
        </section>
      ))}
    </div>
  );
}
