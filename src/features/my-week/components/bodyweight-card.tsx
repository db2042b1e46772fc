// Bodyweight: the day's reading, the weight class it falls in, and a caution when the gain in the last
// week before a meet passes the team's line (common practice, not a rule).
import { DIVISION_LABEL } from '../../../../shared/labels';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import { bodyweightForm, type BodyweightFormValues, type BodyweightState } from '../../../../shared/schemas';
import { OnDemand } from './on-demand';
import { TOUCH } from './touch';
import { Button } from '../../../components/ui/button';
import { TextField, WeightField } from '../../../components/ui/field';
import { WarningIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useLogBodyweight } from '../api/use-log-bodyweight';

type FormValues = BodyweightFormValues;

function signed(kg: number, unit: WeightUnit): string {
  const text = formatWeight(Math.abs(kg), unit, { decimals: 1 });
  return kg > 0 ? `+${text}` : kg < 0 ? `−${text}` : text;
}

export function BodyweightCard({
  bodyweight: bw,
  unit,
  today,
  meet,
}: {
  bodyweight: BodyweightState;
  unit: WeightUnit;
  today: string;
  meet: { name: string; date: string; daysOut: number } | null;
}) {
  const save = useLogBodyweight();
  const form = useForm<FormValues, unknown, z.output<typeof bodyweightForm>>({
    resolver: zodResolver(bodyweightForm),
    defaultValues: { unit, weight: '', measuredOn: today },
  });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await save.mutateAsync(values);
      form.reset({ unit, weight: '', measuredOn: values.measuredOn });
    } catch (err) {
      if (isApiError(err)) {
        for (const [k, v] of Object.entries(err.fields)) {
          form.setError((k === 'params.measuredOn' ? 'measuredOn' : k) as keyof FormValues, { message: v[0] });
        }
      }
    }
  });

  return (
    <section
      aria-labelledby="bw-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-chalk-50 p-4"
    >
      <h2 id="bw-heading" className="text-xl font-bold text-ink-900">
        Bodyweight
      </h2>
      <dl className="grid grid-cols-2 gap-2">
        <div className="rounded-md bg-chalk-100 px-3 py-2">
          <dt className="text-sm text-ink-600">Latest</dt>
          <dd className="font-semibold text-ink-900">
            {bw.latest ? (
              <>
                {formatWeight(bw.latest.weightKg, unit, { decimals: 1 })}
                <span className="block text-sm font-normal text-ink-600">{bw.latest.measuredOn}</span>
              </>
            ) : (
              'No reading yet'
            )}
          </dd>
        </div>
        <div className="rounded-md bg-chalk-100 px-3 py-2">
          <dt className="text-sm text-ink-600">Weight class ({DIVISION_LABEL[bw.division].toLowerCase()})</dt>
          <dd className="font-semibold text-ink-900" data-testid="weight-class">
            {bw.weightClass ? `${bw.weightClass} kg` : '—'}
            {bw.enteredClass && bw.enteredClass !== bw.weightClass ? (
              <span className="block text-sm font-normal text-ink-600">entered in {bw.enteredClass} kg</span>
            ) : null}
          </dd>
        </div>
        <div className="col-span-2 rounded-md bg-chalk-100 px-3 py-2">
          <dt className="text-sm text-ink-600">Change over 7 days</dt>
          <dd className="font-semibold text-ink-900">
            {bw.change7d
              ? `${signed(bw.change7d.gainKg, unit)} (${bw.change7d.fromDate} → ${bw.change7d.toDate})`
              : 'Needs two readings a few days apart'}
          </dd>
        </div>
      </dl>
      {bw.caution ? (
        <div
          role="alert"
          className="flex gap-2 rounded-md border border-caution-600/50 bg-caution-100 p-3 text-ink-900"
        >
          <WarningIcon className="mt-0.5 shrink-0 text-caution-700" />
          <p>
            <strong>Fast gain before the meet:</strong> {signed(bw.caution.gainKg, unit)} in the last week, more than
            your team's line of {formatWeight(bw.thresholdKg, unit, { decimals: 1 })}, with {bw.caution.meetName} on{' '}
            {bw.caution.meetDate}. Gaining quickly right before a meet changes your leverages and loads the tendons
            more; coaches usually advise against it. This is common practice, not a rule: talk it over with your coach.
          </p>
        </div>
      ) : meet && meet.daysOut >= 0 ? (
        <p className="text-sm text-ink-600">
          {meet.name} on {meet.date}. In the last week before it you get a caution if you gain more than{' '}
          {formatWeight(bw.thresholdKg, unit, { decimals: 1 })} in 7 days (common practice, not a rule).
        </p>
      ) : null}
      <OnDemand openLabel="Log bodyweight" closeLabel="Close the bodyweight form">
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label="Log bodyweight">
          {save.data?.sent ? <Notice tone="success">Bodyweight saved.</Notice> : null}
          {save.data && !save.data.sent ? (
            <Notice>No signal: the reading is kept on this phone and sent when you are back online.</Notice>
          ) : null}
          <div className="grid grid-cols-2 gap-3">
            <TextField
              style={TOUCH}
              label="Day"
              type="date"
              max={today}
              error={errors.measuredOn?.message}
              {...form.register('measuredOn')}
            />
            <WeightField style={TOUCH} unit={unit} error={errors.weight?.message} {...form.register('weight')} />
          </div>
          <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting}>
            {form.formState.isSubmitting ? 'Saving…' : 'Save bodyweight'}
          </Button>
        </form>
      </OnDemand>
    </section>
  );
}
