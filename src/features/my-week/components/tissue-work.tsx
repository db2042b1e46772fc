// This week's connective-tissue work: the kind, each joint's exercise and dose with its instructions,
// the week's notes, and the usual cautions.
import { TISSUE_CAUTION } from '../../../../shared/engine/tissue';
import { TISSUE_KIND_LABEL, tissueDoseLabel, tissueSessionsLabel } from '../../../../shared/labels';
import { jointName } from '../../../../shared/engine/words';
import type { TissueWorkWeek } from '../../../../shared/schemas';
import { WarningIcon } from '../../../components/ui/icons';

export function TissueWork({ tissue }: { tissue: TissueWorkWeek }) {
  const cautions = new Set<string>(TISSUE_CAUTION);
  const notes = tissue.notes.filter((n) => !cautions.has(n));
  return (
    <section
      aria-labelledby="tissue-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-chalk-50 p-4"
    >
      <h2 id="tissue-heading" className="text-xl font-bold text-ink-900">
        Connective-tissue work
      </h2>
      <p className="text-lg font-semibold text-ink-800">{tissue.kind ? TISSUE_KIND_LABEL[tissue.kind] : 'Rest week'}</p>
      {notes.length > 0 ? (
        <ul className="list-disc pl-5 text-ink-700">
          {notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
      {tissue.items.length > 0 ? (
        <ol className="flex flex-col gap-3">
          {tissue.items.map((item, i) => (
            <li key={`${item.joint}-${item.kind}`} className="rounded-md border border-ink-200 bg-chalk-100 p-3">
              <p className="text-sm font-semibold uppercase tracking-wide text-ink-600">{jointName(item.joint)}</p>
              <p className="font-semibold text-ink-900">{item.exercise}</p>
              <p className="text-ink-800">{tissueDoseLabel(item)}</p>
              <p className="text-sm font-semibold text-ink-700">{tissueSessionsLabel(item.sessionsPerWeek)}</p>
              <details className="mt-1" open={i === 0}>
                <summary className="flex min-h-11 cursor-pointer items-center font-semibold text-ink-800">
                  How to do it
                </summary>
                <ul className="list-disc pl-5 text-sm text-ink-700">
                  {item.instructions.map((line) => (
                    <li key={line}>{line}</li>
                  ))}
                </ul>
              </details>
            </li>
          ))}
        </ol>
      ) : null}
      <aside
        aria-label="Cautions for connective-tissue work"
        className="flex gap-2 rounded-md border border-caution-600/40 bg-caution-100 p-3 text-sm text-ink-800"
      >
        <WarningIcon className="mt-0.5 shrink-0 text-caution-700" />
        <ul className="flex flex-col gap-1">
          {TISSUE_CAUTION.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </aside>
    </section>
  );
}
