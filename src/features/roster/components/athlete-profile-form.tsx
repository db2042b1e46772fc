// An athlete's profile: name, sex, birth year, division, level, the account it is linked to, and notes.
// Used to add an athlete and to edit one; checked by the same schema as the server.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { athleteBody, type Athlete, type AthleteBody } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { LabelledOptions, SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { applyFieldErrors } from '../../../lib/form-errors';
import { accountsOptions } from '../api/queries';
import { useCreateAthlete, useUpdateAthlete } from '../api/use-save-athlete';
import { DIVISION_LABEL, MAX_RISK_LABEL } from './labels';

const optionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

function valuesOf(a: Athlete | null): AthleteBody {
  return {
    name: a?.name ?? '',
    sex: a?.sex ?? 'F',
    birthYear: a?.birthYear ?? null,
    division: a?.division ?? 'open',
    maxRisk: a?.maxRisk ?? null,
    notes: a?.notes ?? '',
    userId: a?.account?.id ?? null,
  };
}

export function AthleteProfileForm({
  athlete,
  onSaved,
  onConflict,
}: {
  athlete: Athlete | null;
  onSaved: (a: Athlete) => void;
  /** Someone else saved first: their version is passed up and shown. */
  onConflict?: (current: Athlete, message: string) => void;
}) {
  const accounts = useQuery(accountsOptions());
  const create = useCreateAthlete();
  const update = useUpdateAthlete();
  const form = useForm({ resolver: zodResolver(athleteBody), defaultValues: valuesOf(athlete) });
  const { errors, isSubmitting, isDirty } = form.formState;
  const failure = create.error ?? update.error;
  const generic = failure && !isApiError(failure, 409) && !(isApiError(failure) && Object.keys(failure.fields).length);
  const free = (accounts.data?.items ?? []).filter((u) => u.athleteId === null || u.athleteId === athlete?.id);

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      // The equipment and rule overrides are edited on their own panels.
      const { equipment: _e, ruleOverrides: _r, ...profile } = values;
      const saved = athlete
        ? await update.mutateAsync({ id: athlete.id, body: { ...profile, version: athlete.version } })
        : await create.mutateAsync(values);
      onSaved(saved);
    } catch (err) {
      const theirs = staleSaveCurrent<Athlete>(err);
      if (theirs && isApiError(err) && onConflict) {
        onConflict(theirs, err.message);
        return;
      }
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-3"
      aria-label={athlete ? 'Profile' : 'New athlete'}
    >
      {generic ? <Notice tone="error">{failure.message}</Notice> : null}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="Competes with" error={errors.sex?.message} {...form.register('sex')}>
          <option value="F">Women</option>
          <option value="M">Men</option>
        </SelectField>
        <TextField
          label="Birth year"
          type="number"
          inputMode="numeric"
          error={errors.birthYear?.message}
          {...form.register('birthYear', { setValueAs: optionalNumber })}
        />
        <SelectField label="Division" error={errors.division?.message} {...form.register('division')}>
          <LabelledOptions labels={DIVISION_LABEL} />
        </SelectField>
        <SelectField
          label="Heaviest risk allowed"
          hint="The board never picks a variant of a higher risk tier for this athlete."
          error={errors.maxRisk?.message}
          {...form.register('maxRisk', { setValueAs: optionalNumber })}
        >
          <option value="">No ceiling</option>
          <LabelledOptions labels={MAX_RISK_LABEL} />
        </SelectField>
      </div>
      <SelectField
        label="Account"
        hint="The athlete signs in with this account to see their week."
        error={errors.userId?.message}
        {...form.register('userId', { setValueAs: optionalNumber })}
      >
        <option value="">No account linked</option>
        {free.map((u) => (
          <option key={u.id} value={u.id}>
            {u.name} ({u.email})
          </option>
        ))}
      </SelectField>
      <TextAreaField label="Notes" rows={3} error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex justify-end">
        <Button type="submit" disabled={isSubmitting || (athlete !== null && !isDirty)}>
          {isSubmitting ? 'Saving…' : athlete ? 'Save profile' : 'Add athlete'}
        </Button>
      </div>
    </form>
  );
}
