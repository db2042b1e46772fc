// An athlete's restrictions, from one day to another: a joint whose stress may not pass a cap, an
// emphasis or whole families to leave out. The planner applies each to the ISO weeks its dates cover.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { JOINTS, type Emphasis } from '../../../../shared/engine/types';
import { emphasisName, jointName } from '../../../../shared/engine/words';
import { dayWeek, restrictionName } from '../../../../shared/planning';
import { restrictionBody, type Athlete, type Restriction, type RestrictionBody } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CheckboxGroup } from '../../../components/ui/choices';
import { SelectField, TextField } from '../../../components/ui/field';
import { CleanIcon, WarningIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { familiesOptions } from '../api/queries';
import { useAddRestriction, useRemoveRestriction, useUpdateRestriction } from '../api/use-save-restriction';
import { STRESS_CAP, capital, formatDate, restrictionText } from './labels';
import { Panel } from './panel';

const today = () => new Date().toISOString().slice(0, 10);

function statusOf(r: Restriction) {
  if (r.active) return { icon: <WarningIcon className="shrink-0 text-caution-700" />, text: 'In force' };
  if (r.fromDate > today())
    return { icon: <WarningIcon className="shrink-0 text-ink-500" />, text: `Starts ${formatDate(r.fromDate)}` };
  return { icon: <CleanIcon className="shrink-0 text-clean-700" />, text: 'Ended' };
}

export function RestrictionsPanel({ athlete }: { athlete: Athlete }) {
  const [editing, setEditing] = useState<Restriction | 'new' | null>(null);
  const [confirming, setConfirming] = useState<number | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const remove = useRemoveRestriction(athlete.id);
  return (
    <Panel
      title="Restrictions"
      actions={
        editing === null ? (
          <Button size="sm" variant="secondary" onClick={() => setEditing('new')}>
            Add restriction
          </Button>
        ) : null
      }
    >
      {message ? <Notice tone="error">{message}</Notice> : null}
      {remove.error ? <Notice tone="error">{remove.error.message}</Notice> : null}
      {athlete.restrictions.length === 0 && editing === null ? (
        <p className="text-ink-600">None: the board may load every joint up to the team budgets.</p>
      ) : null}
      <ul className="flex flex-col divide-y divide-chalk-300">
        {athlete.restrictions.map((r) =>
          editing !== 'new' && editing?.id === r.id ? (
            <li key={r.id} className="py-2">
              <RestrictionForm
                athleteId={athlete.id}
                restriction={r}
                onDone={(m) => {
                  setEditing(null);
                  setMessage(m);
                }}
              />
            </li>
          ) : (
            <li key={r.id} className="flex flex-wrap items-start justify-between gap-2 py-2">
              <div>
                <p className="font-semibold">{restrictionText(r)}</p>
                <p className="flex items-center gap-1 text-sm text-ink-700">
                  {statusOf(r).icon}
                  {statusOf(r).text} · from {formatDate(r.fromDate)}
                  {r.toDate ? ` to ${formatDate(r.toDate)}` : ', no end set'}
                </p>
                <p className="text-sm text-ink-600">
                  Weeks {r.fromWeek}
                  {r.toWeek ? ` to ${r.toWeek}` : ' onwards'}
                </p>
                {r.note ? <p className="text-sm text-ink-600">{r.note}</p> : null}
              </div>
              <div className="flex gap-1">
                <Button
                  size="sm"
                  variant="ghost"
                  aria-label={`Edit ${restrictionName(r)} restriction`}
                  onClick={() => setEditing(r)}
                >
                  Edit
                </Button>
                {confirming === r.id ? (
                  <Button
                    size="sm"
                    variant="danger"
                    onClick={() => remove.mutate(r.id, { onSettled: () => setConfirming(null) })}
                  >
                    Confirm remove
                  </Button>
                ) : (
                  <Button
                    size="sm"
                    variant="ghost"
                    aria-label={`Remove ${restrictionName(r)} restriction`}
                    onClick={() => setConfirming(r.id)}
                  >
                    Remove
                  </Button>
                )}
              </div>
            </li>
          ),
        )}
      </ul>
      {editing === 'new' ? (
        <RestrictionForm
          athleteId={athlete.id}
          restriction={null}
          onDone={(m) => {
            setEditing(null);
            setMessage(m);
          }}
        />
      ) : null}
    </Panel>
  );
}

function RestrictionForm({
  athleteId,
  restriction,
  onDone,
}: {
  athleteId: number;
  restriction: Restriction | null;
  onDone: (conflict: string | null) => void;
}) {
  const add = useAddRestriction(athleteId);
  const update = useUpdateRestriction(athleteId);
  const families = useQuery(familiesOptions());
  const form = useForm({
    resolver: zodResolver(restrictionBody),
    defaultValues: {
      joint: restriction ? restriction.joint : 'elbow',
      maxStress: restriction ? restriction.maxStress : 1,
      emphasis: restriction?.emphasis ?? [],
      families: restriction?.families ?? [],
      fromDate: restriction?.fromDate ?? today(),
      toDate: restriction?.toDate ?? '',
      note: restriction?.note ?? '',
    } satisfies RestrictionBody,
  });
  const { errors, isSubmitting } = form.formState;
  const [fromDate, toDate] = useWatch({ control: form.control, name: ['fromDate', 'toDate'] });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      if (restriction)
        await update.mutateAsync({ id: restriction.id, body: { ...values, version: restriction.version } });
      else await add.mutateAsync(values);
      onDone(null);
    } catch (err) {
      if (isApiError(err, 409)) {
        onDone(`${err.message}`);
        return;
      }
      applyFieldErrors(err, form.setError);
    }
  });
  const familyChoices = [...new Set([...(families.data ?? []), ...(restriction?.families ?? [])])].sort();
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={restriction ? 'Edit restriction' : 'New restriction'}
      className="mt-2 grid gap-3 rounded-md border border-chalk-300 bg-chalk-100 p-3 sm:grid-cols-2"
    >
      <p className="text-sm text-ink-700 sm:col-span-2">
        Restrict a joint, an emphasis, whole families, or any mix of them.
      </p>
      <SelectField
        label="Joint"
        error={errors.joint?.message}
        {...form.register('joint', { setValueAs: (v) => (v ? v : null) })}
      >
        <option value="">No joint cap</option>
        {JOINTS.map((j) => (
          <option key={j} value={j}>
            {capital(jointName(j))}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Highest stress allowed"
        error={errors.maxStress?.message}
        {...form.register('maxStress', { setValueAs: (v) => (v === '' || v === null ? null : Number(v)) })}
      >
        <option value="">No cap</option>
        {STRESS_CAP.map((label, n) => (
          <option key={n} value={n}>
            {label}
          </option>
        ))}
      </SelectField>
      <fieldset className="sm:col-span-2">
        <legend className="text-sm font-semibold text-ink-800">No work with this emphasis</legend>
        <Controller
          control={form.control}
          name="emphasis"
          render={({ field }) => (
            <CheckboxGroup<Emphasis>
              options={EMPHASES}
              value={field.value ?? []}
              onChange={field.onChange}
              label={(e) => capital(emphasisName(e))}
            />
          )}
        />
      </fieldset>
      <fieldset className="sm:col-span-2">
        <legend className="text-sm font-semibold text-ink-800">No variants of these families</legend>
        {familyChoices.length ? (
          <Controller
            control={form.control}
            name="families"
            render={({ field }) => (
              <CheckboxGroup<string>
                options={familyChoices}
                value={field.value ?? []}
                onChange={field.onChange}
                className="flex max-h-48 flex-wrap gap-x-4 gap-y-1 overflow-y-auto rounded border border-chalk-300 bg-chalk-50 p-2"
              />
            )}
          />
        ) : (
          <p className="text-sm text-ink-600">
            {families.isPending ? 'Loading the library…' : 'The library is empty.'}
          </p>
        )}
        {errors.families?.message ? (
          <p role="alert" className="text-sm font-medium text-breach-700">
            {errors.families.message}
          </p>
        ) : null}
      </fieldset>
      <TextField label="From" type="date" error={errors.fromDate?.message} {...form.register('fromDate')} />
      <TextField
        label="To (optional)"
        type="date"
        error={errors.toDate?.message}
        {...form.register('toDate', { setValueAs: (v) => (v ? v : null) })}
      />
      <p className="text-sm text-ink-600 sm:col-span-2" aria-live="polite">
        {weekSpan(fromDate, toDate)}
      </p>
      <div className="sm:col-span-2">
        <TextField label="Note" autoComplete="off" error={errors.note?.message} {...form.register('note')} />
      </div>
      <div className="flex justify-end gap-2 sm:col-span-2">
        <Button variant="secondary" onClick={() => onDone(null)}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {restriction ? 'Save restriction' : 'Add restriction'}
        </Button>
      </div>
    </form>
  );
}

const EMPHASES: readonly Emphasis[] = ['bottom', 'midRange', 'lockout'];
const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** "Planned weeks 2027-W03 to 2027-W06": the weeks the board applies it to. */
function weekSpan(from: string | undefined, to: string | null | undefined): string {
  if (!from || !DATE.test(from)) return '';
  const first = dayWeek(from);
  if (!to || !DATE.test(to)) return `Applies from week ${first} onwards.`;
  if (to < from) return '';
  return `Applies to weeks ${first} to ${dayWeek(to)}.`;
}
