// The joint-load strip: per week, one bar per budgeted joint showing the rolling load against its
// budget (the line is the budget), coloured by state and spelled out for screen readers and on hover,
// so overload is seen at a glance. Drawn as layered backgrounds on one element per week, which keeps a
// big board light.
import { memo } from 'react';
import type { JointLoadPoint } from '../../../../shared/engine';
import { NEAR_BUDGET } from '../../../../shared/engine';
import { jointShort, jointWords, percent } from '../model/words';

export function loadState(ratio: number): 'clean' | 'caution' | 'breach' {
  return ratio > 1 + 1e-9 ? 'breach' : ratio >= NEAR_BUDGET - 1e-9 ? 'caution' : 'clean';
}

const FILL = { clean: '#2f7d57', caution: '#a8741a', breach: '#b3362d' };
/** The top of the strip stands for this share of the budget, so overload shows above the line. */
const TOP = 1.25;

/** CSS backgrounds for the bars (and the budget line), one layer each. */
export function barLayers(points: JointLoadPoint[]): { image: string; size: string; position: string } {
  const n = points.length;
  const width = 100 / n;
  const bar = width * 0.7;
  const images: string[] = ['linear-gradient(#7d8bab,#7d8bab)'];
  const sizes: string[] = ['100% 1px'];
  const positions: string[] = [`0 ${(1 - 1 / TOP) * 100}%`];
  points.forEach((p, i) => {
    const c = FILL[loadState(p.ratio)];
    const h = Math.max(4, (Math.min(TOP, Math.max(0, p.ratio)) / TOP) * 100);
    const left = i * width + (width - bar) / 2;
    images.push(`linear-gradient(${c},${c})`);
    sizes.push(`${bar}% ${h}%`);
    // A background's x% lines up its own x% point with the box's, hence the scaling.
    positions.push(`${(left / (100 - bar)) * 100}% 100%`);
  });
  return { image: images.join(','), size: sizes.join(','), position: positions.join(',') };
}

/** Bars for one week; the strip of a row is these side by side under the week columns. */
export const JointBars = memo(
  function JointBars({ points, week }: { points: JointLoadPoint[]; week: string }) {
    if (points.length === 0) return null;
    const text = points.map((p) => `${jointWords(p.joint)} ${percent(p.ratio)}`).join(', ');
    const layers = barLayers(points);
    return (
      <div className="mt-1">
        <div
          role="img"
          aria-label={`Joint load ${week}: ${text}`}
          title={`Joint load over the span ending ${week}, as a share of each budget: ${text}`}
          className="h-5 w-full bg-no-repeat"
          style={{ backgroundImage: layers.image, backgroundSize: layers.size, backgroundPosition: layers.position }}
        />
        {/* Each bar named in place, under it (the picture's own label already says it all to a screen reader). */}
        <div aria-hidden data-joint-labels className="flex text-[9px] font-semibold leading-3 text-ink-600">
          {points.map((p) => (
            <span key={p.joint} className="flex-1 text-center">
              {jointShort(p.joint)}
            </span>
          ))}
        </div>
      </div>
    );
  },
  (a, b) =>
    a.week === b.week &&
    a.points.length === b.points.length &&
    a.points.every((p, i) => p.joint === b.points[i]!.joint && p.ratio === b.points[i]!.ratio),
);
