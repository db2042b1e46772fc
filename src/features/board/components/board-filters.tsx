// Finding athletes on a big board: filter the rows by name, meet, restriction and "needs a look", and
// jump straight to one athlete's row.
import type { BoardAthlete } from '../../../../shared/schemas';
import { NO_FILTER, isFiltering, type BoardFilter } from '../model/filters';

const control = 'min-h-10 rounded-md border border-ink-300 bg-chalk-50 px-2 text-sm text-ink-900 focus:border-ink-700';
const labelClass = 'flex flex-col gap-0.5 text-xs font-semibold text-ink-700';

const MEET_CHOICES: { value: string; label: string }[] = [
  { value: 'any', label: 'Any' },
  { value: 'meet', label: 'Has a meet ahead' },
  { value: '4', label: 'Meet within 4 weeks' },
  { value: '8', label: 'Meet within 8 weeks' },
  { value: '12', label: 'Meet within 12 weeks' },
];

export function BoardFilters({
  filter,
  onChange,
  tags,
  rows,
  total,
  onJump,
  compact,
  onCompact,
}: {
  compact: boolean;
  onCompact: (on: boolean) => void;
  filter: BoardFilter;
  onChange: (f: BoardFilter) => void;
  /** The restriction tags on the board. */
  tags: string[];
  /** The athletes shown now, in board order. */
  rows: readonly BoardAthlete[];
  total: number;
  onJump: (athleteId: number) => void;
}) {
  return (
    <div role="search" aria-label="Athletes on the board" className="mb-3 flex flex-wrap items-end gap-x-3 gap-y-2">
      <label className={labelClass}>
        Name
        <input
          type="search"
          value={filter.name}
          onChange={(e) => onChange({ ...filter, name: e.target.value })}
          className={`${control} w-40`}
        />
      </label>
      <label className={labelClass}>
        Meet
        <select
          value={String(filter.meet)}
          onChange={(e) => {
            const v = e.target.value;
            onChange({ ...filter, meet: v === 'any' || v === 'meet' ? v : Number(v) });
          }}
          className={control}
        >
          {MEET_CHOICES.map((c) => (
            <option key={c.value} value={c.value}>
              {c.label}
            </option>
          ))}
        </select>
      </label>
      <label className={labelClass}>
        Restriction
        <select
          value={filter.restriction}
          onChange={(e) => onChange({ ...filter, restriction: e.target.value })}
          className={control}
        >
          <option value="">Any</option>
          <option value="*">Has a restriction</option>
          {tags.map((t) => (
            <option key={t} value={t}>
              {t}
            </option>
          ))}
        </select>
      </label>
      <label className="flex min-h-10 items-center gap-2 text-sm font-semibold text-ink-800">
        <input
          type="checkbox"
          checked={filter.needsALook}
          onChange={(e) => onChange({ ...filter, needsALook: e.target.checked })}
          className="h-4 w-4 accent-rust-500"
        />
        Needs a look only
      </label>
      <label className="flex min-h-10 items-center gap-2 text-sm font-semibold text-ink-800">
        <input
          type="checkbox"
          checked={compact}
          onChange={(e) => onCompact(e.target.checked)}
          className="h-4 w-4 accent-rust-500"
        />
        Compact rows
      </label>
      <label className={labelClass}>
        Jump to athlete
        <select
          value=""
          onChange={(e) => {
            if (e.target.value) onJump(Number(e.target.value));
          }}
          className={`${control} w-48`}
        >
          <option value="">Choose…</option>
          {rows.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
        </select>
      </label>
      <p role="status" className="min-h-10 content-center text-sm text-ink-700">
        {isFiltering(filter) ? `Showing ${rows.length} of ${total} athletes` : `${total} athletes`}
      </p>
      {isFiltering(filter) ? (
        <button
          type="button"
          onClick={() => onChange(NO_FILTER)}
          className="min-h-10 rounded-md px-2 text-sm font-semibold text-ink-800 underline hover:bg-chalk-200"
        >
          Show everyone
        </button>
      ) : null}
    </div>
  );
}
