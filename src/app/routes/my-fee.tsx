// Coaching fee (athlete, phone first): their fee's status, choosing a plan and paying it on the
// provider's page, the result on the way back, and cancelling.
import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Loading, Notice, PageHeader } from '../../components/ui/page';
import { useMe } from '../../lib/me';
import { myFeeOptions, planListOptions } from '../../features/fees/api/queries';
import { ChoosePlan } from '../../features/fees/components/choose-plan';
import { CurrentFee } from '../../features/fees/components/current-fee';
import { feeDay } from '../../features/fees/components/fee-status';

export function makeLoader(queryClient: QueryClient) {
  return async () => {
    await Promise.all([
      queryClient.ensureQueryData(myFeeOptions()),
      queryClient.ensureQueryData(planListOptions('active')),
    ]);
    return null;
  };
}

/** After paying, the provider's confirmation may take a moment: ask again for up to half a minute. */
const CONFIRM_POLL_MS = 1_500;
const CONFIRM_GIVE_UP_MS = 30_000;

function useConfirmingFee(returnedPaid: boolean) {
  const [since] = useState(() => Date.now());
  return useQuery({
    ...myFeeOptions(),
    refetchInterval: (q) =>
      returnedPaid && q.state.data?.status !== 'active' && Date.now() - since < CONFIRM_GIVE_UP_MS
        ? CONFIRM_POLL_MS
        : false,
  });
}

export function Component() {
  const [params, setParams] = useSearchParams();
  const { data: me } = useMe();
  const outcome = params.get('checkout');
  const fee = useConfirmingFee(outcome === 'success');
  const plans = useQuery(planListOptions('active'));

  // Once the payment is confirmed, the address no longer needs the provider's return details.
  useEffect(() => {
    if (outcome === 'success' && fee.data?.status === 'active') {
      const t = setTimeout(() => setParams({}, { replace: true }), 8_000);
      return () => clearTimeout(t);
    }
  }, [outcome, fee.data?.status, setParams]);

  if (fee.isPending || plans.isPending) return <Loading />;
  if (fee.isError) return <Notice tone="error">{fee.error.message}</Notice>;
  const current = fee.data;
  const canChoose = current.status === 'none' || current.status === 'cancelled';

  return (
    <section className="mx-auto flex max-w-xl flex-col gap-4">
      <PageHeader title="Coaching fee" subtitle={me?.teamName} />
      {outcome === 'success' ? (
        current.status === 'active' ? (
          <Notice tone="success" title="Payment confirmed">
            Thank you. Your fee is active{current.currentPeriodEnd ? ` until ${feeDay(current.currentPeriodEnd)}` : ''}{' '}
            and renews every month.
          </Notice>
        ) : (
          <Notice title="Payment sent">Waiting for the payment provider to confirm it…</Notice>
        )
      ) : outcome === 'cancelled' ? (
        <Notice>Checkout cancelled. Nothing was charged.</Notice>
      ) : null}
      {current.status !== 'none' ? <CurrentFee fee={current} /> : null}
      {canChoose ? <ChoosePlan plans={plans.data?.items ?? []} /> : null}
    </section>
  );
}
