// The warm-up toward the planned top set: each step's weight and reps with the plates for it.
import { useId, useState } from 'react';
import { warmupRamp, type WeightUnit } from '../../../../shared/calc';
import { PlateDiagram } from './plate-diagram';

export function WarmupRamp({ initialTop, unit, reps }: { initialTop: number | null; unit: WeightUnit; reps: number }) {
  const id = useId();
  const [top, setTop] = useState(initialTop ? String(initialTop) : '');
  const value = Number(top);
  let steps: { weight: number; reps: number }[] = [];
  let problem: string | null = null;
  if (top.trim() !== '') {
    try {
      steps = Number.isFinite(value) && value > 0 ? warmupRamp(value, { unit }) : [];
      if (!(value > 0)) problem = 'Enter the weight you plan to work up to.';
    } catch (err) {
      problem = err instanceof RangeError ? err.message : 'That weight cannot be planned.';
    }
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-col gap-1">
        <label htmlFor={id} className="text-sm font-semibold text-ink-800">
          Planned top set ({unit}, {reps} {reps === 1 ? 'rep' : 'reps'})
        </label>
        <input
          id={id}
          inputMode="decimal"
          value={top}
          onChange={(e) => setTop(e.target.value.replace(',', '.'))}
          className="block min-h-11 w-full max-w-[12rem] rounded-md border border-ink-300 bg-chalk-50 px-3 py-2 text-base text-ink-900"
          aria-describedby={`${id}-hint`}
        />
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          {initialTop
            ? 'Suggested from your best e1RM on this variant; change it to what you plan today.'
            : 'No record yet: enter what you plan to work up to.'}
        </p>
      </div>
      {problem ? <p className="text-sm text-breach-700">{problem}</p> : null}
      {steps.length > 0 ? (
        <ol
          aria-label="Warm-up sets"
          className="flex flex-col divide-y divide-ink-200 rounded-md border border-ink-200 bg-chalk-50"
        >
          {steps.map((s, i) => (
            <li key={i} className="flex flex-wrap items-center gap-x-4 gap-y-1 px-3 py-2">
              <p className="w-28 shrink-0 text-lg font-semibold text-ink-900 tabular-nums">
                {s.weight} {unit} <span className="text-base font-normal text-ink-600">× {s.reps}</span>
              </p>
              <div className="min-w-0 flex-1">
                <PlateDiagram weight={s.weight} unit={unit} />
              </div>
            </li>
          ))}
          <li className="flex flex-wrap items-center gap-x-4 gap-y-1 bg-chalk-100 px-3 py-2">
            <p className="w-28 shrink-0 text-lg font-bold text-rust-700 tabular-nums">
              {value} {unit} <span className="text-base font-normal text-ink-600">× {reps}</span>
            </p>
            <div className="min-w-0 flex-1">
              <PlateDiagram weight={value} unit={unit} />
            </div>
          </li>
        </ol>
      ) : null}
    </div>
  );
}
