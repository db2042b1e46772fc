// Bodyweight over time, in the viewer's unit.
import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import type { Bodyweight } from '../../../../shared/schemas';
import { bodyweightRows, dayLabel, TIME_AXIS, WEIGHT_AXIS } from './chart-data';

export function BodyweightChart({ readings, unit }: { readings: readonly Bodyweight[]; unit: WeightUnit }) {
  const rows = bodyweightRows(readings, unit);
  const latest = readings.length
    ? [...readings].sort((a, b) => a.measuredOn.localeCompare(b.measuredOn)).at(-1)
    : undefined;
  return (
    <figure
      aria-labelledby="bw-chart-title"
      className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-chalk-50 p-3"
    >
      <figcaption id="bw-chart-title" className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-lg font-semibold text-ink-900">Bodyweight ({unit})</span>
        <span className="text-sm text-ink-600">
          {latest
            ? `latest ${formatWeight(latest.weightKg, unit, { decimals: 1 })} · ${latest.measuredOn}`
            : 'No readings yet'}
        </span>
      </figcaption>
      {rows.length > 0 ? (
        <div className="h-48 w-full" role="img" aria-label={`Bodyweight over time, ${rows.length} readings`}>
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={rows} margin={{ top: 8, right: 8, bottom: 0, left: -8 }}>
              <CartesianGrid stroke="#cfd5e2" strokeDasharray="3 3" />
              <XAxis {...TIME_AXIS} />
              <YAxis {...WEIGHT_AXIS} />
              <Tooltip
                labelFormatter={(d) => dayLabel(Number(d))}
                formatter={(v) => [`${String(v)} ${unit}`, 'Bodyweight']}
              />
              <Line dataKey="weight" stroke="#253553" strokeWidth={2} dot={{ r: 3 }} isAnimationActive={false} />
            </LineChart>
          </ResponsiveContainer>
        </div>
      ) : null}
    </figure>
  );
}
