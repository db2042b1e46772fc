// Choosing a fee plan (athlete, phone first) and going on to pay it on the provider's page.
import { zodResolver } from '@hookform/resolvers/zod';
import { useController, useForm } from 'react-hook-form';
import { checkoutBody, formatMoney, type CheckoutBody, type FeePlan } from '../../../../shared/schemas';
import { Form, FormFailure, SubmitButton } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useStartCheckout } from '../api/use-start-checkout';

/** Choosing a plan, then on to the payment provider's page to pay it. */
export function ChoosePlan({ plans }: { plans: FeePlan[] }) {
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
  const busy = form.formState.isSubmitting || checkout.isSuccess;
  return (
    <Form onSubmit={onSubmit} className="flex flex-col gap-3">
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
      <FormFailure failure={checkout.error} fieldErrors={form.formState.errors} />
      <SubmitButton size="lg" busy={busy} busyText="Opening the payment page…">
        Continue to payment
      </SubmitButton>
      <p className="text-sm text-ink-600">
        You enter your card on the payment provider’s page; Rackturn never sees your card details. The fee renews every
        month until you end it.
      </p>
    </Form>
  );
}
