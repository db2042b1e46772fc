// Add or edit one variant: the same zod schema as the server checks each field, and the server's own
// field errors land on the same fields. A save that meets someone else's newer edit loads theirs.
import { LIFT_LABEL, RISK_LABEL, STRESS_LABEL } from '../../../../shared/labels';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useController, useForm, type Control } from 'react-hook-form';
import { JOINTS } from '../../../../shared/engine/types';
import {
  variantBody,
  variantTraitsSchema,
  type LibraryVariant,
  type VariantBody,
  type VariantFacets,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { AddItemField, CheckboxGroup } from '../../../components/ui/choices';
import { LabelledOptions, SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors, loadTheirEdit } from '../../../lib/form-errors';
import { useCreateVariant, useUpdateVariant } from '../api/use-save-variant';
import { EMPHASIS_LABEL, SCHEME_LABEL, jointLabel } from './labels';

const blank: VariantBody = {
  name: '',
  lift: 'squat',
  family: '',
  bar: 'straight',
  equipment: [],
  emphasis: 'bottom',
  stress: Object.fromEntries(JOINTS.map((j) => [j, 0])),
  risk: 1,
  specificity: 0.5,
  scheme: 'single',
  notes: '',
  meetPhaseWeeks: null,
};

function valuesOf(v: LibraryVariant): VariantBody {
  // The traits, without the library's bookkeeping (id, version, archived…): zod leaves unknown keys out.
  return {
    ...variantTraitsSchema.parse(v),
    stress: Object.fromEntries(JOINTS.map((j) => [j, v.stress[j] ?? 0])),
    notes: v.notes ?? '',
  };
}

const toNumber = (v: unknown) => (v === '' || v === null || v === undefined ? Number.NaN : Number(v));
const toOptionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

export function VariantForm({
  variant,
  facets,
  onDone,
}: {
  variant: LibraryVariant | null;
  facets: VariantFacets;
  onDone: (saved: LibraryVariant) => void;
}) {
  const [current, setCurrent] = useState(variant);
  const [conflict, setConflict] = useState<string | null>(null);
  const create = useCreateVariant();
  const update = useUpdateVariant();
  const form = useForm({
    resolver: zodResolver(variantBody),
    defaultValues: current ? valuesOf(current) : blank,
  });
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
      applyFieldErrors(err, form.setError, (f) => (f.startsWith('equipment.') ? 'equipment' : f));
    }
  });

  const joints = JOINTS;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-4"
      aria-label={current ? 'Edit variant' : 'Add variant'}
    >
      {conflict ? <Notice tone="error">{conflict}</Notice> : null}
      {showFailure ? <Notice tone="error">{failure.message}</Notice> : null}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label="Lift" error={errors.lift?.message} {...form.register('lift')}>
          <LabelledOptions labels={LIFT_LABEL} />
        </SelectField>
        <TextField
          label="Family"
          list="variant-families"
          autoComplete="off"
          hint="Variants that train nearly the same thing"
          error={errors.family?.message}
          {...form.register('family')}
        />
        <TextField
          label="Bar"
          list="variant-bars"
          autoComplete="off"
          error={errors.bar?.message}
          {...form.register('bar')}
        />
        <datalist id="variant-families">
          {facets.families.map((f) => (
            <option key={f} value={f} />
          ))}
        </datalist>
        <datalist id="variant-bars">
          {facets.bars.map((b) => (
            <option key={b} value={b} />
          ))}
        </datalist>
      </div>

      <EquipmentPicker
        control={form.control}
        known={facets.equipment}
        error={errors.equipment?.message ?? errors.equipment?.[0]?.message}
      />

      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField
          label="Emphasis"
          hint="Where in the range it overloads"
          error={errors.emphasis?.message}
          {...form.register('emphasis')}
        >
          <LabelledOptions labels={EMPHASIS_LABEL} />
        </SelectField>
        <SelectField
          label="Risk"
          hint="How hard it is to recover from"
          error={errors.risk?.message}
          {...form.register('risk', { setValueAs: toNumber })}
        >
          <LabelledOptions labels={RISK_LABEL} />
        </SelectField>
        <TextField
          label="Specificity"
          type="number"
          inputMode="decimal"
          step="0.05"
          min={0}
          max={1}
          hint="0 far from the competition lift, 1 the lift itself"
          error={errors.specificity?.message}
          {...form.register('specificity', { setValueAs: toNumber })}
        />
      </div>

      <fieldset className="rounded-md border border-chalk-300 p-3">
        <legend className="px-1 text-sm font-semibold text-ink-800">Joint stress (0 none to 3 heavy)</legend>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
          {joints.map((j) => (
            <SelectField
              key={j}
              label={jointLabel(j)}
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

      <fieldset>
        <legend className="text-sm font-semibold text-ink-800">Default top set</legend>
        <div className="mt-1 flex flex-wrap gap-2">
          {(Object.keys(SCHEME_LABEL) as (keyof typeof SCHEME_LABEL)[]).map((s) => (
            <label
              key={s}
              className="inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-ink-300 px-3 has-[:checked]:border-ink-800 has-[:checked]:bg-ink-800 has-[:checked]:text-chalk-50"
            >
              <input type="radio" value={s} className="accent-rust-500" {...form.register('scheme')} />
              {SCHEME_LABEL[s]}
            </label>
          ))}
        </div>
        {errors.scheme ? (
          <p role="alert" className="mt-1 text-sm font-medium text-breach-700">
            {errors.scheme.message}
          </p>
        ) : null}
      </fieldset>

      <TextField
        label="Only within N weeks of a meet (optional)"
        type="number"
        inputMode="numeric"
        min={1}
        max={16}
        placeholder="Any week"
        hint="For openers and meet rehearsals: the board picks it only this many weeks before an athlete's meet, or closer."
        error={errors.meetPhaseWeeks?.message}
        {...form.register('meetPhaseWeeks', { setValueAs: toOptionalNumber })}
      />

      <TextAreaField label="Notes" rows={3} error={errors.notes?.message} {...form.register('notes')} />

      <div className="flex justify-end gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : current ? 'Save changes' : 'Add variant'}
        </Button>
      </div>
    </form>
  );
}

/** Checkboxes for the equipment known in the library, and a field to add another item. */
function EquipmentPicker({
  control,
  known,
  error,
}: {
  control: Control<VariantBody>;
  known: string[];
  error?: string | undefined;
}) {
  const { field } = useController({ control, name: 'equipment' });
  const value = field.value ?? [];
  const options = [...new Set([...known, ...value])];
  return (
    <fieldset className="rounded-md border border-chalk-300 p-3">
      <legend className="px-1 text-sm font-semibold text-ink-800">Equipment needed</legend>
      {options.length === 0 ? <p className="text-sm text-ink-500">None yet: add an item below.</p> : null}
      <CheckboxGroup options={options} value={value} onChange={field.onChange} />
      <div className="mt-2">
        <AddItemField
          label="Other equipment"
          button="Add item"
          onAdd={(item) => field.onChange(value.includes(item) ? value : [...value, item])}
        />
      </div>
      {error ? (
        <p role="alert" className="mt-1 text-sm font-medium text-breach-700">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
