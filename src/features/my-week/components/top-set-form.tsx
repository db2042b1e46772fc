// Log the day's top set: weight in the athlete's unit, reps, RPE and a note, with the e1RM shown live
// and a new record for the variant marked; an optional video uploads once the set is saved.
import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { RPE_VALUES, formatWeight, liveEstimate, type WeightUnit } from '../../../../shared/calc';
import {
  logTopSetBody,
  type LogTopSetBody,
  type LogTopSetInput,
  type LoggedTopSet,
  type MyWeekPick,
} from '../../../../shared/schemas';
import { TOUCH } from './touch';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField, WeightField } from '../../../components/ui/field';
import { CleanIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useLogTopSet } from '../api/use-log-top-set';
import { VIDEO_ACCEPT, VideoUpload } from './video-upload';

type FormValues = LogTopSetBody;

export function TopSetForm({ pick, unit }: { pick: MyWeekPick; unit: WeightUnit }) {
  const logTopSet = useLogTopSet();
  const videoId = useId();
  const [video, setVideo] = useState<File | null>(null);
  const [result, setResult] = useState<
    { logged: LoggedTopSet; video: File | null } | { kept: true; video: File | null } | null
  >(null);
  const form = useForm<FormValues, unknown, LogTopSetInput>({
    resolver: zodResolver(logTopSetBody),
    defaultValues: {
      planEntryId: pick.planEntryId,
      unit,
      weight: '',
      reps: String(pick.schemeReps),
      rpe: '',
      note: '',
    },
  });
  const { errors } = form.formState;
  const [weight, reps, rpe] = useWatch({ control: form.control, name: ['weight', 'reps', 'rpe'] });
  const typedRpe = String(rpe ?? '').trim() === '' ? null : Number(String(rpe).replace(',', '.'));
  const live = liveEstimate(
    Number(String(weight ?? '').replace(',', '.')),
    Number(reps),
    unit,
    pick.record.bestE1rm?.e1rmKg,
    typedRpe,
  );

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const out = await logTopSet.mutateAsync({
        ...values,
        label: `Top set: ${pick.variant.name}, ${values.reps} × ${values.weight} ${values.unit}`,
      });
      setResult(out.sent ? { logged: out.answer, video } : { kept: true, video });
      setVideo(null);
      form.reset({ ...form.getValues(), weight: '', rpe: '', note: '' });
    } catch (err) {
      if (isApiError(err)) {
        for (const [k, v] of Object.entries(err.fields)) {
          form.setError(k as keyof FormValues, { message: v[0] });
        }
      }
    }
  });

  const serverError =
    logTopSet.error && !(isApiError(logTopSet.error) && Object.keys(logTopSet.error.fields).length > 0)
      ? logTopSet.error.message
      : null;

  return (
    <div className="flex flex-col gap-4">
      {result && 'logged' in result ? <LoggedResult result={result} unit={unit} /> : null}
      {result && 'kept' in result ? (
        <p className="rounded-md border border-ink-300 bg-chalk-200 p-3 font-semibold text-ink-900" role="status">
          No signal: the top set is kept on this phone and sent when you are back online (see Waiting to send).
          {result.video ? ' Add the video once it has been sent.' : ''}
        </p>
      ) : null}
      <form
        onSubmit={onSubmit}
        noValidate
        className="flex flex-col gap-3"
        aria-label={`Log top set: ${pick.variant.name}`}
      >
        {serverError ? <Notice tone="error">{serverError}</Notice> : null}
        <div className="grid grid-cols-2 gap-3">
          <WeightField style={TOUCH} unit={unit} error={errors.weight?.message} {...form.register('weight')} />
          <TextField
            style={TOUCH}
            label="Reps"
            inputMode="numeric"
            error={errors.reps?.message}
            {...form.register('reps')}
          />
        </div>
        <SelectField
          style={TOUCH}
          label="RPE (optional)"
          error={errors.rpe?.message}
          hint="10 = nothing left, 9 = one more rep was there"
          {...form.register('rpe')}
        >
          <option value="">Not rated</option>
          {RPE_VALUES.map((v) => (
            <option key={v} value={String(v)}>
              RPE {v}
            </option>
          ))}
        </SelectField>
        <TextAreaField label="Note (optional)" rows={2} error={errors.note?.message} {...form.register('note')} />
        <div className="flex flex-col gap-1">
          <label htmlFor={videoId} className="text-sm font-semibold text-ink-800">
            Video (optional)
          </label>
          <input
            id={videoId}
            type="file"
            accept={VIDEO_ACCEPT}
            onChange={(e) => setVideo(e.target.files?.[0] ?? null)}
            className="block w-full text-base text-ink-800 file:mr-3 file:min-h-11 file:rounded-md file:border file:border-ink-600 file:bg-chalk-50 file:px-4 file:font-semibold file:text-ink-900"
          />
          <p className="text-sm text-ink-500">MP4, MOV or WebM, up to 200 MB. It uploads once the set is saved.</p>
        </div>
        <LivePanel live={live} unit={unit} />
        <Button type="submit" size="lg" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Log top set'}
        </Button>
      </form>
    </div>
  );
}

function LivePanel({ live, unit }: { live: ReturnType<typeof liveEstimate>; unit: WeightUnit }) {
  return (
    <div aria-live="polite" className="rounded-md border border-ink-200 bg-chalk-100 px-3 py-2">
      {live ? (
        <p className="flex flex-wrap items-baseline gap-x-3">
          <span className="text-sm text-ink-600">e1RM</span>
          <span className="text-2xl font-bold text-ink-900 tabular-nums" data-testid="live-e1rm">
            {formatWeight(live.e1rmKg, unit, { decimals: 1 })}
          </span>
          {live.beatsRecord ? (
            <span className="inline-flex items-center gap-1 text-sm font-semibold text-clean-700">
              <CleanIcon /> {live.firstOnVariant ? 'First mark on this variant' : 'Beats your record'}
            </span>
          ) : (
            <span className="text-sm text-ink-600">below your record</span>
          )}
        </p>
      ) : (
        <p className="text-sm text-ink-600">
          Enter weight and reps to see the e1RM (Epley; an RPE adds the reps you had left).
        </p>
      )}
    </div>
  );
}

function LoggedResult({ result, unit }: { result: { logged: LoggedTopSet; video: File | null }; unit: WeightUnit }) {
  const { logged } = result;
  const s = logged.topSet;
  return (
    <div className="flex flex-col gap-3 rounded-md border border-clean-600/50 bg-clean-100 p-3" role="status">
      <p className="flex items-center gap-2 text-lg font-bold text-clean-700">
        <CleanIcon />
        {logged.firstOnVariant
          ? 'Logged: your first mark on this variant'
          : logged.newRecord
            ? 'New record on this variant'
            : 'Top set logged'}
      </p>
      <p className="text-ink-800">
        {s.reps} × {formatWeight(s.weightKg, unit, { decimals: 1 })} · e1RM{' '}
        {formatWeight(s.e1rmKg, unit, { decimals: 1 })}
        {logged.previousBest && logged.newRecord
          ? ` (was ${formatWeight(logged.previousBest.e1rmKg, unit, { decimals: 1 })})`
          : ''}
        {logged.newHeaviest && !logged.firstOnVariant ? ' · heaviest weight on this variant' : ''}
      </p>
      {result.video ? <VideoUpload topSetId={s.id} file={result.video} /> : null}
    </div>
  );
}
