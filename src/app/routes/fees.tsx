// Fees (head coach): the team's monthly fee plans and every athlete's payment status.
import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { PageHeader, Notice } from '../../components/ui/page';
import { useMe } from '../../lib/me';
import {
  athleteFeeListOptions,
  athleteFiltersFromSearch,
  planListOptions,
  type AthleteFeeFilters,
} from '../../features/fees/api/queries';
import { AthleteFeesTable } from '../../features/fees/components/athlete-fees-table';
import { PlansPanel } from '../../features/fees/components/plans-panel';

export function makeLoader(queryClient: QueryClient) {
  return async ({ request }: { request: Request }) => {
    const filters = athleteFiltersFromSearch(new URL(request.url).searchParams);
    await Promise.all([
      queryClient.ensureQueryData(planListOptions('active')),
      queryClient.ensureQueryData(athleteFeeListOptions(filters)),
    ]);
    return null;
  };
}

/** What the provider sent the head coach back with, after a checkout taken for an athlete. */
function ReturnNotice({ params, onDismiss }: { params: URLSearchParams; onDismiss: () => void }) {
  const outcome = params.get('checkout');
  if (outcome !== 'success' && outcome !== 'cancelled') return null;
  return (
    <div className="mb-4 flex flex-col gap-2">
      <Notice tone={outcome === 'success' ? 'success' : 'info'}>
        {outcome === 'success'
          ? 'Payment sent. The athlete’s status below changes as soon as the payment provider confirms it.'
          : 'Checkout cancelled. Nothing was charged.'}{' '}
        <button type="button" className="font-semibold underline underline-offset-2" onClick={onDismiss}>
          Dismiss
        </button>
      </Notice>
    </div>
  );
}

export function Component() {
  const [params, setParams] = useSearchParams();
  const { data: me } = useMe();
  const filters = athleteFiltersFromSearch(params);
  const plans = useQuery(planListOptions('active'));

  const setFilters = (next: AthleteFeeFilters) =>
    setParams(
      (p) => {
        const out = new URLSearchParams(p);
        if (next.status) out.set('status', next.status);
        else out.delete('status');
        out.set('sort', next.sort);
        return out;
      },
      { replace: true },
    );

  return (
    <section className="flex flex-col gap-8">
      <div>
        <PageHeader
          title="Fees"
          subtitle={`Monthly coaching fees${me ? ` for ${me.teamName}` : ''}. Athletes pay on the payment provider’s own page; card details never reach Rackturn.`}
        />
        <ReturnNotice
          params={params}
          onDismiss={() =>
            setParams(
              (p) => {
                const out = new URLSearchParams(p);
                for (const k of ['checkout', 'athlete', 'session_id']) out.delete(k);
                return out;
              },
              { replace: true },
            )
          }
        />
        <PlansPanel currency={plans.data?.currency ?? 'EUR'} />
      </div>
      <AthleteFeesTable filters={filters} onChange={setFilters} />
    </section>
  );
}
