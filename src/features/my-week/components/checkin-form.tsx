// The next-day check-in on a week's connective-tissue work: how sore (0–10), any joint that hurt, a note.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { JOINTS } from '../../../../shared/engine/types';
import { jointName } from '../../../../shared/engine/words';
import { tissueCheckinBody, type MyWeekCheckin, type TissueCheckinBody } from '../../../../shared/schemas';
import { OnDemand } from './on-demand';
import { TOUCH } from './touch';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField } from '../../../components/ui/field';
import { CleanIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useSaveCheckin } from '../api/use-save-checkin';
import { TISSUE_KIND_WORD } from '../../../../shared/labels';

type FormValues = TissueCheckinBody;

const SORENESS = Array.from({ length: 11 }, (_, i) => i);

export function CheckinForm({ weeks, thisWeek }: { weeks: MyWeekCheckin[]; thisWeek: string }) {
  const save = useSaveCheckin();
  const open = weeks.filter((w) => w.kind !== null);
  const form = useForm<FormValues, unknown, z.output<typeof tissueCheckinBody>>({
    resolver: zodResolver(tissueCheckinBody),
    defaultValues: { week: open[0]?.week ?? thisWeek, soreness: '', painJoints: [], note: '' },
  });
  const { errors } = form.formState;
  const done = weeks.flatMap((w) => w.done);

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await save.mutateAsync(values);
      form.reset({ week: values.week, soreness: '', painJoints: [], note: '' });
    } catch (err) {
      if (isApiError(err)) {
        for (const [k, v] of Object.entries(err.fields)) form.setError(k as keyof FormValues, { message: v[0] });
      }
    }
  });

  return (
    <section
      aria-labelledby="checkin-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-chalk-50 p-4"
    >
      <h2 id="checkin-heading" className="text-xl font-bold text-ink-900">
        Next-day check-in
      </h2>
      <p className="text-ink-700">
        The day after your connective-tissue work, say how it feels. Soreness means the dose was too much and the next
        one gets lighter; pain on a joint goes to your coach.
      </p>
      {done.length > 0 ? (
        <ul className="flex flex-col gap-1 text-sm text-ink-800">
          {done.map((c) => (
            <li key={c.id} className="flex items-start gap-2">
              <CleanIcon className="mt-0.5 shrink-0 text-clean-700" />
              <span>
                {c.week}: soreness {c.soreness}/10
                {c.painJoints.length ? `, pain at ${c.painJoints.map(jointName).join(', ')}` : ', no pain'}
                {c.note ? ` — ${c.note}` : ''}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {open.length === 0 ? (
        <p className="text-ink-600">No connective-tissue work to report on this week or last.</p>
      ) : (
        <OnDemand openLabel="Open the check-in" closeLabel="Close the check-in">
          <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label="Next-day check-in">
            {save.data?.sent ? <Notice tone="success">Check-in saved. Thank you.</Notice> : null}
            {save.data && !save.data.sent ? (
              <Notice>No signal: the check-in is kept on this phone and sent when you are back online.</Notice>
            ) : null}
            {save.error && !(isApiError(save.error) && Object.keys(save.error.fields).length) ? (
              <Notice tone="error">{save.error.message}</Notice>
            ) : null}
            <SelectField
              style={TOUCH}
              label="Which week's work"
              error={errors.week?.message}
              {...form.register('week')}
            >
              {open.map((w) => (
                <option key={w.week} value={w.week}>
                  {w.week === thisWeek ? 'This week' : 'Last week'}: {TISSUE_KIND_WORD[w.kind!]}
                </option>
              ))}
            </SelectField>
            <fieldset className="flex flex-col gap-1">
              <legend className="text-sm font-semibold text-ink-800">Soreness today (0 none … 10 worst)</legend>
              <div className="grid grid-cols-6 gap-2 sm:grid-cols-11">
                {SORENESS.map((n) => (
                  <label key={n} className="relative">
                    <input type="radio" value={String(n)} className="peer sr-only" {...form.register('soreness')} />
                    <span className="flex min-h-11 cursor-pointer items-center justify-center rounded-md border border-ink-300 bg-chalk-50 font-semibold text-ink-900 peer-checked:border-ink-900 peer-checked:bg-ink-900 peer-checked:text-chalk-50 peer-focus-visible:outline-3 peer-focus-visible:outline-rust-400">
                      {n}
                    </span>
                  </label>
                ))}
              </div>
              {errors.soreness ? (
                <p role="alert" className="text-sm font-medium text-breach-700">
                  {errors.soreness.message}
                </p>
              ) : null}
            </fieldset>
            <fieldset className="flex flex-col gap-1">
              <legend className="text-sm font-semibold text-ink-800">Pain at a joint (not soreness)</legend>
              <div className="grid grid-cols-2 gap-2 sm:grid-cols-3">
                {JOINTS.map((j) => (
                  <label key={j} className="relative">
                    <input type="checkbox" value={j} className="peer sr-only" {...form.register('painJoints')} />
                    <span className="flex min-h-11 cursor-pointer items-center justify-center rounded-md border border-ink-300 bg-chalk-50 px-2 font-semibold text-ink-900 peer-checked:border-breach-600 peer-checked:bg-breach-100 peer-checked:text-breach-700 peer-focus-visible:outline-3 peer-focus-visible:outline-rust-400">
                      {jointName(j)}
                    </span>
                  </label>
                ))}
              </div>
            </fieldset>
            <TextAreaField label="Note (optional)" rows={2} error={errors.note?.message} {...form.register('note')} />
            <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting}>
              {form.formState.isSubmitting ? 'Saving…' : 'Save check-in'}
            </Button>
          </form>
        </OnDemand>
      )}
    </section>
  );
}
