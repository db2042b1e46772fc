// Add or edit a meet: name, date, place, federation, classic or equipped, and notes.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { meetBody, type Meet, type MeetBody } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { applyFieldErrors } from '../../../lib/form-errors';
import { useCreateMeet, useUpdateMeet } from '../api/use-save-meet';

export function MeetForm({ meet, onSaved }: { meet: Meet | null; onSaved: (m: Meet, conflict?: string) => void }) {
  const create = useCreateMeet();
  const update = useUpdateMeet();
  const form = useForm({
    resolver: zodResolver(meetBody),
    defaultValues: {
      name: meet?.name ?? '',
      date: meet?.date ?? '',
      location: meet?.location ?? '',
      federation: meet?.federation ?? '',
      notes: meet?.notes ?? '',
      equipment: meet?.equipment ?? 'classic',
    } satisfies MeetBody,
  });
  const { errors, isSubmitting } = form.formState;
  const failure = create.error ?? update.error;
  const generic = failure && !isApiError(failure, 409) && !(isApiError(failure) && Object.keys(failure.fields).length);
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      onSaved(
        meet
          ? await update.mutateAsync({ id: meet.id, body: { ...values, version: meet.version } })
          : await create.mutateAsync(values),
      );
    } catch (err) {
      const theirs = staleSaveCurrent<Meet>(err);
      if (theirs && isApiError(err)) {
        onSaved(theirs, err.message);
        return;
      }
      applyFieldErrors(err, form.setError);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label={meet ? 'Edit meet' : 'New meet'}>
      {generic ? <Notice tone="error">{failure.message}</Notice> : null}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Date" type="date" error={errors.date?.message} {...form.register('date')} />
        <TextField
          label="Federation"
          autoComplete="off"
          error={errors.federation?.message}
          {...form.register('federation')}
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Location"
          autoComplete="off"
          error={errors.location?.message}
          {...form.register('location')}
        />
        <SelectField
          label="Equipment (for GL points)"
          error={errors.equipment?.message}
          {...form.register('equipment')}
        >
          <option value="classic">Classic (no supportive suits or shirts)</option>
          <option value="equipped">Equipped</option>
        </SelectField>
      </div>
      <TextAreaField label="Notes" rows={3} error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex justify-end">
        <Button type="submit" disabled={isSubmitting}>
          {meet ? 'Save meet' : 'Add meet'}
        </Button>
      </div>
    </form>
  );
}
