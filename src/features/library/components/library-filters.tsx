// The library's filters: text search (applied as you type, after a short pause), lift, family,
// equipment, risk, and whether archived variants are shown.
import { LIFT_LABEL, RISK_LABEL } from '../../../../shared/labels';
import { useEffect, useState } from 'react';
import type { VariantFacets } from '../../../../shared/schemas';
import { CheckboxField } from '../../../components/ui/choices';
import { LabelledOptions, SelectField, TextField } from '../../../components/ui/field';
import type { LibraryFilters } from '../api/queries';

export function LibraryFiltersBar({
  filters,
  facets,
  onChange,
}: {
  filters: LibraryFilters;
  facets: VariantFacets;
  onChange: (next: Partial<LibraryFilters>) => void;
}) {
  // The box starts from the URL and then leads: the URL follows what is typed, after a pause.
  const [q, setQ] = useState(filters.q);
  useEffect(() => {
    if (q === filters.q) return;
    const timer = setTimeout(() => onChange({ q }), 250);
    return () => clearTimeout(timer);
  }, [q, filters.q, onChange]);

  return (
    <div
      role="search"
      aria-label="Filter the library"
      className="mb-3 grid gap-3 rounded-lg border border-chalk-300 bg-chalk-100 p-3 sm:grid-cols-2 lg:grid-cols-[2fr_1fr_1fr_1fr_1fr_auto] lg:items-end"
    >
      <TextField
        label="Search"
        type="search"
        placeholder="Name, family, bar or notes"
        value={q}
        onChange={(e) => setQ(e.target.value)}
      />
      <SelectField
        label="Lift"
        value={filters.lift}
        onChange={(e) => onChange({ lift: e.target.value as LibraryFilters['lift'] })}
      >
        <option value="">All lifts</option>
        <LabelledOptions labels={LIFT_LABEL} />
      </SelectField>
      <SelectField label="Family" value={filters.family} onChange={(e) => onChange({ family: e.target.value })}>
        <option value="">All families</option>
        {facets.families.map((f) => (
          <option key={f} value={f}>
            {f}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Equipment"
        value={filters.equipment}
        onChange={(e) => onChange({ equipment: e.target.value })}
      >
        <option value="">Any equipment</option>
        <option value="none">Needs none</option>
        {facets.equipment.map((f) => (
          <option key={f} value={f}>
            Uses {f}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Risk"
        value={filters.risk}
        onChange={(e) => onChange({ risk: e.target.value as LibraryFilters['risk'] })}
      >
        <option value="">Any risk</option>
        {([1, 2, 3] as const).map((r) => (
          <option key={r} value={String(r)}>
            {RISK_LABEL[r]}
          </option>
        ))}
      </SelectField>
      <CheckboxField
        label="Show archived"
        checked={filters.includeArchived}
        onChange={(on) => onChange({ includeArchived: on })}
      />
    </div>
  );
}
