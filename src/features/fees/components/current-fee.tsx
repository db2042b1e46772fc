// The athlete's own fee: plan, price, renewal and last payment, what a failed renewal or an unconfirmed
// first payment means, and ending the fee.
import { useState, type ReactNode } from 'react';
import { formatMoney, type AthleteFee } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/page';
import { useCancelFee } from '../api/use-cancel-fee';
import { FeeStatus, feeDay } from './fee-status';

function Detail({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex justify-between gap-3 border-t border-chalk-300 py-2 first:border-t-0">
      <dt className="text-ink-600">{label}</dt>
      <dd className="text-right font-semibold text-ink-900">{children}</dd>
    </div>
  );
}

/** The athlete's fee as it stands, with ending it (after a confirmation). */
export function CurrentFee({ fee }: { fee: AthleteFee }) {
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
