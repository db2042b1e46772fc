// e1RM per competition lift, drawn from the top sets of that lift's variants, with the caveat that a
// variant's estimate is not a competition max, and a switch to keep only close variants.
import { LIFT_NAME } from '../../../../shared/labels';
import { useId, useState } from 'react';
import type { WeightUnit } from '../../../../shared/calc';
import type { Series } from '../../../../shared/schemas';
import { BodyweightChart } from './bodyweight-chart';
import { CLOSE_SPECIFICITY } from './chart-data';
import { E1rmChart } from './e1rm-chart';

const LIFTS = (['squat', 'bench', 'deadlift'] as const).map((l) => [l, LIFT_NAME[l]] as const);

export function LiftCharts({ series, unit }: { series: Series; unit: WeightUnit }) {
  const id = useId();
  const [onlyClose, setOnlyClose] = useState(false);
  return (
    <section aria-labelledby={`${id}-h`} className="flex flex-col gap-3">
      <h2 id={`${id}-h`} className="text-xl font-bold text-ink-900">
        e1RM per competition lift
      </h2>
      <p className="text-ink-700">
        Each point is a top set on a <em>variant</em> of the lift, shown under the lift it trains. A variant is not the
        competition lift, so its e1RM is a guide to the trend, not a meet max. Filled points are variants close to the
        competition lift (specificity {CLOSE_SPECIFICITY} or more); hollow ones are further from it. The line is each
        week's best.
      </p>
      <label htmlFor={id} className="flex min-h-11 items-center gap-3 self-start font-semibold text-ink-800">
        <input
          id={id}
          type="checkbox"
          checked={onlyClose}
          onChange={(e) => setOnlyClose(e.target.checked)}
          className="h-5 w-5 accent-rust-500"
        />
        Only variants close to the competition lift
      </label>
      <div className="grid grid-cols-1 gap-3 lg:grid-cols-2">
        {LIFTS.map(([lift, title]) => (
          <E1rmChart key={lift} title={title} points={series.e1rm[lift]} unit={unit} onlyClose={onlyClose} />
        ))}
        <BodyweightChart readings={series.bodyweight} unit={unit} />
      </div>
    </section>
  );
}
