// The joint-load strip: per week, one bar per budgeted joint showing the rolling load against its
// budget (a full bar is the budget), coloured and titled by state so overload is seen at a glance.
import { memo } from 'react';
import type { JointLoadPoint } from '../../../../shared/engine';
import { NEAR_BUDGET } from '../../../../shared/engine';
import { jointWords, percent } from '../model/words';

const SHORT: Record<string, string> = {
  shoulder: 'Sh',
  elbow: 'El',
  wrist: 'Wr',
  lowerBack: 'LB',
  hip: 'Hp',
  knee: 'Kn',
};

export function loadState(ratio: number): 'clean' | 'caution' | 'breach' {
  return ratio > 1 + 1e-9 ? 'breach' : ratio >= NEAR_BUDGET - 1e-9 ? 'caution' : 'clean';
}

const FILL = { clean: '#2f7d57', caution: '#a8741a', breach: '#b3362d' };

/** Bars for one week; the strip of a row is these side by side under the week columns. */
export const JointBars = memo(
  function JointBars({ points, week }: { points: JointLoadPoint[]; week: string }) {
    if (points.length === 0) return null;
    const w = 100 / points.length;
    const text = points.map((p) => `${jointWords(p.joint)} ${percent(p.ratio)}`).join(', ');
    return (
      <svg
        viewBox="0 0 100 24"
        preserveAspectRatio="none"
        className="mt-1 block h-5 w-full"
        role="img"
        aria-label={`Joint load ${week}: ${text}`}
      >
        <title>{`Joint load over the span ending ${week} (share of budget): ${text}`}</title>
        <line x1="0" x2="100" y1="4" y2="4" stroke="#7d8bab" strokeWidth="0.6" strokeDasharray="2 2" />
        {points.map((p, i) => {
          const h = Math.min(1.2, Math.max(0, p.ratio)) * 20;
          return (
            <rect
              key={p.joint}
              x={i * w + w * 0.15}
              width={w * 0.7}
              y={24 - h}
              height={Math.max(h, 0.8)}
              fill={FILL[loadState(p.ratio)]}
            />
          );
        })}
      </svg>
    );
  },
  (a, b) =>
    a.week === b.week &&
    a.points.length === b.points.length &&
    a.points.every((p, i) => p.joint === b.points[i]!.joint && p.ratio === b.points[i]!.ratio),
);

/** The joints the bars stand for, in order, for the row header. */
export function JointLegend({ points }: { points: JointLoadPoint[] }) {
  return (
    <span className="flex gap-1 text-[9px] font-semibold uppercase text-ink-400" aria-hidden>
      {points.map((p) => (
        <span key={p.joint}>{SHORT[p.joint]}</span>
      ))}
    </span>
  );
}
