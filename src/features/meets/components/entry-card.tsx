// One athlete's entry in a meet: weight class (with the class their latest bodyweight falls in),
// division, and three attempts per lift in kg, which can be planned from the current e1RM.
import { DIVISION_LABEL, LIFT_NAME } from '../../../../shared/labels';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { z } from 'zod';
import { WEIGHT_CLASSES } from '../../../../shared/calc';
import {
  ATTEMPT_FRACTIONS,
  COMPETITION_LIFTS,
  FRESH_MAX_WEEKS,
  meetEntryPatchBody,
  suggestAttempts,
  type CompetitionLift,
  type MeetEntry,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { LabelledOptions, SelectField } from '../../../components/ui/field';
import { WarningIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { applyFieldErrors } from '../../../lib/form-errors';
import { useRemoveEntry, useUpdateEntry } from '../api/use-save-entry';
import { dateText } from './when';

const ATTEMPT_LABEL = ['Opener', 'Second', 'Third'] as const;
const PERCENTS = ATTEMPT_FRACTIONS.map((f) => `${Math.round(f * 100)}%`).join(', ');

type Attempts = Partial<Record<CompetitionLift, (number | undefined)[]>>;

/** Empty attempt boxes are left out, and a lift with none planned is dropped, before the shared checks. */
function dropEmpty(v: unknown) {
  if (!v || typeof v !== 'object') return v;
  const input = v as { attempts?: Attempts };
  const attempts: Record<string, number[]> = {};
  for (const lift of COMPETITION_LIFTS) {
    const list = (input.attempts?.[lift] ?? []).filter((x): x is number => typeof x === 'number' && !Number.isNaN(x));
    if (list.length) attempts[lift] = list;
  }
  return { ...input, attempts };
}
type EntryValues = ReturnType<typeof valuesOf>;
type EntryOutput = z.output<typeof meetEntryPatchBody>;
const sharedResolver = zodResolver(meetEntryPatchBody);
const entryResolver: Resolver<EntryValues, unknown, EntryOutput> = (values, context, options) =>
  sharedResolver(dropEmpty(values) as never, context, options as never) as never;

const optionalKg = (v: unknown) => {
  if (v === '' || v === null || v === undefined) return undefined;
  return Number(String(v).replace(',', '.'));
};

function valuesOf(e: MeetEntry) {
  return {
    weightClass: e.weightClass,
    division: e.division,
    attempts: Object.fromEntries(
      COMPETITION_LIFTS.map((l) => [l, [0, 1, 2].map((i) => e.attempts[l]?.[i])]),
    ) as Attempts,
    version: e.version,
  };
}

export function EntryCard({ entry, meetId }: { entry: MeetEntry; meetId: number }) {
  const update = useUpdateEntry(meetId);
  const withdraw = useRemoveEntry(meetId);
  const [notice, setNotice] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);
  const form = useForm<EntryValues, unknown, EntryOutput>({ resolver: entryResolver, defaultValues: valuesOf(entry) });
  const { errors, isSubmitting, isDirty } = form.formState;
  const division = useWatch({ control: form.control, name: 'division' }) ?? entry.division;
  const classes = WEIGHT_CLASSES[entry.athlete.sex][division];
  const suggested = entry.latestBodyweight ? entry.suggestedClass : null;

  const onSubmit = form.handleSubmit(async (values) => {
    setNotice(null);
    try {
      const saved = await update.mutateAsync({ id: entry.id, body: values });
      form.reset(valuesOf(saved));
      setNotice({ tone: 'success', text: 'Entry saved.' });
    } catch (err) {
      const theirs = staleSaveCurrent<MeetEntry>(err);
      if (theirs && isApiError(err)) {
        form.reset(valuesOf(theirs));
        setNotice({ tone: 'error', text: err.message });
        return;
      }
      if (!applyFieldErrors(err, form.setError, (f) => f.replace(/^(attempts\.\w+)\.\d+$/, '$1'))) {
        setNotice({ tone: 'error', text: err instanceof Error ? err.message : 'The entry could not be saved.' });
      }
    }
  });

  const plan = (lift: CompetitionLift) => {
    const max = entry.currentMax[lift];
    if (!max) return;
    suggestAttempts(max.e1rmKg).forEach((kg, i) =>
      form.setValue(`attempts.${lift}.${i}`, kg, { shouldDirty: true, shouldValidate: true }),
    );
  };

  const liftError = (lift: CompetitionLift) => {
    const e = errors.attempts?.[lift] as
      { message?: string; [i: number]: { message?: string } | undefined } | undefined;
    return e?.message ?? [0, 1, 2].map((i) => e?.[i]?.message).find(Boolean);
  };

  return (
    <article aria-label={entry.athlete.name} className="rounded-lg border border-chalk-300 bg-chalk-50 p-4">
      <form
        onSubmit={onSubmit}
        noValidate
        className="flex flex-col gap-3"
        aria-label={`Entry of ${entry.athlete.name}`}
      >
        <header className="flex flex-wrap items-baseline justify-between gap-2">
          <h3 className="text-lg font-bold">{entry.athlete.name}</h3>
          <p className="text-sm text-ink-700">
            {entry.latestBodyweight
              ? `${entry.latestBodyweight.weightKg} kg on ${dateText(entry.latestBodyweight.measuredOn)} · in the ${suggested} kg class by that`
              : 'No bodyweight logged yet'}
          </p>
        </header>
        {notice ? <Notice tone={notice.tone}>{notice.text}</Notice> : null}
        <div className="grid max-w-xl gap-3 sm:grid-cols-2">
          <SelectField
            label="Weight class (kg)"
            error={errors.weightClass?.message}
            {...form.register('weightClass', { setValueAs: (v) => (v ? v : null) })}
          >
            <option value="">Not chosen yet</option>
            {classes.map((c) => (
              <option key={c} value={c}>
                {c}
                {c === suggested ? ' (latest bodyweight)' : ''}
              </option>
            ))}
          </SelectField>
          <SelectField label="Division" error={errors.division?.message} {...form.register('division')}>
            <LabelledOptions labels={DIVISION_LABEL} />
          </SelectField>
        </div>

        <fieldset className="overflow-x-auto">
          <legend className="mb-1 text-sm font-semibold text-ink-800">Attempts (kg)</legend>
          <table className="w-full text-left text-sm">
            <thead>
              <tr>
                <th scope="col" className="py-1 pr-2">
                  <span className="sr-only">Lift</span>
                </th>
                {ATTEMPT_LABEL.map((a) => (
                  <th key={a} scope="col" className="px-1 py-1 font-semibold">
                    {a}
                  </th>
                ))}
                <th scope="col" className="py-1 pl-2 font-semibold">
                  Current e1RM
                </th>
              </tr>
            </thead>
            <tbody>
              {COMPETITION_LIFTS.map((lift) => {
                const max = entry.currentMax[lift];
                const err = liftError(lift);
                return (
                  <tr key={lift} className="align-top">
                    <th scope="row" className="py-1 pr-2 font-semibold">
                      {LIFT_NAME[lift]}
                    </th>
                    {ATTEMPT_LABEL.map((label, i) => (
                      <td key={label} className="px-1 py-1">
                        <input
                          aria-label={`${LIFT_NAME[lift]} ${label.toLowerCase()} (kg)`}
                          inputMode="decimal"
                          aria-invalid={err ? true : undefined}
                          className={`w-20 rounded-md border bg-chalk-50 px-2 py-1.5 text-base tabular-nums ${err ? 'border-breach-600' : 'border-ink-300'}`}
                          {...form.register(`attempts.${lift}.${i}`, { setValueAs: optionalKg })}
                        />
                      </td>
                    ))}
                    <td className="py-1 pl-2">
                      {max ? (
                        <span className="flex flex-wrap items-center gap-2">
                          <span>
                            {max.e1rmKg} kg{' '}
                            <span className="text-ink-600">
                              from {max.variantName}, {max.weightKg} kg × {max.reps}
                              {max.rpe !== null ? ` at RPE ${max.rpe}` : ''} on {dateText(max.performedOn)}
                              {max.competitionLift ? '' : ' (a close variant, not the competition lift)'}
                            </span>
                            {max.stale ? (
                              <span role="note" className="mt-1 flex items-center gap-1 text-caution-700">
                                <WarningIcon width={14} height={14} className="shrink-0" />
                                Older than {FRESH_MAX_WEEKS} weeks: plan from a fresh top set if you can.
                              </span>
                            ) : null}
                          </span>
                          <Button size="sm" variant="ghost" onClick={() => plan(lift)}>
                            Plan from e1RM
                          </Button>
                        </span>
                      ) : (
                        <span className="text-ink-500">No recent top set close to the lift</span>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {COMPETITION_LIFTS.map((lift) =>
            liftError(lift) ? (
              <p key={lift} role="alert" className="text-sm font-medium text-breach-700">
                {LIFT_NAME[lift]}: {liftError(lift)}
              </p>
            ) : null,
          )}
          <p className="mt-1 flex gap-1 text-xs text-ink-600">
            <WarningIcon className="mt-0.5 shrink-0" width={14} height={14} />
            Plan from e1RM uses common practice, not a published rule: about {PERCENTS} of the current e1RM, rounded
            down to 2.5 kg, each attempt at least 2.5 kg over the one before. The e1RM counts reps in reserve from the
            RPE; sets with chains or bands do not count. Check it against how the athlete has been moving.
          </p>
        </fieldset>

        <div className="flex flex-wrap justify-end gap-2">
          <Button
            variant="ghost"
            onClick={() => withdraw.mutate({ id: entry.id, athleteId: entry.athlete.id })}
            disabled={withdraw.isPending}
          >
            Withdraw from meet
          </Button>
          <Button type="submit" disabled={isSubmitting || !isDirty}>
            Save entry
          </Button>
        </div>
      </form>
    </article>
  );
}
