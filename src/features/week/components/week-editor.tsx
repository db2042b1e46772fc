// The coach's view of one athlete's week beside the Board: every session but the max-effort pick, with
// the speed work (percentage of the training max, sets × reps, bands or chains), accessories with
// sets × reps and a load or an RPE target, the training-max share and the deload mark.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import {
  useFieldArray,
  useForm,
  useWatch,
  type Control,
  type FieldErrors,
  type UseFormRegister,
  type UseFormSetValue,
} from 'react-hook-form';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { formatWeight } from '../../../../shared/calc';
import {
  ACCESSORY_CATEGORIES,
  ACCESSORY_CATEGORY_LABELS,
  SESSION_PART_LABELS,
  WEEKDAY_LABELS,
  athleteWeekBody,
  type AccessoryCategory,
  type AthleteWeek,
  type AthleteWeekBody,
  type LibraryAccessory,
  type SessionLog,
  type WeekSession,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { LabelledOptions, SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { accessorySuggestionOptions, weekAccessoryLibraryOptions } from '../api/queries';
import { useSaveWeek } from '../api/use-save-week';

type Values = AthleteWeekBody;
const num = { valueAsNumber: true } as const;
/** An empty number box means "none" for an optional load or RPE. */
const optionalNum = { setValueAs: (v: unknown) => (v === '' || v === null ? null : Number(v)) } as const;

function valuesOf(w: AthleteWeek): Values {
  return { version: w.version, deload: w.deload, trainingMaxPct: w.trainingMaxPct, sessions: structuredClone(w.work) };
}

type Errs = FieldErrors<Values>;
function errorAt(errors: Errs, path: string): string | undefined {
  let node: unknown = errors;
  for (const k of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[k];
  return (node as { message?: string } | undefined)?.message;
}

/** The library's accessories for a picker: those in use, and the one already chosen even when archived. */
function libraryOptions(library: readonly LibraryAccessory[], chosen: number | null | undefined) {
  const groups = new Map<string, LibraryAccessory[]>();
  for (const a of library) {
    if (a.archived && a.id !== chosen) continue;
    groups.set(a.category, [...(groups.get(a.category) ?? []), a]);
  }
  return [...groups].map(([category, list]) => (
    <optgroup key={category} label={ACCESSORY_CATEGORY_LABELS[category as AccessoryCategory] ?? category}>
      {list.map((a) => (
        <option key={a.id} value={a.id}>
          {a.name}
          {a.archived ? ' (archived)' : ''}
        </option>
      ))}
    </optgroup>
  ));
}

function Accessories({
  sessionId,
  control,
  register,
  setValue,
  errors,
  library,
}: {
  sessionId: string;
  control: Control<Values>;
  register: UseFormRegister<Values>;
  setValue: UseFormSetValue<Values>;
  errors: Errs;
  library: readonly LibraryAccessory[];
}) {
  const { fields, append, remove } = useFieldArray({ control, name: `sessions.${sessionId}.accessories` });
  const base = `sessions.${sessionId}.accessories` as const;
  const chosen = useWatch({ control, name: base }) ?? [];
  const pick = (i: number, id: number | null) => {
    const a = library.find((x) => x.id === id);
    if (!a) return;
    // The library's defaults come with the pick; the coach may change them for this week.
    const opts = { shouldDirty: true } as const;
    setValue(`${base}.${i}.name`, a.name, opts);
    setValue(`${base}.${i}.category`, a.category, opts);
    setValue(`${base}.${i}.sets`, a.sets, opts);
    setValue(`${base}.${i}.reps`, a.reps, opts);
    setValue(`${base}.${i}.loadKg`, a.loadKg, opts);
    setValue(`${base}.${i}.rpe`, a.rpe, opts);
  };
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="font-semibold text-ink-900">Accessories</legend>
      {fields.length === 0 ? <p className="text-sm text-ink-600">None yet.</p> : null}
      {fields.map((f, i) => {
        const id = chosen[i]?.accessoryId ?? null;
        return (
          <div key={f.id} className="grid grid-cols-2 gap-2 rounded-md bg-chalk-100 p-3 sm:grid-cols-6">
            <div className="col-span-2">
              <SelectField
                label="Exercise"
                {...register(`${base}.${i}.accessoryId`, {
                  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v)),
                  onChange: (e: { target: { value: string } }) =>
                    pick(i, e.target.value ? Number(e.target.value) : null),
                })}
                error={errorAt(errors, `${base}.${i}.accessoryId`)}
              >
                <option value="">Typed by hand</option>
                {libraryOptions(library, id)}
              </SelectField>
            </div>
            {id === null ? (
              <>
                <div className="col-span-2">
                  <TextField
                    label="Exercise name"
                    {...register(`${base}.${i}.name`)}
                    error={errorAt(errors, `${base}.${i}.name`)}
                  />
                </div>
                <SelectField label="Category" {...register(`${base}.${i}.category`)}>
                  <LabelledOptions labels={ACCESSORY_CATEGORY_LABELS} values={ACCESSORY_CATEGORIES} />
                </SelectField>
              </>
            ) : null}
            <TextField
              label="Sets"
              type="number"
              inputMode="numeric"
              {...register(`${base}.${i}.sets`, num)}
              error={errorAt(errors, `${base}.${i}.sets`)}
            />
            <TextField
              label="Reps"
              type="number"
              inputMode="numeric"
              {...register(`${base}.${i}.reps`, num)}
              error={errorAt(errors, `${base}.${i}.reps`)}
            />
            <TextField
              label="Load (kg)"
              type="number"
              step="0.5"
              inputMode="decimal"
              {...register(`${base}.${i}.loadKg`, optionalNum)}
              error={errorAt(errors, `${base}.${i}.loadKg`)}
            />
            <TextField
              label="RPE target"
              type="number"
              step="0.5"
              inputMode="decimal"
              {...register(`${base}.${i}.rpe`, optionalNum)}
              error={errorAt(errors, `${base}.${i}.rpe`)}
            />
            <Button variant="ghost" onClick={() => remove(i)} className="self-end">
              Remove
            </Button>
          </div>
        );
      })}
      <Button
        variant="secondary"
        className="self-start"
        onClick={() =>
          append({ accessoryId: null, name: '', category: 'upperBack', sets: 3, reps: 10, loadKg: null, rpe: 8 })
        }
      >
        Add an accessory
      </Button>
    </fieldset>
  );
}

/** What the athlete logged of a session, in one line. */
function logText(session: WeekSession, log: SessionLog | undefined): string {
  if (!log) return 'nothing logged yet.';
  const parts: string[] = [];
  if (session.speed) parts.push(`speed ${log.speedSetsDone} of ${session.speed.sets} sets`);
  session.accessories.forEach((a, i) => parts.push(`${a.name} ${log.accessorySetsDone[i] ?? 0} of ${a.sets}`));
  if (session.parts.includes('maxEffort') && log.backOffDone.length > 0)
    parts.push(`back-off sets ${log.backOffDone.filter(Boolean).length} of ${log.backOffDone.length} ticked`);
  parts.push(log.done ? 'session done' : 'session not marked done');
  return `${parts.join(' · ')}.`;
}

function SessionFields({
  session,
  control,
  register,
  setValue,
  errors,
  library,
  log,
}: {
  session: WeekSession;
  control: Control<Values>;
  register: UseFormRegister<Values>;
  setValue: UseFormSetValue<Values>;
  errors: Errs;
  library: readonly LibraryAccessory[];
  log: SessionLog | undefined;
}) {
  const sp = `sessions.${session.id}.speed` as const;
  return (
    <section
      aria-labelledby={`edit-${session.id}`}
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-chalk-50 p-4"
    >
      <h2 id={`edit-${session.id}`} className="text-lg font-bold text-ink-900">
        {session.name} <span className="text-sm font-normal text-ink-600">· {WEEKDAY_LABELS[session.weekday - 1]}</span>
      </h2>
      <p className="text-sm text-ink-600">{session.parts.map((p) => SESSION_PART_LABELS[p]).join(' · ')}</p>
      <p className="text-sm text-ink-800" data-testid={`log-${session.id}`}>
        <span className="font-semibold">Athlete’s log:</span> {logText(session, log)}
      </p>
      {session.parts.includes('maxEffort') ? (
        <p className="text-sm text-ink-700">The max-effort pick is planned on the Board.</p>
      ) : null}
      {session.speed ? (
        <fieldset className="grid grid-cols-2 gap-2 sm:grid-cols-4">
          <legend className="col-span-full font-semibold text-ink-900">
            Speed · {session.speed.lift}
            {session.speed.barKg !== null
              ? ` · ${formatWeight(session.speed.barKg, 'kg', { decimals: 1 })} on the bar this week`
              : ' · no recent max to load from'}
          </legend>
          <TextField
            label="% of training max"
            type="number"
            step="0.5"
            {...register(`${sp}.pct`, num)}
            error={errorAt(errors, `${sp}.pct`)}
          />
          <TextField
            label="Sets"
            type="number"
            {...register(`${sp}.sets`, num)}
            error={errorAt(errors, `${sp}.sets`)}
          />
          <TextField
            label="Reps"
            type="number"
            {...register(`${sp}.reps`, num)}
            error={errorAt(errors, `${sp}.reps`)}
          />
          <SelectField label="Bands or chains" {...register(`${sp}.accommodation`)}>
            <option value="none">None</option>
            <option value="bands">Bands</option>
            <option value="chains">Chains</option>
          </SelectField>
        </fieldset>
      ) : null}
      {session.parts.includes('accessories') ? (
        <Accessories
          sessionId={session.id}
          control={control}
          register={register}
          setValue={setValue}
          errors={errors}
          library={library}
        />
      ) : null}
    </section>
  );
}

export function WeekEditor({ athleteId, data }: { athleteId: number; data: AthleteWeek }) {
  const save = useSaveWeek(athleteId, data.week);
  const library = useQuery(weekAccessoryLibraryOptions());
  const queryClient = useQueryClient();
  const [suggesting, setSuggesting] = useState(false);
  const [notice, setNotice] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(athleteWeekBody) as never, values: valuesOf(data) });
  const { register, control, formState } = form;
  const errors = formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setNotice(null);
    try {
      await save.mutateAsync(values);
      setNotice({ tone: 'success', text: 'Week saved.' });
    } catch (err) {
      if (isApiError(err)) {
        for (const [k, v] of Object.entries(err.fields)) form.setError(k as never, { message: v[0] });
        setNotice({ tone: 'error', text: err.message });
      }
    }
  });

  /** Fills every accessories part from the rotation's suggestion; the coach reviews and saves. */
  const suggest = async () => {
    setNotice(null);
    setSuggesting(true);
    try {
      const got = await queryClient.fetchQuery(accessorySuggestionOptions(athleteId, data.week));
      const gaps: string[] = [];
      for (const [sessionId, s] of Object.entries(got.sessions)) {
        const accessories = s.accessories.map(({ early: _early, ...a }) => a);
        // Set on the field array's own path, so its rows follow.
        form.setValue(`sessions.${sessionId}.accessories`, accessories, { shouldDirty: true });
        const name = data.sessions.find((x) => x.id === sessionId)?.name ?? sessionId;
        for (const u of s.unfilled) gaps.push(`${name}: ${u.reason}.`);
        for (const a of s.accessories.filter((x) => x.early))
          gaps.push(`${name}: ${a.name} comes back early, as every one of its category was done in the last weeks.`);
      }
      setNotice({
        tone: 'success',
        text:
          `Accessories filled from the library (week ${got.blockWeek} of the rotation block); review them and save the week.` +
          (gaps.length ? ` Worth a look — ${gaps.join(' ')}` : ''),
      });
    } catch (err) {
      setNotice({ tone: 'error', text: err instanceof Error ? err.message : 'The suggestion could not be read.' });
    } finally {
      setSuggesting(false);
    }
  };

  const lifts = (['squat', 'bench', 'deadlift'] as const).map((l) => {
    const m = data.maxes[l];
    return `${l}: ${m ? `${formatWeight(m.e1rmKg, 'kg', { decimals: 1 })} e1RM → ${formatWeight(m.trainingMaxKg, 'kg', { decimals: 1 })}` : 'no recent estimate'}`;
  });

  return (
    <form aria-label={`Training week ${data.week}`} onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      {notice ? <Notice tone={notice.tone}>{notice.text}</Notice> : null}
      <div className="flex flex-wrap items-end gap-4">
        <label className="inline-flex min-h-11 items-center gap-2 font-semibold text-ink-800">
          <input type="checkbox" className="size-4 accent-rust-500" {...register('deload')} />
          Deload week (no max effort, lighter speed and accessory work)
        </label>
        <div className="w-48">
          <TextField
            label="Training max (% of e1RM)"
            type="number"
            {...register('trainingMaxPct', num)}
            error={errorAt(errors, 'trainingMaxPct')}
          />
        </div>
      </div>
      {errorAt(errors, 'deload') ? <Notice tone="error">{errorAt(errors, 'deload')}</Notice> : null}
      <p className="text-sm text-ink-700">Training maxes — {lifts.join(' · ')}</p>
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="secondary" onClick={() => void suggest()} disabled={suggesting}>
          {suggesting ? 'Reading the rotation…' : 'Fill accessories from the rotation'}
        </Button>
        <p className="text-sm text-ink-600">
          Picks from the Accessories library: changed every few weeks, within the joint budgets and restrictions.
        </p>
      </div>
      {data.sessions.map((s) => (
        <SessionFields
          key={s.id}
          session={s}
          control={control}
          register={register}
          setValue={form.setValue}
          errors={errors}
          library={library.data?.items ?? []}
          log={data.logs.find((l) => l.sessionId === s.id)}
        />
      ))}
      <Button type="submit" disabled={save.isPending} className="self-start">
        Save the week
      </Button>
    </form>
  );
}
