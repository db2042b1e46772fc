// The form to add or change a fee plan: name, monthly price as a decimal, description. The same
// schema checks it here and on the server; the server's field errors land on the same fields.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import {
  feePlanBody,
  fromMinorUnits,
  type FeePlan,
  type FeePlanBody,
  type FeePlanValues,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { Form, FormFailure, SubmitButton } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { useSavePlan } from '../api/use-save-plan';

const FIELDS = ['name', 'price', 'description'] as const;

export function PlanForm({ plan, currency, onDone }: { plan?: FeePlan; currency: string; onDone: () => void }) {
  const save = useSavePlan();
  const form = useForm<FeePlanBody, unknown, FeePlanValues>({
    resolver: zodResolver(feePlanBody),
    defaultValues: plan
      ? { name: plan.name, price: fromMinorUnits(plan.priceMinor, plan.currency), description: plan.description ?? '' }
      : { name: '', price: '', description: '' },
  });
  const { errors, isSubmitting } = form.formState;
  const conflict = staleSaveCurrent<FeePlan>(save.error) ?? undefined;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await save.mutateAsync({ id: plan?.id, version: conflict?.version ?? plan?.version, values });
      onDone();
    } catch (err) {
      if (!isApiError(err)) return;
      for (const [field, messages] of Object.entries(err.fields)) {
        if ((FIELDS as readonly string[]).includes(field)) {
          form.setError(field as (typeof FIELDS)[number], { type: 'server', message: messages[0] });
        }
      }
    }
  });

  const title = plan ? `Edit ${plan.name}` : 'New plan';
  return (
    <Form
      onSubmit={onSubmit}
      aria-label={title}
      className="flex flex-col gap-3 rounded-lg border-2 border-rust-400 bg-chalk-50 p-4"
    >
      <h3 className="text-lg font-bold text-ink-900">{title}</h3>
      {conflict ? (
        <Notice tone="error" title="Someone else saved this plan meanwhile">
          Now it reads “{conflict.name}”, {fromMinorUnits(conflict.priceMinor, conflict.currency)} {conflict.currency}.
          Saving again replaces their version with yours.
        </Notice>
      ) : (
        <FormFailure failure={save.error} fieldErrors={errors} />
      )}
      <TextField
        label="Name"
        autoComplete="off"
        maxLength={120}
        error={errors.name?.message}
        {...form.register('name')}
      />
      <TextField
        label={`Monthly price (${currency})`}
        inputMode="decimal"
        autoComplete="off"
        placeholder="45.00"
        hint={
          plan && plan.subscribers > 0
            ? 'Athletes paying now keep their price; a new one applies to new checkouts.'
            : undefined
        }
        error={errors.price?.message}
        {...form.register('price')}
      />
      <TextAreaField
        label="Description (optional)"
        rows={3}
        maxLength={1000}
        error={errors.description?.message}
        {...form.register('description')}
      />
      <div className="flex flex-wrap gap-2">
        <SubmitButton busy={isSubmitting} busyText="Saving…">
          {plan ? 'Save plan' : 'Add plan'}
        </SubmitButton>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </Form>
  );
}
