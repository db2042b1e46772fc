// The head coach's table of every athlete's fee: status, plan, next renewal and last payment, sorted
// and filtered on the server (the choice lives in the page's URL), with actions per athlete.
import { useQuery } from '@tanstack/react-query';
import { createColumnHelper, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { formatMoney, type AthleteFee, type FeePlan, type PaymentStatus } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { DataTable } from '../../../components/ui/data-table';
import { Notice } from '../../../components/ui/page';
import { athleteFeeListOptions, planListOptions, type AthleteFeeFilters } from '../api/queries';
import { useCancelFee } from '../api/use-cancel-fee';
import { useStartCheckout } from '../api/use-start-checkout';
import { FeeStatus, STATUS_LABEL, feeDay } from './fee-status';

const FILTERS: { value: PaymentStatus | ''; label: string }[] = [
  { value: '', label: 'All athletes' },
  { value: 'past_due', label: STATUS_LABEL.past_due },
  { value: 'active', label: STATUS_LABEL.active },
  { value: 'pending', label: STATUS_LABEL.pending },
  { value: 'cancelled', label: STATUS_LABEL.cancelled },
  { value: 'none', label: STATUS_LABEL.none },
];

const RUNNING = new Set<PaymentStatus>(['active', 'past_due', 'pending']);

/** Per athlete: start a checkout on their behalf (no fee running) or end the running one. */
function RowActions({ fee, plans }: { fee: AthleteFee; plans: FeePlan[] }) {
  const checkout = useStartCheckout();
  const cancel = useCancelFee();
  const [mode, setMode] = useState<'idle' | 'choose' | 'confirm'>('idle');
  const [planId, setPlanId] = useState('');
  const error = checkout.error ?? cancel.error;

  if (RUNNING.has(fee.status)) {
    return mode === 'confirm' ? (
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-sm text-ink-700">End now?</span>
        <Button size="sm" variant="danger" disabled={cancel.isPending} onClick={() => cancel.mutate(fee.athleteId)}>
          End fee
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setMode('idle')}>
          Keep
        </Button>
        {error ? <p className="w-full text-sm text-breach-700">{error.message}</p> : null}
      </div>
    ) : (
      <Button size="sm" variant="ghost" onClick={() => setMode('confirm')} aria-label={`End fee for ${fee.name}`}>
        End fee
      </Button>
    );
  }
  if (mode !== 'choose') {
    return (
      <Button
        size="sm"
        variant="secondary"
        disabled={plans.length === 0}
        onClick={() => setMode('choose')}
        aria-label={`Take payment for ${fee.name}`}
      >
        Take payment
      </Button>
    );
  }
  return (
    <form
      className="flex flex-wrap items-center gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (planId) checkout.mutate({ planId: Number(planId), athleteId: fee.athleteId });
      }}
    >
      <label className="sr-only" htmlFor={`plan-${fee.athleteId}`}>
        Plan for {fee.name}
      </label>
      <select
        id={`plan-${fee.athleteId}`}
        value={planId}
        onChange={(e) => setPlanId(e.target.value)}
        className="min-h-9 rounded-md border border-ink-300 bg-chalk-50 px-2 text-sm"
      >
        <option value="">Choose a plan…</option>
        {plans.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name} · {formatMoney(p.priceMinor, p.currency)}
          </option>
        ))}
      </select>
      <Button size="sm" type="submit" disabled={!planId || checkout.isPending}>
        To checkout
      </Button>
      <Button size="sm" variant="ghost" onClick={() => setMode('idle')}>
        Back
      </Button>
      {error ? <p className="w-full text-sm text-breach-700">{error.message}</p> : null}
    </form>
  );
}

const col = createColumnHelper<AthleteFee>();

export function AthleteFeesTable({
  filters,
  onChange,
}: {
  filters: AthleteFeeFilters;
  onChange: (next: AthleteFeeFilters) => void;
}) {
  const list = useQuery(athleteFeeListOptions(filters));
  const plans = useQuery(planListOptions('active'));
  const offered = useMemo(() => plans.data?.items ?? [], [plans.data]);

  const columns = useMemo(
    () => [
      col.accessor('name', {
        id: 'name',
        header: 'Athlete',
        cell: (c) => <span className="font-semibold text-ink-900">{c.getValue()}</span>,
      }),
      col.accessor('status', { id: 'status', header: 'Status', cell: (c) => <FeeStatus status={c.getValue()} /> }),
      col.accessor('plan', {
        id: 'plan',
        header: 'Plan',
        enableSorting: false,
        cell: (c) => {
          const plan = c.getValue();
          return plan ? (
            <span>
              {plan.name}
              <span className="block text-ink-600">
                {formatMoney(plan.priceMinor, plan.currency)} / month{plan.archived ? ' · archived' : ''}
              </span>
            </span>
          ) : (
            <span className="text-ink-500">—</span>
          );
        },
      }),
      col.accessor('currentPeriodEnd', {
        id: 'renewal',
        header: 'Next renewal',
        // A fee that has ended does not renew.
        cell: (c) => (RUNNING.has(c.row.original.status) ? feeDay(c.getValue()) : '—'),
      }),
      col.accessor('lastPaymentAt', { id: 'lastPayment', header: 'Last payment', cell: (c) => feeDay(c.getValue()) }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => <RowActions fee={c.row.original} plans={offered} />,
      }),
    ],
    [offered],
  );

  const sorting: SortingState = [{ id: filters.sort.replace(/^-/, ''), desc: filters.sort.startsWith('-') }];
  // The table instance is rebuilt each render on purpose; nothing memoised holds on to it.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: list.data?.items ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (r) => String(r.athleteId),
    manualSorting: true,
    enableSortingRemoval: false,
    state: { sorting },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const s = next[0];
      if (s) onChange({ ...filters, sort: `${s.desc ? '-' : ''}${s.id}` });
    },
  });

  return (
    <section aria-labelledby="athletes-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="athletes-heading" className="text-xl font-bold text-ink-900">
          Athletes
        </h2>
        <div role="group" aria-label="Show" className="flex flex-wrap gap-1">
          {FILTERS.map((f) => (
            <button
              key={f.value || 'all'}
              type="button"
              aria-pressed={filters.status === f.value}
              onClick={() => onChange({ ...filters, status: f.value })}
              className={`min-h-9 rounded-md border px-3 text-sm font-semibold ${
                filters.status === f.value
                  ? 'border-ink-800 bg-ink-800 text-chalk-50'
                  : 'border-ink-300 bg-chalk-50 text-ink-800 hover:bg-chalk-200'
              }`}
            >
              {f.label}
            </button>
          ))}
        </div>
      </div>
      {list.isError ? <Notice tone="error">{list.error.message}</Notice> : null}
      <DataTable
        table={table}
        caption={`Athletes’ fees${filters.status ? `: ${STATUS_LABEL[filters.status]} only` : ''}`}
        empty={list.isPending ? 'Loading…' : 'No athlete has this status.'}
      />
      <p className="text-sm text-ink-600">
        {list.data ? `${list.data.total} athlete${list.data.total === 1 ? '' : 's'}` : ''}
      </p>
    </section>
  );
}
