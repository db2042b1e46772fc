// The roster: every athlete with what the board must respect for them (restrictions, equipment,
// next meet, own rules) and whether they have an account. Sorted in the browser; the list is small.
import {
  createColumnHelper,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { Athlete } from '../../../../shared/schemas';
import { DataTable } from '../../../components/ui/data-table';
import { WarningIcon } from '../../../components/ui/icons';
import { DIVISION_LABEL, formatDate, maxRiskText, restrictionText, whenText } from './labels';

const col = createColumnHelper<Athlete>();

export function RosterTable({ athletes, gymEquipment }: { athletes: Athlete[]; gymEquipment: string[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Athlete',
        cell: (c) => (
          <span className="flex flex-col">
            <Link
              to={`/athletes/${c.row.original.id}`}
              className="font-semibold text-ink-900 underline underline-offset-2 hover:text-rust-600"
            >
              {c.getValue()}
            </Link>
            {c.row.original.archived ? <span className="text-xs text-ink-500">Archived</span> : null}
          </span>
        ),
      }),
      // No ceiling sorts after the highest one.
      col.accessor((a) => a.maxRisk ?? 4, {
        id: 'maxRisk',
        header: 'Heaviest risk allowed',
        cell: (c) => maxRiskText(c.row.original.maxRisk),
      }),
      col.accessor('division', {
        header: 'Division',
        cell: (c) => `${DIVISION_LABEL[c.getValue()]} · ${c.row.original.sex === 'F' ? 'W' : 'M'}`,
        meta: { className: 'hidden lg:table-cell whitespace-nowrap' },
      }),
      col.accessor((a) => a.restrictions.filter((r) => r.active).length, {
        id: 'restrictions',
        header: 'Restrictions',
        cell: (c) => {
          const active = c.row.original.restrictions.filter((r) => r.active);
          if (!active.length) return <span className="text-ink-500">None</span>;
          return (
            <ul className="flex flex-col gap-0.5">
              {active.map((r) => (
                <li key={r.id} className="flex items-start gap-1 text-caution-700">
                  <WarningIcon className="mt-0.5 shrink-0" />
                  <span>{restrictionText(r)}</span>
                </li>
              ))}
            </ul>
          );
        },
      }),
      col.accessor((a) => a.meets.find((m) => m.date >= new Date().toISOString().slice(0, 10))?.date ?? '9999', {
        id: 'meet',
        header: 'Next meet',
        cell: (c) => {
          const next = c.row.original.meets.find((m) => m.date >= new Date().toISOString().slice(0, 10));
          if (!next) return <span className="text-ink-500">None</span>;
          return (
            <span className="flex flex-col">
              <span>{next.name}</span>
              <span className="text-xs text-ink-600">
                {formatDate(next.date)} · {whenText(next.date)}
                {next.weightClass ? ` · ${next.weightClass} kg class` : ''}
              </span>
            </span>
          );
        },
      }),
      col.display({
        id: 'equipment',
        header: 'Equipment',
        cell: (c) => {
          const lacks = gymEquipment.filter((e) => !c.row.original.equipment.includes(e));
          return lacks.length ? (
            <span>Lacks {lacks.join(', ')}</span>
          ) : (
            <span className="text-ink-600">All the gym has</span>
          );
        },
        meta: { className: 'hidden md:table-cell' },
      }),
      col.display({
        id: 'rules',
        header: 'Rules',
        cell: (c) =>
          Object.keys(c.row.original.ruleOverrides).length ? (
            <span className="whitespace-nowrap font-medium">Own rules</span>
          ) : (
            <span className="text-ink-600">Team</span>
          ),
        meta: { className: 'hidden lg:table-cell' },
      }),
      col.accessor((a) => a.account?.email ?? '', {
        id: 'account',
        header: 'Account',
        cell: (c) =>
          c.row.original.account ? (
            <span className="break-all">{c.row.original.account.email}</span>
          ) : (
            <span className="text-ink-500">No account</span>
          ),
        meta: { className: 'hidden xl:table-cell' },
      }),
    ],
    [gymEquipment],
  );
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: athletes,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    enableSortingRemoval: false,
  });
  return <DataTable table={table} caption="Athletes of the team" empty="No athlete matches." />;
}
