// The printable result sheet of a meet: every lifter's attempts, best lifts, total, DOTS and GL points,
// by class, heaviest total first. Printing (or saving as PDF) uses the print styles: no navigation, no buttons.
import { AGE_GROUP_LABELS, MEET_LIFTS } from '../../../../shared/calc';
import { SEX_LABEL } from '../../../../shared/labels';
import type { MeetDay } from '../../../../shared/schemas';
import { ATTEMPT_NAME, LIFT_NAME, lifterView, points } from './day-model';
import { dateText } from './when';

const classOrder = (c: string | null) =>
  c === null ? Number.POSITIVE_INFINITY : Number.parseFloat(c) + (c.endsWith('+') ? 0.5 : 0);

export function ResultSheet({ day }: { day: MeetDay }) {
  const views = day.entries
    .map((e) => lifterView(day, e, []))
    .sort(
      (a, b) =>
        a.entry.athlete.sex.localeCompare(b.entry.athlete.sex) ||
        classOrder(a.entry.weightClass) - classOrder(b.entry.weightClass) ||
        Number(b.standing.complete) - Number(a.standing.complete) ||
        b.standing.total - a.standing.total,
    );
  return (
    <article aria-label={`Result sheet of ${day.meet.name}`} className="result-sheet flex flex-col gap-3">
      <header>
        <h2 className="text-2xl font-bold">{day.meet.name}: results</h2>
        <p className="text-ink-700">
          {dateText(day.meet.date)} · {day.meet.equipment === 'equipped' ? 'Equipped' : 'Classic'} · weights in kg · a
          struck-through weight was missed · a total counts once every lift has a good attempt
        </p>
      </header>
      {/* On a phone the table scrolls sideways: the region takes the focus so the keys can scroll it too. */}
      <div
        role="region"
        aria-label="Results table (scrolls sideways on a narrow screen)"
        tabIndex={0}
        className="overflow-x-auto focus-visible:outline-2 focus-visible:outline-ink-800 print:overflow-visible"
      >
        <table className="w-full border-collapse text-left text-sm tabular-nums">
          <thead>
            <tr className="border-b-2 border-ink-800">
              <th scope="col" className="py-1 pr-2">
                Lifter
              </th>
              <th scope="col" className="px-1">
                Class
              </th>
              <th scope="col" className="px-1">
                Bodyweight
              </th>
              {MEET_LIFTS.map((l) =>
                [1, 2, 3].map((n) => (
                  <th key={`${l}${n}`} scope="col" className="px-1">
                    <span className="sr-only">{LIFT_NAME[l]} </span>
                    <span aria-hidden="true">{LIFT_NAME[l].slice(0, 1)}</span>
                    {ATTEMPT_NAME[n - 1]?.slice(0, 1)}
                  </th>
                )),
              )}
              <th scope="col" className="px-1">
                Total
              </th>
              <th scope="col" className="px-1">
                DOTS
              </th>
              <th scope="col" className="px-1">
                GL
              </th>
            </tr>
          </thead>
          <tbody>
            {views.map((v) => (
              <tr key={v.entry.entryId} className="border-b border-ink-200">
                <th scope="row" className="py-1 pr-2 font-semibold">
                  {v.entry.athlete.name}
                  <span className="block text-xs font-normal text-ink-600">
                    {SEX_LABEL[v.entry.athlete.sex]}
                    {v.entry.ageGroup ? ` · ${AGE_GROUP_LABELS[v.entry.ageGroup]}` : ''}
                  </span>
                </th>
                <td className="px-1">{v.entry.weightClass ?? '—'}</td>
                <td className="px-1">{v.entry.weighInKg ?? '—'}</td>
                {MEET_LIFTS.map((l) =>
                  [1, 2, 3].map((n) => {
                    const a = v.attempts[l].find((x) => x.attemptNo === n);
                    return (
                      <td key={`${l}${n}`} className="px-1">
                        {a ? (
                          a.result === 'good' ? (
                            a.weightKg
                          ) : (
                            <s aria-label={`${a.weightKg} missed`}>{a.weightKg}</s>
                          )
                        ) : (
                          '—'
                        )}
                      </td>
                    );
                  }),
                )}
                <td className="px-1 font-bold">{v.standing.complete ? v.standing.total : '—'}</td>
                <td className="px-1">{v.standing.complete ? points(v.standing.dots) : '—'}</td>
                <td className="px-1">{v.standing.complete ? points(v.standing.gl) : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-600">
        DOTS: German federation formula (2019). GL points: the international federation’s formula (2020), with its
        {day.meet.equipment === 'equipped' ? ' equipped' : ' classic'} coefficients. Printed from Rackturn.
      </p>
    </article>
  );
}
