// The week's sessions on the phone: today's first, then the rest in the order of the week, each one
// folded open or shut; speed sets and accessory sets are counted as they are done, and a session is
// marked done with one tap.
import { ACCESSORY_CATEGORY_LABELS, LIFT_NAME, SESSION_PART_LABELS, WEEKDAY_LABELS } from '../../../../shared/labels';
import { useState } from 'react';
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import type { AccessoryWork, MyWeekPick, MyWeekSession } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CleanIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useLogSession } from '../api/use-log-session';
import { KEPT_WITHOUT_SIGNAL, StatusLine } from './status-line';

const ACCOMMODATION = { none: '', bands: ' + bands', chains: ' + chains' } as const;

/** Today's session first, then the rest of the week in order. */
export function sessionsTodayFirst<T extends { date: string }>(sessions: readonly T[], today: string): T[] {
  const i = sessions.findIndex((s) => s.date === today);
  return i <= 0 ? [...sessions] : [sessions[i]!, ...sessions.slice(0, i), ...sessions.slice(i + 1)];
}

function target(a: AccessoryWork, unit: WeightUnit): string {
  if (a.loadKg !== null) return ` at ${formatWeight(a.loadKg, unit, { decimals: 1 })}`;
  if (a.rpe !== null) return ` at RPE ${a.rpe}`;
  return '';
}

function Counter({
  label,
  value,
  max,
  onChange,
}: {
  label: string;
  value: number;
  max: number;
  onChange: (n: number) => void;
}) {
  return (
    <div role="group" aria-label={label} className="flex items-center gap-2">
      <Button
        variant="secondary"
        aria-label={`One set fewer: ${label}`}
        onClick={() => onChange(Math.max(0, value - 1))}
      >
        −
      </Button>
      <output aria-live="polite" className="min-w-16 text-center font-semibold text-ink-900">
        {value} / {max}
      </output>
      <Button
        variant="secondary"
        aria-label={`One more set: ${label}`}
        onClick={() => onChange(Math.min(max, value + 1))}
      >
        +
      </Button>
    </div>
  );
}

function SessionCard({
  session,
  week,
  today,
  unit,
  picks,
  editable,
}: {
  session: MyWeekSession;
  week: string;
  today: string;
  unit: WeightUnit;
  picks: MyWeekPick[];
  editable: boolean;
}) {
  const log = session.log;
  const [speedDone, setSpeedDone] = useState(log?.speedSetsDone ?? 0);
  const [accDone, setAccDone] = useState<number[]>(session.accessories.map((_, i) => log?.accessorySetsDone[i] ?? 0));
  const save = useLogSession();
  const [message, setMessage] = useState<string | null>(null);
  const isToday = session.date === today;
  const pick = picks.find((p) => p.slotId === session.slotId);
  const headingId = `session-${session.id}`;

  const send = (done: boolean) => {
    setMessage(null);
    save.mutate(
      {
        sessionId: session.id,
        // The back-off ticks are left out: they are saved from the pick's card and stay as stored.
        body: { week, version: log?.version ?? 0, speedSetsDone: speedDone, accessorySetsDone: accDone, done },
        label: `${session.name}: ${done ? 'session done' : 'sets done'}`,
      },
      {
        onSuccess: (out) => setMessage(!out.sent ? KEPT_WITHOUT_SIGNAL : done ? 'Session marked done.' : 'Saved.'),
        onError: (err) =>
          setMessage(isApiError(err, 409) ? 'Logged from another device meanwhile; shown again now.' : err.message),
      },
    );
  };

  return (
    <details open={isToday} className="rounded-lg border border-ink-200 bg-chalk-50 shadow-sm">
      <summary className="flex min-h-11 cursor-pointer flex-wrap items-center gap-2 p-4">
        <h3 id={headingId} className="text-lg font-bold text-ink-900">
          {session.name}
        </h3>
        <span className="text-sm text-ink-600">
          {WEEKDAY_LABELS[session.weekday - 1]}
          {isToday ? ' · today' : ''}
        </span>
        {log?.done ? (
          <span className="inline-flex items-center gap-1 text-sm font-semibold text-clean-700">
            <CleanIcon /> Done
          </span>
        ) : null}
      </summary>
      <div className="flex flex-col gap-4 border-t border-ink-200 p-4">
        <p className="text-sm text-ink-600">{session.parts.map((p) => SESSION_PART_LABELS[p]).join(' · ')}</p>
        {session.parts.includes('maxEffort') ? (
          <p className="text-ink-800">
            <span className="font-semibold">Max effort:</span>{' '}
            {pick ? `${pick.variant.name} — log the top set on its card above.` : 'No max-effort work this week.'}
          </p>
        ) : null}
        {session.speed ? (
          <div className="flex flex-col gap-2">
            <p className="text-ink-800">
              <span className="font-semibold">Speed:</span> {LIFT_NAME[session.speed.lift]} {session.speed.sets} ×{' '}
              {session.speed.reps} at {session.speed.pct} % of your training max
              {session.speed.barKg !== null
                ? ` · ${formatWeight(session.speed.barKg, unit, { decimals: 1 })} on the bar${ACCOMMODATION[session.speed.accommodation]}`
                : ' · your coach sets the load once you have a recent max'}
            </p>
            {editable ? (
              <Counter
                label={`Speed sets done, ${session.name}`}
                value={speedDone}
                max={session.speed.sets}
                onChange={setSpeedDone}
              />
            ) : null}
          </div>
        ) : null}
        {session.accessories.length > 0 ? (
          <ul aria-label={`Accessories, ${session.name}`} className="flex flex-col gap-3">
            {session.accessories.map((a, i) => (
              <li key={`${a.name}-${i}`} className="flex flex-col gap-2 rounded-md bg-chalk-100 px-3 py-2">
                <p className="text-ink-900">
                  <span className="font-semibold">{a.name}</span>{' '}
                  <span className="text-sm text-ink-600">({ACCESSORY_CATEGORY_LABELS[a.category]})</span> · {a.sets} ×{' '}
                  {a.reps}
                  {target(a, unit)}
                </p>
                {editable ? (
                  <Counter
                    label={`Sets done, ${a.name}`}
                    value={accDone[i] ?? 0}
                    max={a.sets}
                    onChange={(n) => setAccDone((all) => all.map((v, j) => (j === i ? n : v)))}
                  />
                ) : null}
              </li>
            ))}
          </ul>
        ) : session.parts.includes('accessories') ? (
          <p className="text-sm text-ink-600">No accessories set for this session yet.</p>
        ) : null}
        {session.parts.includes('tissue') ? (
          <p className="text-sm text-ink-600">Connective-tissue work: see this week’s tissue work below.</p>
        ) : null}
        {editable ? (
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => send(log?.done ?? false)} disabled={save.isPending}>
              Save sets
            </Button>
            <Button onClick={() => send(!(log?.done ?? false))} disabled={save.isPending}>
              {log?.done ? 'Mark not done' : 'Session done'}
            </Button>
          </div>
        ) : null}
        <StatusLine message={message} />
      </div>
    </details>
  );
}

export function WeekSessions({
  sessions,
  week,
  today,
  editable,
  unit,
  picks,
  deload,
}: {
  sessions: MyWeekSession[];
  week: string;
  today: string;
  /** A week that has started: its sessions can be logged. */
  editable: boolean;
  unit: WeightUnit;
  picks: MyWeekPick[];
  deload: boolean;
}) {
  if (sessions.length === 0) return null;
  return (
    <section aria-labelledby="week-sessions" className="flex flex-col gap-3">
      <h2 id="week-sessions" className="text-xl font-bold text-ink-900">
        This week’s sessions
      </h2>
      {deload ? <Notice>Deload week: no max-effort work, lighter speed and accessory work.</Notice> : null}
      {sessionsTodayFirst(sessions, today).map((s) => (
        <SessionCard
          key={`${week}-${s.id}`}
          session={s}
          week={week}
          today={today}
          unit={unit}
          picks={picks}
          editable={editable}
        />
      ))}
    </section>
  );
}
