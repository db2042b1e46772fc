// The head coach's invite form: an address, coach or athlete, and for an athlete either an existing
// roster entry without an account or a new entry (name and competition category).
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery } from '@tanstack/react-query';
import { useForm, useWatch } from 'react-hook-form';
import {
  createInvitationBody,
  type CreateInvitationBody,
  type CreateInvitationInput,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { EmailField, SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { applyFieldErrors } from '../../../lib/form-errors';
import { linkableAthletesQueryOptions } from '../api/queries';
import { useCreateInvitation } from '../api/use-create-invitation';

const EMPTY: CreateInvitationInput = { email: '', role: 'athlete', athleteId: null, athleteName: '', sex: null };

export function InviteForm() {
  const create = useCreateInvitation();
  const linkable = useQuery(linkableAthletesQueryOptions());
  const form = useForm<CreateInvitationInput, unknown, CreateInvitationBody>({
    resolver: zodResolver(createInvitationBody),
    defaultValues: EMPTY,
  });
  const { errors, isSubmitting } = form.formState;
  const role = useWatch({ control: form.control, name: 'role' });
  const athleteId = useWatch({ control: form.control, name: 'athleteId' });

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await create.mutateAsync(values);
      form.reset(EMPTY);
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Invite by e-mail">
      {create.isSuccess ? (
        <Notice tone="success">Invitation sent to {create.data.email}. The link works once, for 7 days.</Notice>
      ) : null}
      {create.error && !Object.keys(errors).length ? <Notice tone="error">{create.error.message}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <EmailField autoComplete="off" error={errors.email?.message} {...form.register('email')} />
        <fieldset className="flex flex-col gap-1">
          <legend className="text-sm font-semibold text-ink-800">Joins as</legend>
          <div className="flex gap-4 pt-2">
            {(['athlete', 'coach'] as const).map((r) => (
              <label key={r} className="flex min-h-11 items-center gap-2 text-ink-900">
                <input type="radio" value={r} className="size-4 accent-rust-500" {...form.register('role')} />
                {r === 'athlete' ? 'Athlete' : 'Coach'}
              </label>
            ))}
          </div>
          {errors.role ? (
            <p role="alert" className="text-sm font-medium text-breach-700">
              {errors.role.message}
            </p>
          ) : null}
        </fieldset>
      </div>
      {role === 'athlete' ? (
        <div className="grid gap-4 sm:grid-cols-3">
          <SelectField
            label="Roster entry"
            hint="Someone already on the roster without an account, or a new entry."
            error={errors.athleteId?.message}
            {...form.register('athleteId', { setValueAs: (v) => (v === '' || v === null ? null : Number(v)) })}
          >
            <option value="">New roster entry</option>
            {(linkable.data?.items ?? []).map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </SelectField>
          {athleteId === null || athleteId === undefined ? (
            <>
              <TextField
                label="Athlete’s name"
                autoComplete="off"
                error={errors.athleteName?.message}
                {...form.register('athleteName')}
              />
              <SelectField
                label="Competes in"
                error={errors.sex?.message}
                {...form.register('sex', { setValueAs: (v) => (v === '' || v === null ? null : v) })}
              >
                <option value="">Choose…</option>
                <option value="F">Women’s classes (F)</option>
                <option value="M">Men’s classes (M)</option>
              </SelectField>
            </>
          ) : null}
        </div>
      ) : null}
      <div>
        {/* Secondary: the page's one rust action belongs to the page itself. */}
        <Button type="submit" variant="secondary" disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
    </form>
  );
}
