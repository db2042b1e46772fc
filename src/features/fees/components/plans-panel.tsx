// The head coach's fee plans: each with its monthly price and how many athletes pay it; add, edit,
// archive (a used plan) or delete (an unused one). Archived plans are shown on request.
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { formatMoney, type FeePlan } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Loading, Notice } from '../../../components/ui/page';
import { planListOptions } from '../api/queries';
import { useArchivePlan } from '../api/use-archive-plan';
import { useDeletePlan } from '../api/use-delete-plan';
import { PlanForm } from './plan-form';

function PlanCard({ plan, onEdit }: { plan: FeePlan; onEdit: () => void }) {
  const archive = useArchivePlan();
  const remove = useDeletePlan();
  const [confirmDelete, setConfirmDelete] = useState(false);
  const error = archive.error ?? remove.error;
  return (
    <li
      aria-label={plan.name}
      className={`flex flex-col gap-2 rounded-lg border bg-chalk-50 p-4 ${
        plan.archived ? 'border-dashed border-ink-300 opacity-80' : 'border-chalk-300 shadow-sm'
      }`}
    >
      <div className="flex items-start justify-between gap-2">
        <h3 className="text-lg font-bold leading-tight text-ink-900">{plan.name}</h3>
        {plan.archived ? (
          <span className="rounded-full border border-ink-300 px-2 text-sm font-semibold text-ink-600">Archived</span>
        ) : null}
      </div>
      <p className="text-2xl font-bold text-ink-900">
        {formatMoney(plan.priceMinor, plan.currency)}
        <span className="text-base font-medium text-ink-600"> / month</span>
      </p>
      {plan.description ? <p className="text-ink-700">{plan.description}</p> : null}
      <p className="text-sm text-ink-600">
        {plan.subscribers === 0 ? 'Nobody pays this plan now' : `${plan.subscribers} paying now`}
      </p>
      {error ? <Notice tone="error">{error.message}</Notice> : null}
      <div className="mt-auto flex flex-wrap gap-2 pt-1">
        <Button size="sm" variant="secondary" onClick={onEdit}>
          Edit
        </Button>
        <Button
          size="sm"
          variant="ghost"
          disabled={archive.isPending}
          onClick={() => archive.mutate({ plan, archived: !plan.archived })}
        >
          {plan.archived ? 'Offer again' : 'Archive'}
        </Button>
        {plan.inUse ? null : confirmDelete ? (
          <>
            <Button size="sm" variant="danger" disabled={remove.isPending} onClick={() => remove.mutate(plan)}>
              Delete for good
            </Button>
            <Button size="sm" variant="ghost" onClick={() => setConfirmDelete(false)}>
              Keep
            </Button>
          </>
        ) : (
          <Button size="sm" variant="ghost" onClick={() => setConfirmDelete(true)}>
            Delete
          </Button>
        )}
      </div>
    </li>
  );
}

export function PlansPanel({ currency }: { currency: string }) {
  const [showArchived, setShowArchived] = useState(false);
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const plans = useQuery(planListOptions(showArchived ? 'all' : 'active'));

  return (
    <section aria-labelledby="plans-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="plans-heading" className="text-xl font-bold text-ink-900">
          Plans
        </h2>
        <div className="flex flex-wrap items-center gap-3">
          <label className="flex min-h-11 items-center gap-2 text-ink-800">
            <input
              type="checkbox"
              className="h-5 w-5 accent-rust-500"
              checked={showArchived}
              onChange={(e) => setShowArchived(e.target.checked)}
            />
            Show archived
          </label>
          <Button onClick={() => setEditing('new')} disabled={editing === 'new'}>
            New plan
          </Button>
        </div>
      </div>
      {editing === 'new' ? <PlanForm currency={currency} onDone={() => setEditing(null)} /> : null}
      {plans.isPending ? (
        <Loading label="Loading plans…" />
      ) : plans.isError ? (
        <Notice tone="error">{plans.error.message}</Notice>
      ) : plans.data.items.length === 0 ? (
        <Notice>No plans yet. Add one so athletes can pay their monthly fee.</Notice>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
          {plans.data.items.map((plan) =>
            editing === plan.id ? (
              <li key={plan.id}>
                <PlanForm plan={plan} currency={currency} onDone={() => setEditing(null)} />
              </li>
            ) : (
              <PlanCard key={plan.id} plan={plan} onEdit={() => setEditing(plan.id)} />
            ),
          )}
        </ul>
      )}
    </section>
  );
}
