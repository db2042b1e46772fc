// The library table: sorted on the server (the column headers set the list's `sort`), one row per variant.
import { LIFT_LABEL, RISK_LABEL } from '../../../../shared/labels';
import { createColumnHelper, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo } from 'react';
import type { LibraryVariant } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { DataTable } from '../../../components/ui/data-table';
import { EMPHASIS_LABEL, SCHEME_LABEL } from './labels';
import { StressPips } from './stress-pips';

const col = createColumnHelper<LibraryVariant>();
const SORTABLE = new Set(['name', 'lift', 'family', 'risk', 'specificity']);

export function toSorting(sort: string): SortingState {
  const desc = sort.startsWith('-');
  const id = desc ? sort.slice(1) : sort;
  return SORTABLE.has(id) ? [{ id, desc }] : [];
}

export function fromSorting(s: SortingState): string {
  const first = s[0];
  return first ? `${first.desc ? '-' : ''}${first.id}` : 'name';
}

export function VariantTable({
  items,
  sort,
  onSort,
  onEdit,
  onDelete,
  onRestore,
}: {
  items: LibraryVariant[];
  sort: string;
  onSort: (sort: string) => void;
  onEdit: (v: LibraryVariant) => void;
  onDelete: (v: LibraryVariant) => void;
  onRestore: (v: LibraryVariant) => void;
}) {
  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Name',
        cell: (c) => (
          <span className="font-semibold text-ink-900">
            {c.getValue()}
            {c.row.original.archived ? (
              <span className="ml-2 rounded border border-ink-400 px-1.5 text-xs font-medium text-ink-600">
                Archived
              </span>
            ) : null}
          </span>
        ),
      }),
      col.accessor('lift', { header: 'Lift', cell: (c) => LIFT_LABEL[c.getValue()] }),
      col.accessor('family', { header: 'Family' }),
      col.accessor('bar', { header: 'Bar', enableSorting: false, meta: { className: 'hidden xl:table-cell' } }),
      col.accessor('equipment', {
        header: 'Equipment',
        enableSorting: false,
        cell: (c) => (c.getValue().length ? c.getValue().join(', ') : <span className="text-ink-500">None</span>),
        meta: { className: 'hidden lg:table-cell' },
      }),
      col.accessor('emphasis', {
        header: 'Emphasis',
        enableSorting: false,
        cell: (c) => EMPHASIS_LABEL[c.getValue()],
        meta: { className: 'hidden xl:table-cell' },
      }),
      col.accessor('stress', {
        header: 'Joint stress',
        enableSorting: false,
        cell: (c) => <StressPips stress={c.getValue()} />,
      }),
      col.accessor('risk', {
        header: 'Risk',
        cell: (c) => RISK_LABEL[c.getValue()],
        meta: { className: 'whitespace-nowrap' },
      }),
      col.accessor('specificity', {
        header: 'Specificity',
        cell: (c) => c.getValue().toFixed(2),
        meta: { className: 'hidden lg:table-cell tabular-nums' },
      }),
      col.accessor('scheme', {
        header: 'Top set',
        enableSorting: false,
        cell: (c) => SCHEME_LABEL[c.getValue()],
        meta: { className: 'hidden lg:table-cell' },
      }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => (
          <span className="flex justify-end gap-1">
            <Button
              size="sm"
              variant="ghost"
              aria-label={`Edit ${c.row.original.name}`}
              onClick={() => onEdit(c.row.original)}
            >
              Edit
            </Button>
            {c.row.original.archived ? (
              <Button
                size="sm"
                variant="ghost"
                aria-label={`Restore ${c.row.original.name}`}
                onClick={() => onRestore(c.row.original)}
              >
                Restore
              </Button>
            ) : (
              <Button
                size="sm"
                variant="ghost"
                aria-label={`Delete ${c.row.original.name}`}
                onClick={() => onDelete(c.row.original)}
              >
                Delete
              </Button>
            )}
          </span>
        ),
      }),
    ],
    [onEdit, onDelete, onRestore],
  );

  const sorting = toSorting(sort);
  // The table instance holds callbacks, which the React compiler must not memoise away.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: items,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    state: { sorting },
    onSortingChange: (updater) => onSort(fromSorting(typeof updater === 'function' ? updater(sorting) : updater)),
  });

  return <DataTable table={table} caption="Variants of the library" empty="No variant matches these filters." />;
}
