// Coaching fee (athlete, phone first): their fee's status, choosing a plan and paying it on the
// provider's page, the result on the way back, and cancelling.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useController, useForm } from 'react-hook-form';
import { useSearchParams } from 'react-router-dom';
import { checkoutBody, formatMoney, type AthleteFee, type CheckoutBody, type FeePlan } from '../../../shared/schemas';
import { Button } from '../../components/ui/button';
import { Loading, Notice, PageHeader } from '../../components/ui/page';
import { useMe } from '../../lib/me';
import { isApiError } from '../../lib/api-client';
import { myFeeOptions, planListOptions } from '../../features/fees/api/queries';
import { useCancelFee } from '../../features/fees/api/use-cancel-fee';
import { useStartCheckout } from '../../features/fees/api/use-start-checkout';
import { FeeStatus, feeDay } from '../../features/fees/components/fee-status';

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

function Detail({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex justify-between gap-3 border-t border-chalk-300 py-2 first:border-t-0">
      <dt className="text-ink-600">{label}</dt>
      <dd className="text-right font-semibold text-ink-900">{children}</dd>
    </div>
  );
}

function CurrentFee({ fee }: { fee: AthleteFee }) {
  const cancel = useCancelFee();
  const [confirming, setConfirming] = useState(false);
  const running = fee.status === 'active' || fee.status === 'past_due' || fee.status === 'pending';
  return (
    <section aria-labelledby="fee-heading" className="rounded-lg border border-chalk-300 bg-chalk-50 p-4 shadow-sm">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="fee-heading" className="text-lg font-bold text-ink-900">
          Your fee
        </h2>
        <FeeStatus status={fee.status} size="lg" />
      </div>
      {fee.plan ? (
        <dl className="mt-3">
          <Detail label="Plan">{fee.plan.name}</Detail>
          <Detail label="Price">{formatMoney(fee.plan.priceMinor, fee.plan.currency)} / month</Detail>
          {running ? <Detail label="Next renewal">{feeDay(fee.currentPeriodEnd)}</Detail> : null}
          <Detail label="Last payment">{feeDay(fee.lastPaymentAt)}</Detail>
        </dl>
      ) : null}
      {fee.status === 'past_due' ? (
        <div className="mt-3">
          <Notice tone="error" title="The last renewal did not go through">
            The payment provider will try the card again. To pay with another card, end this fee and choose a plan
            again, or talk to your head coach.
          </Notice>
        </div>
      ) : null}
      {fee.status === 'pending' ? (
        <p className="mt-3 text-ink-700">The payment provider has not confirmed the first payment yet.</p>
      ) : null}
      {running ? (
        <div className="mt-4 flex flex-col gap-2">
          {confirming ? (
            <>
              <p className="text-ink-800">
                Ending your fee stops it now: you will not be charged again, and the current month is not refunded.
              </p>
              <div className="flex flex-wrap gap-2">
                <Button variant="danger" disabled={cancel.isPending} onClick={() => cancel.mutate(undefined)}>
                  {cancel.isPending ? 'Ending…' : 'Yes, end my fee'}
                </Button>
                <Button variant="secondary" onClick={() => setConfirming(false)}>
                  Keep my fee
                </Button>
              </div>
            </>
          ) : (
            <Button variant="secondary" className="self-start" onClick={() => setConfirming(true)}>
              End my fee
            </Button>
          )}
          {cancel.error ? <Notice tone="error">{cancel.error.message}</Notice> : null}
        </div>
      ) : null}
    </section>
  );
}

function ChoosePlan({ plans }: { plans: FeePlan[] }) {
  const checkout = useStartCheckout();
  const form = useForm<CheckoutBody>({
    resolver: zodResolver(checkoutBody),
    defaultValues: plans.length === 1 ? { planId: plans[0]!.id } : {},
  });
  // Radio values are strings; the controller hands the schema the plan's numeric id.
  const { field } = useController({ control: form.control, name: 'planId' });
  if (plans.length === 0) {
    return <Notice>Your head coach has not set up a fee plan yet.</Notice>;
  }
  const onSubmit = form.handleSubmit(async ({ planId }) => {
    try {
      await checkout.mutateAsync({ planId });
    } catch (err) {
      const message = isApiError(err) ? err.fields.planId?.[0] : undefined;
      if (message) form.setError('planId', { type: 'server', message });
    }
  });
  const fieldError = form.formState.errors.planId?.message;
  const otherError = checkout.error && !fieldError ? checkout.error.message : undefined;
  const busy = form.formState.isSubmitting || checkout.isSuccess;
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-3">
      <fieldset aria-describedby={fieldError ? 'plan-error' : undefined} className="flex flex-col gap-2">
        <legend className="mb-1 text-lg font-bold text-ink-900">Choose a plan</legend>
        {plans.map((p, index) => (
          <label
            key={p.id}
            className={`flex cursor-pointer gap-3 rounded-lg border-2 bg-chalk-50 p-3 ${
              field.value === p.id ? 'border-rust-500' : 'border-chalk-300 hover:border-ink-300'
            }`}
          >
            <input
              type="radio"
              name={field.name}
              value={p.id}
              checked={field.value === p.id}
              onChange={() => field.onChange(p.id)}
              onBlur={field.onBlur}
              ref={index === 0 ? field.ref : undefined}
              className="mt-1 h-5 w-5 shrink-0 accent-rust-500"
            />
            <span className="flex min-w-0 flex-col">
              <span className="flex flex-wrap items-baseline justify-between gap-x-3">
                <span className="font-bold text-ink-900">{p.name}</span>
                <span className="font-semibold text-ink-900">{formatMoney(p.priceMinor, p.currency)} / month</span>
              </span>
              {p.description ? <span className="text-sm text-ink-700">{p.description}</span> : null}
            </span>
          </label>
        ))}
      </fieldset>
      {fieldError ? (
        <p id="plan-error" role="alert" className="text-sm font-medium text-breach-700">
          {fieldError}
        </p>
      ) : null}
      {otherError ? <Notice tone="error">{otherError}</Notice> : null}
      <Button type="submit" size="lg" disabled={busy}>
        {busy ? 'Opening the payment page…' : 'Continue to payment'}
      </Button>
      <p className="text-sm text-ink-600">
        You enter your card on the payment provider’s page; Rackturn never sees your card details. The fee renews every
        month until you end it.
      </p>
    </form>
  );
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
