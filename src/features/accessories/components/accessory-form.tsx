// Add or edit one accessory: the same zod schema as the server checks each field, and the server's own
// field errors land on the same fields. A save that meets someone else's newer edit loads theirs.
import { STRESS_LABEL } from '../../../../shared/labels';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { JOINTS, type Joint } from '../../../../shared/engine/types';
import { jointName } from '../../../../shared/engine/words';
import {
  ACCESSORY_CATEGORIES,
  ACCESSORY_CATEGORY_LABELS,
  accessoryBody,
  type AccessoryBody,
  type LibraryAccessory,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { LabelledOptions, SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors, loadTheirEdit } from '../../../lib/form-errors';
import { useCreateAccessory, useUpdateAccessory } from '../api/use-save-accessory';

export const jointTitle = (j: Joint) => jointName(j).replace(/^./, (c) => c.toUpperCase());

const blank: AccessoryBody = {
  name: '',
  category: 'upperBack',
  stress: Object.fromEntries(JOINTS.map((j) => [j, 0])),
  sets: 3,
  reps: 10,
  loadKg: null,
  rpe: null,
  notes: '',
};

function valuesOf(a: LibraryAccessory): AccessoryBody {
  return {
    name: a.name,
    category: a.category,
    stress: Object.fromEntries(JOINTS.map((j) => [j, a.stress[j] ?? 0])),
    sets: a.sets,
    reps: a.reps,
    loadKg: a.loadKg,
    rpe: a.rpe,
    notes: a.notes ?? '',
  };
}

const toNumber = (v: unknown) => (v === '' || v === null || v === undefined ? Number.NaN : Number(v));
const toOptionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

export function AccessoryForm({
  accessory,
  onDone,
}: {
  accessory: LibraryAccessory | null;
  onDone: (saved: LibraryAccessory) => void;
}) {
  const [current, setCurrent] = useState(accessory);
  const [conflict, setConflict] = useState<string | null>(null);
  const create = useCreateAccessory();
  const update = useUpdateAccessory();
  const form = useForm({ resolver: zodResolver(accessoryBody), defaultValues: current ? valuesOf(current) : blank });
  const { errors, isSubmitting } = form.formState;
  const failure = create.error ?? update.error;
  const showFailure = failure && !(isApiError(failure) && Object.keys(failure.fields).length > 0) && !conflict;

  const onSubmit = form.handleSubmit(async (values) => {
    setConflict(null);
    try {
      const saved = current
        ? await update.mutateAsync({ id: current.id, body: { ...values, version: current.version } })
        : await create.mutateAsync(values);
      onDone(saved);
    } catch (err) {
      const theirs = loadTheirEdit(err, form, valuesOf);
      if (theirs) {
        setCurrent(theirs.row);
        setConflict(theirs.message);
        return;
      }
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-4"
      aria-label={current ? 'Edit accessory' : 'Add accessory'}
    >
      {conflict ? <Notice tone="error">{conflict}</Notice> : null}
      {showFailure ? <Notice tone="error">{failure.message}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
        <SelectField label="Category" error={errors.category?.message} {...form.register('category')}>
          <LabelledOptions labels={ACCESSORY_CATEGORY_LABELS} values={ACCESSORY_CATEGORIES} />
        </SelectField>
      </div>
      <fieldset className="rounded-md border border-chalk-300 p-3">
        <legend className="px-1 text-sm font-semibold text-ink-800">Default work</legend>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <TextField
            label="Sets"
            type="number"
            inputMode="numeric"
            min={1}
            max={10}
            error={errors.sets?.message}
            {...form.register('sets', { setValueAs: toNumber })}
          />
          <TextField
            label="Reps"
            type="number"
            inputMode="numeric"
            min={1}
            max={100}
            error={errors.reps?.message}
            {...form.register('reps', { setValueAs: toNumber })}
          />
          <TextField
            label="Load, kg (optional)"
            type="number"
            inputMode="decimal"
            step="0.5"
            error={errors.loadKg?.message}
            {...form.register('loadKg', { setValueAs: toOptionalNumber })}
          />
          <TextField
            label="RPE target (optional)"
            type="number"
            inputMode="decimal"
            step="0.5"
            min={6}
            max={10}
            hint="A load or an RPE, not both"
            error={errors.rpe?.message}
            {...form.register('rpe', { setValueAs: toOptionalNumber })}
          />
        </div>
      </fieldset>
      <fieldset className="rounded-md border border-chalk-300 p-3">
        <legend className="px-1 text-sm font-semibold text-ink-800">
          Joint stress (0 none to 3 heavy; counts toward the joint budgets)
        </legend>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
          {JOINTS.map((j) => (
            <SelectField
              key={j}
              label={jointTitle(j)}
              error={errors.stress?.[j]?.message}
              {...form.register(`stress.${j}`, { setValueAs: toNumber })}
            >
              {STRESS_LABEL.map((label, n) => (
                <option key={n} value={n}>
                  {label}
                </option>
              ))}
            </SelectField>
          ))}
        </div>
      </fieldset>
      <TextAreaField label="Notes" rows={2} error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex justify-end gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : current ? 'Save changes' : 'Add accessory'}
        </Button>
      </div>
    </form>
  );
}
