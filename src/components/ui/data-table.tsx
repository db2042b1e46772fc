// A @tanstack/react-table table drawn in our style: sortable headers are buttons that announce their order.
import { flexRender, type Table } from '@tanstack/react-table';
import type { ReactNode } from 'react';

declare module '@tanstack/react-table' {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData, TValue> {
    /** Extra classes for the column's cells, e.g. to hide it on narrow screens. */
    className?: string;
  }
}

export function DataTable<T>({ table, caption, empty }: { table: Table<T>; caption: string; empty?: ReactNode }) {
  const rows = table.getRowModel().rows;
  return (
    <div className="overflow-x-auto rounded-lg border border-chalk-300 bg-chalk-50">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-chalk-200 text-ink-800">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const label = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className={`whitespace-nowrap px-3 py-2 font-semibold ${header.column.columnDef.meta?.className ?? ''}`}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="-mx-1 inline-flex min-h-9 items-center gap-1 rounded px-1 hover:bg-chalk-300"
                      >
                        {label}
                        <span aria-hidden className="w-3 text-ink-500">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-6 text-center text-ink-600">
                {empty ?? 'Nothing to show.'}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id} className="border-t border-chalk-300 align-top hover:bg-chalk-100">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`px-3 py-2 ${cell.column.columnDef.meta?.className ?? ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
