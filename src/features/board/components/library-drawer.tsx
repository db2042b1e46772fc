// The library beside the board: filter by lift, family, equipment and risk, search by name, and drag a
// card onto a cell (with the pointer, a finger, or the keyboard).
import { LIFT_LABEL, RISK_CEILING_LABEL, RISK_WORD } from '../../../../shared/labels';
import { memo, useEffect, useId, useMemo, useState, type ReactNode } from 'react';
import { SortableContext, useSortable } from '@dnd-kit/sortable';
import type { Joint } from '../../../../shared/engine';
import type { BoardVariant, VariantNarrowing } from '../../../../shared/schemas';
import { LabelledOptions } from '../../../components/ui/field';
import { libraryDndId } from '../model/dnd';
import { jointWords } from '../model/words';

const noSorting = () => null;

export const NO_FILTERS: VariantNarrowing = { q: '', lift: '', family: '', equipment: '', risk: '' };

/** Variants a coach can still pick (archived ones stay out), narrowed by the filters. */
export function filterLibrary(variants: BoardVariant[], f: VariantNarrowing): BoardVariant[] {
  const q = f.q.trim().toLowerCase();
  return variants.filter(
    (v) =>
      !v.archived &&
      (!f.lift || v.lift === f.lift) &&
      (!f.family || v.family === f.family) &&
      (!f.equipment || (f.equipment === '(none)' ? v.equipment.length === 0 : v.equipment.includes(f.equipment))) &&
      (!f.risk || v.risk <= Number(f.risk)) &&
      (!q || v.name.toLowerCase().includes(q) || v.family.toLowerCase().includes(q)),
  );
}

function stressLine(v: BoardVariant): string {
  const top = (Object.entries(v.stress) as [Joint, number][])
    .filter(([, n]) => n > 0)
    .sort((a, b) => b[1] - a[1])
    .slice(0, 3);
  return top.length ? top.map(([j, n]) => `${jointWords(j)} ${n}`).join(' · ') : 'no joint stress';
}

const LibraryCard = memo(function LibraryCard({ variant }: { variant: BoardVariant }) {
  const descId = useId();
  const { setNodeRef, listeners, attributes, isDragging } = useSortable({
    id: libraryDndId(variant.id),
    disabled: { draggable: false, droppable: true },
  });
  return (
    // The button is the variant's name; its ::after covers the whole card, so the card is grabbed
    // anywhere while the button's name stays the name alone (the details are its description).
    <li
      className={`relative flex flex-col rounded-md border bg-chalk-50 px-2 py-1.5 hover:border-ink-500 has-[:focus-visible]:outline has-[:focus-visible]:outline-[3px] has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-rust-400 ${
        isDragging ? 'border-dashed border-ink-500' : 'border-ink-200'
      }`}
    >
      <button
        type="button"
        ref={setNodeRef}
        {...attributes}
        {...listeners}
        aria-label={variant.name}
        aria-roledescription="library card"
        aria-describedby={`${descId} ${attributes['aria-describedby']}`}
        className="cursor-grab touch-manipulation text-left text-sm font-semibold leading-tight text-ink-900 outline-none after:absolute after:inset-0 after:content-[''] active:cursor-grabbing"
      >
        {variant.name}
      </button>
      <span id={descId} className="mt-0.5 text-xs text-ink-600">
        {LIFT_LABEL[variant.lift]} · {variant.family} · risk {variant.risk} ({RISK_WORD[variant.risk]})
        <span className="block text-ink-500">
          {stressLine(variant)}
          {variant.equipment.length ? ` · needs ${variant.equipment.join(', ')}` : ''}
        </span>
      </span>
    </li>
  );
});

const fieldClass = 'block w-full rounded-md border border-ink-300 bg-chalk-50 px-2 py-1.5 text-sm text-ink-900';

function Filter({ label, children }: { label: string; children: (id: string) => ReactNode }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="text-xs font-semibold text-ink-700">
        {label}
      </label>
      {children(id)}
    </div>
  );
}

export function LibraryDrawer({ variants }: { variants: BoardVariant[] }) {
  const [filters, setFilters] = useState<VariantNarrowing>(NO_FILTERS);
  // The cards come in the frame after the board itself is on screen.
  const [ready, setReady] = useState(false);
  useEffect(() => {
    const frame = requestAnimationFrame(() => setReady(true));
    return () => cancelAnimationFrame(frame);
  }, []);
  const shown = useMemo(() => filterLibrary(variants, filters), [variants, filters]);
  const ids = useMemo(() => shown.map((v) => libraryDndId(v.id)), [shown]);
  const live = useMemo(() => variants.filter((v) => !v.archived), [variants]);
  const families = useMemo(() => [...new Set(live.map((v) => v.family))].sort(), [live]);
  const equipment = useMemo(() => [...new Set(live.flatMap((v) => v.equipment))].sort(), [live]);
  const set = <K extends keyof VariantNarrowing>(k: K, value: VariantNarrowing[K]) =>
    setFilters((f) => ({ ...f, [k]: value }));

  return (
    <aside aria-label="Library" className="flex h-full w-72 shrink-0 flex-col border-l border-ink-200 bg-chalk-100">
      <div className="space-y-2 border-b border-ink-200 p-3">
        <h2 className="text-lg font-bold text-ink-900">Library</h2>
        <Filter label="Search">
          {(id) => (
            <input
              id={id}
              type="search"
              value={filters.q}
              onChange={(e) => set('q', e.target.value)}
              placeholder="Name or family"
              className={fieldClass}
            />
          )}
        </Filter>
        <div className="grid grid-cols-2 gap-2">
          <Filter label="Lift">
            {(id) => (
              <select
                id={id}
                value={filters.lift}
                onChange={(e) => set('lift', e.target.value as VariantNarrowing['lift'])}
                className={fieldClass}
              >
                <option value="">Any</option>
                <option value="squat">Squat</option>
                <option value="bench">Bench</option>
                <option value="deadlift">Deadlift</option>
              </select>
            )}
          </Filter>
          <Filter label="Risk">
            {(id) => (
              <select
                id={id}
                value={filters.risk}
                onChange={(e) => set('risk', e.target.value as VariantNarrowing['risk'])}
                className={fieldClass}
              >
                <option value="">Any</option>
                <LabelledOptions labels={RISK_CEILING_LABEL} />
              </select>
            )}
          </Filter>
          <Filter label="Family">
            {(id) => (
              <select
                id={id}
                value={filters.family}
                onChange={(e) => set('family', e.target.value)}
                className={fieldClass}
              >
                <option value="">Any</option>
                {families.map((f) => (
                  <option key={f} value={f}>
                    {f}
                  </option>
                ))}
              </select>
            )}
          </Filter>
          <Filter label="Equipment">
            {(id) => (
              <select
                id={id}
                value={filters.equipment}
                onChange={(e) => set('equipment', e.target.value)}
                className={fieldClass}
              >
                <option value="">Any</option>
                <option value="(none)">None needed</option>
                {equipment.map((f) => (
                  <option key={f} value={f}>
                    {f}
                  </option>
                ))}
              </select>
            )}
          </Filter>
        </div>
        <p className="text-xs text-ink-600" role="status">
          {shown.length} of {live.length} variants
        </p>
      </div>
      <SortableContext id="library" items={ids} strategy={noSorting}>
        <ul className="flex-1 space-y-1.5 overflow-y-auto p-3">
          {ready ? shown.map((v) => <LibraryCard key={v.id} variant={v} />) : null}
        </ul>
      </SortableContext>
    </aside>
  );
}
