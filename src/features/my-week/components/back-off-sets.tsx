// The back-off sets under a max-effort pick's top set: weight × reps with the plates, from the top set
// logged this week (or the suggested one until then, said so), each ticked done as it is finished.
import { useState } from 'react';
import { backOffPlan, formatInUnit, fromKg, type BackOffRule, type WeightUnit } from '../../../../shared/calc';
import type { MyWeekPick, MyWeekSession } from '../../../../shared/schemas';
import { isApiError } from '../../../lib/api-client';
import { useLogSession } from '../api/use-log-session';
import { KEPT_WITHOUT_SIGNAL, StatusLine } from './status-line';
import { PlateDiagram } from './plate-diagram';

export function BackOffSets({
  pick,
  rule,
  unit,
  suggested,
  session,
  week,
  editable,
}: {
  pick: MyWeekPick;
  rule: BackOffRule;
  unit: WeightUnit;
  /** The suggested top set in `unit`, null without one. */
  suggested: number | null;
  /** The session holding this pick's slot, where the ticks are kept; none when the rules have no such session. */
  session: MyWeekSession | undefined;
  week: string;
  /** The week has started: sets can be ticked. */
  editable: boolean;
}) {
  const plan = backOffPlan(
    rule,
    {
      logged: pick.logged.map((s) => ({ weight: fromKg(s.weightKg, unit), reps: s.reps })),
      suggested,
      schemeReps: pick.schemeReps,
    },
    unit,
  );
  const stored = session?.log?.backOffDone ?? [];
  // Ticks not yet on the server (being sent, or kept without signal) show over the stored ones.
  const [local, setLocal] = useState<boolean[] | null>(null);
  const save = useLogSession();
  const fromServer = Array.from({ length: rule.sets }, (_, i) => stored[i] ?? false);
  const done = local ?? fromServer;
  // Once the server has them (sent later from the waiting list), the stored ticks lead again.
  if (local !== null && !save.isPending && local.every((v, i) => v === fromServer[i])) setLocal(null);
  const [message, setMessage] = useState<string | null>(null);
  const headingId = `backoff-${pick.planEntryId}`;
  // Weights here are already in the athlete's unit, in loadable steps.
  const w = (n: number) => formatInUnit(n, unit, { decimals: 1 });

  const toggle = (i: number, on: boolean) => {
    if (!session) return;
    const next = done.map((v, j) => (j === i ? on : v));
    setLocal(next);
    setMessage(null);
    save.mutate(
      {
        sessionId: session.id,
        body: { week, version: session.log?.version ?? 0, backOffDone: next },
        label: `Back-off sets: ${pick.variant.name}, ${next.filter(Boolean).length} of ${next.length} done`,
      },
      {
        onSuccess: (out) => {
          if (out.sent) setLocal(null);
          else setMessage(KEPT_WITHOUT_SIGNAL);
        },
        onError: (err) => {
          // The ticks as the server has them come back with the page; say why.
          setLocal(null);
          setMessage(isApiError(err, 409) ? 'Ticked from another device meanwhile; shown again now.' : err.message);
        },
      },
    );
  };

  return (
    // A group inside the pick's section, not a landmark of its own (every pick has one).
    <div
      role="group"
      aria-labelledby={headingId}
      className="flex flex-col gap-2 rounded-md border border-ink-200 px-3 py-3"
    >
      <h3 id={headingId} className="font-semibold text-ink-900">
        Back-off sets
      </h3>
      {!plan ? (
        <p className="text-sm text-ink-700">
          {rule.sets} {rule.sets === 1 ? 'set' : 'sets'} {rule.dropPct} % lighter than your top set: the weights show
          here once you log it.
        </p>
      ) : (
        <>
          <p className="text-sm text-ink-700" data-testid="back-off-basis">
            {plan.basis === 'logged'
              ? `${rule.dropPct} % lighter than the top set you logged (${w(plan.topSet)}).`
              : `${rule.dropPct} % lighter than the suggested top set (${w(plan.topSet)}), until you log yours; then they follow what you lifted.`}
          </p>
          <ol aria-label={`Back-off sets, ${pick.variant.name}`} className="flex flex-col gap-1">
            {plan.sets.map((s, i) => (
              <li key={i} className="flex min-h-11 items-center gap-3">
                {session && editable ? (
                  <label className="inline-flex min-h-11 items-center gap-3 text-ink-900">
                    <input
                      type="checkbox"
                      className="size-6 accent-rust-500"
                      checked={done[i] ?? false}
                      disabled={save.isPending}
                      onChange={(e) => toggle(i, e.target.checked)}
                    />
                    <span>
                      <span className="sr-only">Back-off set {i + 1} done: </span>
                      <span className="font-semibold tabular-nums">
                        {w(s.weight)} × {s.reps}
                      </span>
                    </span>
                  </label>
                ) : (
                  <span className="font-semibold text-ink-900 tabular-nums">
                    Set {i + 1}: {w(s.weight)} × {s.reps}
                  </span>
                )}
              </li>
            ))}
          </ol>
          <PlateDiagram weight={plan.sets[0]!.weight} unit={unit} />
          {!session && editable ? (
            <p className="text-sm text-ink-600">
              No session of the week holds this pick, so the sets cannot be ticked here; tell your coach.
            </p>
          ) : null}
        </>
      )}
      <StatusLine message={message} />
    </div>
  );
}
