// e1RM over time for one competition lift: every top set on a variant of that lift as a point (filled
// for variants close to the competition lift), and each week's best as a line.
import { CartesianGrid, ComposedChart, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from 'recharts';
import type { WeightUnit } from '../../../../shared/calc';
import type { E1rmPoint } from '../../../../shared/schemas';
import { dayLabel, e1rmRows, weeklyBest, type E1rmRow, TIME_AXIS, WEIGHT_AXIS } from './chart-data';

const INK = '#253553';
const RUST = '#c4582f';

function PointTip({
  active,
  payload,
  unit,
}: {
  active?: boolean;
  payload?: { payload: E1rmRow & { best?: number } }[];
  unit: WeightUnit;
}) {
  const row = payload?.[0]?.payload;
  if (!active || !row) return null;
  return (
    <div className="rounded-md border border-ink-300 bg-chalk-50 px-3 py-2 text-sm text-ink-900 shadow">
      <p className="font-semibold">{dayLabel(row.day)}</p>
      {row.variantName ? (
        <>
          <p>{row.variantName}</p>
          <p>
            {row.set} → e1RM {row.e1rm} {unit}
          </p>
        </>
      ) : (
        <p>
          Week's best e1RM {row.best} {unit}
        </p>
      )}
    </div>
  );
}

export function E1rmChart({
  title,
  points,
  unit,
  onlyClose,
}: {
  title: string;
  points: readonly E1rmPoint[];
  unit: WeightUnit;
  onlyClose: boolean;
}) {
  const rows = e1rmRows(points, unit, onlyClose);
  const best = weeklyBest(points, unit, onlyClose);
  const headingId = `e1rm-${title.toLowerCase().replace(/\W+/g, '-')}`;
  const last = best[best.length - 1];
  return (
    <figure
      aria-labelledby={headingId}
      className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-chalk-50 p-3"
    >
      <figcaption id={headingId} className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-lg font-semibold text-ink-900">
          {title} <span className="font-normal text-ink-600">e1RM ({unit})</span>
        </span>
        <span className="text-sm text-ink-600" data-testid={`${headingId}-summary`}>
          {rows.length === 0
            ? 'No top sets yet'
            : `${rows.length} top sets · latest week's best ${last?.best ?? '—'} ${unit}`}
        </span>
      </figcaption>
      {rows.length > 0 ? (
        <div className="h-56 w-full" role="img" aria-label={`${title} e1RM over time, ${rows.length} points`}>
          <ResponsiveContainer width="100%" height="100%">
            <ComposedChart margin={{ top: 8, right: 8, bottom: 0, left: -8 }}>
              <CartesianGrid stroke="#cfd5e2" strokeDasharray="3 3" />
              <XAxis {...TIME_AXIS} allowDuplicatedCategory={false} />
              <YAxis {...WEIGHT_AXIS} />
              <Tooltip content={<PointTip unit={unit} />} />
              <Line
                data={best}
                dataKey="best"
                stroke={RUST}
                strokeWidth={2}
                dot={false}
                isAnimationActive={false}
                name="Week's best"
              />
              <Scatter
                data={rows}
                dataKey="e1rm"
                isAnimationActive={false}
                shape={(props: { cx?: number; cy?: number; payload?: E1rmRow }) => (
                  <circle
                    cx={props.cx}
                    cy={props.cy}
                    r={5}
                    fill={props.payload?.close ? INK : '#fcfaf6'}
                    stroke={INK}
                    strokeWidth={2}
                  />
                )}
              />
            </ComposedChart>
          </ResponsiveContainer>
        </div>
      ) : null}
    </figure>
  );
}
