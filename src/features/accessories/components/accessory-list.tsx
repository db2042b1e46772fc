// The accessory library grouped by category: default work, joint stress, and edit / archive / bring back.
import { JOINTS } from '../../../../shared/engine/types';
import { ACCESSORY_CATEGORY_LABELS, type LibraryAccessory } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { jointTitle } from './accessory-form';

const target = (a: LibraryAccessory) =>
  a.loadKg !== null ? ` at ${a.loadKg} kg` : a.rpe !== null ? ` at RPE ${a.rpe}` : '';

function stressText(a: LibraryAccessory): string {
  const parts = JOINTS.filter((j) => (a.stress[j] ?? 0) > 0).map((j) => `${jointTitle(j)} ${a.stress[j]}`);
  return parts.length ? parts.join(', ') : 'No joint stress';
}

export function AccessoryList({
  items,
  onEdit,
  onArchive,
}: {
  items: LibraryAccessory[];
  onEdit: (a: LibraryAccessory) => void;
  onArchive: (a: LibraryAccessory, archived: boolean) => void;
}) {
  const groups = new Map<string, LibraryAccessory[]>();
  for (const a of items) groups.set(a.category, [...(groups.get(a.category) ?? []), a]);
  return (
    <div className="flex flex-col gap-5">
      {[...groups].map(([category, list]) => (
        <section key={category} aria-labelledby={`cat-${category}`}>
          <h2 id={`cat-${category}`} className="mb-2 text-lg font-bold text-ink-900">
            {ACCESSORY_CATEGORY_LABELS[category as keyof typeof ACCESSORY_CATEGORY_LABELS] ?? category}
          </h2>
          <ul className="divide-y divide-chalk-300 rounded-md border border-chalk-300 bg-chalk-50">
            {list.map((a) => (
              <li key={a.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
                <div className="min-w-0">
                  <p className="font-semibold text-ink-900">
                    {a.name}
                    {a.archived ? <span className="ml-2 text-sm font-normal text-ink-600">(archived)</span> : null}
                  </p>
                  <p className="text-sm text-ink-600">
                    {a.sets} × {a.reps}
                    {target(a)} · {stressText(a)}
                  </p>
                </div>
                <div className="flex gap-2">
                  <Button size="sm" variant="secondary" onClick={() => onEdit(a)} aria-label={`Edit ${a.name}`}>
                    Edit
                  </Button>
                  <Button
                    size="sm"
                    variant="secondary"
                    onClick={() => onArchive(a, !a.archived)}
                    aria-label={`${a.archived ? 'Bring back' : 'Archive'} ${a.name}`}
                  >
                    {a.archived ? 'Bring back' : 'Archive'}
                  </Button>
                </div>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
