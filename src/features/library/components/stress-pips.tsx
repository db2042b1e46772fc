// A variant's joint stress at a glance: each loaded joint with 0–3 filled marks, and the words for it.
import { JOINTS, type Joint } from '../../../../shared/engine/types';
import { jointLabel, stressSummary } from './labels';

export function StressPips({ stress }: { stress: Partial<Record<Joint, number>> }) {
  const loaded = JOINTS.filter((j) => (stress[j] ?? 0) > 0).sort((a, b) => (stress[b] ?? 0) - (stress[a] ?? 0));
  if (loaded.length === 0) return <span className="text-ink-500">None</span>;
  return (
    <span className="flex flex-wrap gap-x-3 gap-y-1" title={stressSummary(stress)}>
      <span className="sr-only">{stressSummary(stress)}</span>
      {loaded.map((j) => (
        <span key={j} aria-hidden className="inline-flex items-center gap-1 whitespace-nowrap">
          <span className="text-ink-700">{jointLabel(j)}</span>
          <span className="inline-flex gap-0.5">
            {[1, 2, 3].map((n) => (
              <span
                key={n}
                className={`inline-block h-2.5 w-1.5 rounded-sm ${n <= (stress[j] ?? 0) ? 'bg-rust-500' : 'bg-chalk-300'}`}
              />
            ))}
          </span>
        </span>
      ))}
    </span>
  );
}
