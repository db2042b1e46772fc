// One lifter on the Meet day screen: weigh-in and class, the three attempts of the chosen lift, the next
// attempt (offered by the rules and the usual jumps, changed a step at a time) with Good and Missed, and
// the running total with DOTS and GL points. Large type and targets: it is read at arm's length.
import { useState } from 'react';
import {
  AGE_GROUP_LABELS,
  ATTEMPT_STEP_KG,
  RECORD_STEP_KG,
  WEIGHT_CLASSES,
  attemptProblem,
  type MeetLift,
} from '../../../../shared/calc';
import type { MeetDay } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CleanIcon, BreakIcon } from '../../../components/ui/icons';
import { isApiError } from '../../../lib/api-client';
import { newMarkKey, type QueuedMark } from '../api/mark-queue';
import { useSaveJumps, useUndoMark, useWeighIn } from '../api/use-meet-day';
import { ATTEMPT_NAME, LIFT_NAME, points, type LifterView } from './day-model';

interface Props {
  day: MeetDay;
  view: LifterView;
  lift: MeetLift;
  chosenKg: number | null;
  onChoose: (kg: number | null) => void;
  record: boolean;
  onRecord: (record: boolean) => void;
  onMark: (mark: QueuedMark) => void;
  closed: boolean;
}

const kgText = (n: number) => `${n} kg`;

export function LifterCard({ day, view, lift, chosenKg, onChoose, record, onRecord, onMark, closed }: Props) {
  const { entry, attempts, standing } = view;
  const list = attempts[lift];
  const offer = view.offers[lift];
  const last = list.at(-1);
  const step = record ? RECORD_STEP_KG : ATTEMPT_STEP_KG;
  const previous = last ? { kg: last.weightKg, good: last.result === 'good' } : null;
  const problem = chosenKg === null ? 'Enter the attempt in kg.' : attemptProblem(chosenKg, previous, { record });
  const name = entry.athlete.name;
  const headingId = `lifter-${entry.entryId}`;

  const mark = (result: 'good' | 'missed') => {
    if (!offer || chosenKg === null || problem) return;
    onMark({
      key: newMarkKey(),
      entryId: entry.entryId,
      lift,
      attemptNo: offer.attemptNo,
      weightKg: chosenKg,
      record,
      result,
    });
  };

  return (
    <article
      aria-labelledby={headingId}
      className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-chalk-50 p-3 sm:p-4"
    >
      <header className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h3 id={headingId} className="text-2xl font-bold">
          {name}
        </h3>
        <p className="text-base text-ink-700">
          {entry.ageGroup ? AGE_GROUP_LABELS[entry.ageGroup] : 'Age group unknown'}
          {entry.weightClass ? ` · ${entry.weightClass} kg class` : ' · no class yet'}
          {entry.lot ? ` · lot ${entry.lot}` : ''}
        </p>
      </header>

      <dl className="grid grid-cols-3 gap-2 rounded-md bg-ink-900 p-2 text-center text-chalk-50">
        <div>
          <dt className="text-xs uppercase tracking-wide text-ink-200">Total</dt>
          <dd className="text-2xl font-bold tabular-nums">{kgText(standing.total)}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase tracking-wide text-ink-200">DOTS</dt>
          <dd className="text-2xl font-bold tabular-nums">{points(standing.dots)}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase tracking-wide text-ink-200">GL points</dt>
          <dd className="text-2xl font-bold tabular-nums">{points(standing.gl)}</dd>
        </div>
      </dl>

      <WeighIn day={day} view={view} />

      <ol aria-label={`${LIFT_NAME[lift]} attempts of ${name}`} className="grid grid-cols-3 gap-2">
        {[1, 2, 3].map((n) => {
          const a = list.find((x) => x.attemptNo === n);
          const isNext = offer?.attemptNo === n;
          return (
            <li
              key={n}
              className={`flex min-h-20 flex-col items-center justify-center rounded-md border-2 p-1 text-center ${
                a
                  ? a.result === 'good'
                    ? 'border-clean-600 bg-clean-100'
                    : 'border-breach-600 bg-breach-100'
                  : isNext
                    ? 'border-rust-500 bg-chalk-100'
                    : 'border-dashed border-ink-300'
              }`}
            >
              <span className="text-sm font-semibold text-ink-700">{ATTEMPT_NAME[n - 1]}</span>
              {a ? (
                <>
                  <span className="text-xl font-bold tabular-nums">{kgText(a.weightKg)}</span>
                  <span
                    className={`flex items-center gap-1 text-sm font-semibold ${a.result === 'good' ? 'text-clean-700' : 'text-breach-700'}`}
                  >
                    {a.result === 'good' ? <CleanIcon width={16} height={16} /> : <BreakIcon width={16} height={16} />}
                    {a.result === 'good' ? 'Good' : 'Missed'}
                    {a.waiting ? ' · not sent yet' : ''}
                  </span>
                </>
              ) : (
                <span className="text-lg text-ink-600">{isNext ? 'up next' : '—'}</span>
              )}
            </li>
          );
        })}
      </ol>

      {offer && !closed ? (
        <section
          aria-label={`${ATTEMPT_NAME[offer.attemptNo - 1]} ${LIFT_NAME[lift].toLowerCase()} attempt of ${name}`}
          className="flex flex-col gap-2 rounded-md border border-ink-300 p-2"
        >
          <div className="flex flex-wrap items-center justify-between gap-2">
            <label className="flex items-center gap-2 text-lg font-semibold" htmlFor={`kg-${entry.entryId}-${lift}`}>
              {ATTEMPT_NAME[offer.attemptNo - 1]} attempt (kg)
            </label>
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" className="size-5" checked={record} onChange={(e) => onRecord(e.target.checked)} />
              Record attempt (0.5 kg steps)
            </label>
          </div>
          <div className="flex items-stretch gap-2">
            <Button
              variant="secondary"
              size="lg"
              aria-label={`${step} kg lighter`}
              disabled={chosenKg === null || (offer.minKg !== null && chosenKg - step < offer.minKg)}
              onClick={() => chosenKg !== null && onChoose(Math.round((chosenKg - step) * 100) / 100)}
            >
              −{step}
            </Button>
            <input
              id={`kg-${entry.entryId}-${lift}`}
              inputMode="decimal"
              aria-invalid={problem ? true : undefined}
              aria-describedby={problem ? `kg-${entry.entryId}-${lift}-problem` : undefined}
              className="w-full min-w-0 rounded-md border-2 border-ink-600 bg-chalk-50 px-2 text-center text-3xl font-bold tabular-nums"
              value={chosenKg ?? ''}
              onChange={(e) => {
                const v = e.target.value.replace(',', '.').trim();
                onChoose(v === '' || Number.isNaN(Number(v)) ? null : Number(v));
              }}
            />
            <Button
              variant="secondary"
              size="lg"
              aria-label={`${step} kg heavier`}
              disabled={chosenKg === null}
              onClick={() => chosenKg !== null && onChoose(Math.round((chosenKg + step) * 100) / 100)}
            >
              +{step}
            </Button>
          </div>
          {offer.minKg !== null ? (
            <p className="text-sm text-ink-700">
              Lightest allowed: {kgText(offer.minKg)}
              {offer.suggestedKg !== null && offer.suggestedKg !== chosenKg ? (
                <>
                  {' · '}
                  <button
                    type="button"
                    className="font-semibold text-rust-700 underline"
                    onClick={() => onChoose(offer.suggestedKg)}
                  >
                    Back to the offer, {kgText(offer.suggestedKg)}
                  </button>
                </>
              ) : null}
            </p>
          ) : null}
          {problem ? (
            <p
              id={`kg-${entry.entryId}-${lift}-problem`}
              role="alert"
              className="text-base font-medium text-breach-700"
            >
              {problem}
            </p>
          ) : null}
          <div className="grid grid-cols-2 gap-2">
            <button
              type="button"
              disabled={!!problem}
              onClick={() => mark('good')}
              className="flex min-h-16 items-center justify-center gap-2 rounded-md bg-clean-700 text-xl font-bold text-chalk-50 hover:bg-clean-600 disabled:opacity-50"
            >
              <CleanIcon width={24} height={24} /> Good
            </button>
            <button
              type="button"
              disabled={!!problem}
              onClick={() => mark('missed')}
              className="flex min-h-16 items-center justify-center gap-2 rounded-md bg-breach-700 text-xl font-bold text-chalk-50 hover:bg-breach-600 disabled:opacity-50"
            >
              <BreakIcon width={24} height={24} /> Missed
            </button>
          </div>
        </section>
      ) : !offer ? (
        <p className="text-base text-ink-700">
          {LIFT_NAME[lift]} done: best {standing.best[lift] === null ? 'none' : kgText(standing.best[lift])}.
        </p>
      ) : null}

      <div className="flex flex-wrap items-start justify-between gap-2">
        {last && !last.waiting && last.id !== null && !closed ? <TakeBack day={day} attempt={last} /> : <span />}
        <Jumps day={day} view={view} lift={lift} />
      </div>
    </article>
  );
}

function TakeBack({
  day,
  attempt,
}: {
  day: MeetDay;
  attempt: { id: number | null; version: number | null; attemptNo: number };
}) {
  const undo = useUndoMark(day.meet.id);
  const [sure, setSure] = useState(false);
  if (attempt.id === null || attempt.version === null) return null;
  return (
    <div className="flex flex-col gap-1">
      {sure ? (
        <Button
          variant="danger"
          size="sm"
          disabled={undo.isPending}
          onClick={() =>
            undo.mutate({ id: attempt.id!, version: attempt.version! }, { onSettled: () => setSure(false) })
          }
        >
          Confirm: take back the {ATTEMPT_NAME[attempt.attemptNo - 1]} mark
        </Button>
      ) : (
        <Button variant="ghost" size="sm" onClick={() => setSure(true)}>
          Take back the last mark
        </Button>
      )}
      {undo.error ? (
        <p role="alert" className="text-sm text-breach-700">
          {undo.error.message}
        </p>
      ) : null}
    </div>
  );
}

function WeighIn({ day, view }: { day: MeetDay; view: LifterView }) {
  const { entry } = view;
  const save = useWeighIn(day.meet.id);
  const [open, setOpen] = useState(entry.weighInKg === null);
  const [kg, setKg] = useState(entry.weighInKg === null ? '' : String(entry.weighInKg));
  const [cls, setCls] = useState(entry.weightClass ?? '');
  const [flight, setFlight] = useState(entry.flight);
  const classes = WEIGHT_CLASSES[entry.athlete.sex][entry.division];
  const fieldError =
    save.error && isApiError(save.error) ? (save.error.fields.bodyweightKg?.[0] ?? save.error.message) : null;
  const id = `weigh-${entry.entryId}`;

  if (!open && entry.weighInKg !== null) {
    return (
      <p className="flex flex-wrap items-center justify-between gap-2 text-base">
        <span className="flex items-center gap-1">
          <CleanIcon className="text-clean-700" width={18} height={18} />
          Weighed in at {kgText(entry.weighInKg)}, within the {entry.weightClass} kg class · flight {entry.flight}
        </span>
        {day.meet.resultsSavedAt === null ? (
          <Button variant="ghost" size="sm" onClick={() => setOpen(true)}>
            Change weigh-in
          </Button>
        ) : null}
      </p>
    );
  }
  return (
    <form
      aria-label={`Weigh-in of ${entry.athlete.name}`}
      className="flex flex-wrap items-end gap-2 rounded-md bg-chalk-100 p-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate(
          {
            entryId: entry.entryId,
            body: {
              bodyweightKg: Number(kg.replace(',', '.')),
              weightClass: cls || undefined,
              flight: flight.trim().toUpperCase() || undefined,
              version: entry.version,
            },
          },
          { onSuccess: () => setOpen(false) },
        );
      }}
    >
      <label className="flex flex-col text-sm font-semibold" htmlFor={`${id}-kg`}>
        Bodyweight (kg)
        <input
          id={`${id}-kg`}
          inputMode="decimal"
          required
          value={kg}
          onChange={(e) => setKg(e.target.value)}
          aria-invalid={fieldError ? true : undefined}
          aria-describedby={fieldError ? `${id}-error` : undefined}
          className="w-28 rounded-md border border-ink-400 bg-chalk-50 px-2 py-2 text-lg tabular-nums"
        />
      </label>
      <label className="flex flex-col text-sm font-semibold" htmlFor={`${id}-class`}>
        Class (kg)
        <select
          id={`${id}-class`}
          value={cls}
          onChange={(e) => setCls(e.target.value)}
          className="rounded-md border border-ink-400 bg-chalk-50 px-2 py-2 text-lg"
        >
          <option value="">By bodyweight</option>
          {classes.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-sm font-semibold" htmlFor={`${id}-flight`}>
        Flight
        <input
          id={`${id}-flight`}
          value={flight}
          maxLength={2}
          onChange={(e) => setFlight(e.target.value)}
          className="w-16 rounded-md border border-ink-400 bg-chalk-50 px-2 py-2 text-lg uppercase"
        />
      </label>
      <Button type="submit" disabled={save.isPending || kg.trim() === ''}>
        Save weigh-in
      </Button>
      {fieldError ? (
        <p id={`${id}-error`} role="alert" className="w-full text-base font-medium text-breach-700">
          {fieldError}
        </p>
      ) : null}
    </form>
  );
}

function Jumps({ day, view, lift }: { day: MeetDay; view: LifterView; lift: MeetLift }) {
  const { entry } = view;
  const save = useSaveJumps(day.meet.id);
  const [second, setSecond] = useState(String(entry.jumps[lift][0]));
  const [third, setThird] = useState(String(entry.jumps[lift][1]));
  const id = `jumps-${entry.entryId}-${lift}`;
  return (
    <details className="text-sm">
      <summary className="min-h-9 cursor-pointer py-2 font-semibold text-ink-800">
        Usual jumps: +{entry.jumps[lift][0]} then +{entry.jumps[lift][1]} kg
      </summary>
      <form
        aria-label={`Usual ${LIFT_NAME[lift].toLowerCase()} jumps of ${entry.athlete.name}`}
        className="mt-1 flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const pair = [Number(second), Number(third)] as [number, number];
          save.mutate({
            entryId: entry.entryId,
            body: { jumps: { ...entry.jumps, [lift]: pair }, version: entry.jumpsVersion },
          });
        }}
      >
        <label htmlFor={`${id}-2`} className="flex flex-col">
          To the 2nd (kg)
          <input
            id={`${id}-2`}
            inputMode="decimal"
            value={second}
            onChange={(e) => setSecond(e.target.value)}
            className="w-20 rounded-md border border-ink-400 bg-chalk-50 px-2 py-1.5 text-base"
          />
        </label>
        <label htmlFor={`${id}-3`} className="flex flex-col">
          To the 3rd (kg)
          <input
            id={`${id}-3`}
            inputMode="decimal"
            value={third}
            onChange={(e) => setThird(e.target.value)}
            className="w-20 rounded-md border border-ink-400 bg-chalk-50 px-2 py-1.5 text-base"
          />
        </label>
        <Button type="submit" size="sm" variant="secondary" disabled={save.isPending}>
          Save jumps
        </Button>
        {save.error ? (
          <p role="alert" className="w-full text-breach-700">
            {isApiError(save.error) && Object.values(save.error.fields)[0]?.[0]
              ? Object.values(save.error.fields)[0]![0]
              : save.error.message}
          </p>
        ) : null}
      </form>
    </details>
  );
}
