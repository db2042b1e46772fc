// One max-effort pick of the week: the variant and scheme, last time and record, the warm-up with
// plates, and the log form.
import { LIFT_NAME, SCHEME_GOAL_LABEL } from '../../../../shared/labels';
import { Suspense, lazy, useState } from 'react';
import { formatWeight, fromKg, roundToLoadable, suggestedTopSet, type WeightUnit } from '../../../../shared/calc';
import type { MyWeekPick, TopSet } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CleanIcon } from '../../../components/ui/icons';
import type { BackOffRule } from '../../../../shared/calc';
import type { MyWeekSession } from '../../../../shared/schemas';
import { BackOffSets } from './back-off-sets';
import { OnDemand } from './on-demand';
import { WarmupRamp } from './warmup-ramp';

// The forms (and the validation library they bring) load after the pick is on screen.
const TopSetForm = lazy(() => import('./top-set-form').then((m) => ({ default: m.TopSetForm })));
const VideoUpload = lazy(() => import('./video-upload').then((m) => ({ default: m.VideoUpload })));

const formLoading = <p className="text-sm text-ink-600">Loading the form…</p>;

function setText(s: TopSet, unit: WeightUnit): string {
  return `${s.reps} × ${formatWeight(s.weightKg, unit, { decimals: 1 })}${s.rpe ? ` @ RPE ${s.rpe}` : ''}`;
}

/** The team's back-off sets for a pick, with the session that keeps their ticks; null for none. */
export interface PickBackOff {
  rule: BackOffRule;
  session: MyWeekSession | undefined;
  week: string;
  editable: boolean;
}

export function PickCard({
  pick,
  unit,
  backOff = null,
}: {
  pick: MyWeekPick;
  unit: WeightUnit;
  backOff?: PickBackOff | null;
}) {
  const [warmup, setWarmup] = useState(false);
  const best = pick.record.bestE1rm;
  const suggested = best
    ? suggestedTopSet(best.e1rmKg, pick.schemeReps, unit)
    : pick.opening
      ? roundToLoadable(fromKg(pick.opening.low, unit), unit, { mode: 'down' })
      : null;
  const headingId = `pick-${pick.planEntryId}`;
  return (
    <section
      aria-labelledby={headingId}
      className="flex flex-col gap-4 rounded-lg border border-ink-200 bg-chalk-50 p-4 shadow-sm"
    >
      <header className="flex flex-col gap-1">
        <p className="text-sm font-semibold uppercase tracking-wide text-rust-600">
          {pick.slotLabel} · {LIFT_NAME[pick.variant.lift]}
        </p>
        <h2 id={headingId} className="text-2xl font-bold leading-tight text-ink-900">
          {pick.variant.name}
        </h2>
        <p className="text-lg font-semibold text-ink-800">{SCHEME_GOAL_LABEL[pick.scheme]}</p>
        {pick.variant.notes ? <p className="text-ink-600">{pick.variant.notes}</p> : null}
      </header>

      <dl className="grid grid-cols-1 gap-2 sm:grid-cols-3">
        <div className="rounded-md bg-chalk-100 px-3 py-2">
          <dt className="text-sm text-ink-600">Last time</dt>
          <dd className="font-semibold text-ink-900" data-testid="last-time">
            {pick.lastTime
              ? `${setText(pick.lastTime, unit)} · ${pick.lastTime.performedOn}`
              : 'First time on this variant'}
            {!pick.lastTime && pick.opening ? (
              <span className="block text-sm font-normal text-ink-700" data-testid="opening-range">
                Suggested start: {formatWeight(pick.opening.low, unit, { decimals: 1 })} –{' '}
                {formatWeight(pick.opening.high, unit, { decimals: 1 })} (an estimate from your{' '}
                {LIFT_NAME[pick.variant.lift].toLowerCase()}; work up by feel)
              </span>
            ) : null}
          </dd>
        </div>
        <div className="rounded-md bg-chalk-100 px-3 py-2">
          <dt className="text-sm text-ink-600">Record e1RM</dt>
          <dd className="font-semibold text-ink-900" data-testid="record-e1rm">
            {best ? `${formatWeight(best.e1rmKg, unit, { decimals: 1 })} (${setText(best, unit)})` : 'None yet'}
          </dd>
        </div>
        <div className="rounded-md bg-chalk-100 px-3 py-2">
          <dt className="text-sm text-ink-600">Heaviest</dt>
          <dd className="font-semibold text-ink-900" data-testid="record-heaviest">
            {pick.record.heaviest ? setText(pick.record.heaviest, unit) : 'None yet'}
          </dd>
        </div>
      </dl>

      {pick.logged.length > 0 ? (
        <div className="flex flex-col gap-2">
          <h3 className="font-semibold text-ink-800">Logged this week</h3>
          <ul className="flex flex-col gap-2">
            {pick.logged.map((s) => (
              <li key={s.id} className="flex flex-col gap-2 rounded-md border border-ink-200 px-3 py-2">
                <p className="text-ink-900">
                  <span className="font-semibold">{setText(s, unit)}</span> · e1RM{' '}
                  {formatWeight(s.e1rmKg, unit, { decimals: 1 })}
                  {s.note ? <span className="block text-sm text-ink-600">{s.note}</span> : null}
                </p>
                {s.videoId ? (
                  <p className="flex items-center gap-2 text-sm font-semibold text-clean-700">
                    <CleanIcon /> Video attached: your coach can watch it.
                  </p>
                ) : (
                  <Suspense fallback={formLoading}>
                    <VideoUpload topSetId={s.id} />
                  </Suspense>
                )}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {backOff ? <BackOffSets pick={pick} unit={unit} suggested={suggested} {...backOff} /> : null}

      <div className="flex flex-col gap-3">
        <Button
          variant="secondary"
          aria-expanded={warmup}
          aria-controls={`${headingId}-warmup`}
          onClick={() => setWarmup((w) => !w)}
          className="self-stretch sm:self-start"
        >
          {warmup ? 'Hide warm-up and plates' : 'Warm-up and plates'}
        </Button>
        {warmup ? (
          <div id={`${headingId}-warmup`}>
            <WarmupRamp initialTop={suggested} unit={unit} reps={pick.schemeReps} />
          </div>
        ) : null}
      </div>

      <div className="flex flex-col gap-2 border-t border-ink-200 pt-4">
        <h3 className="text-lg font-semibold text-ink-900">Log the top set</h3>
        {/* Opened on demand: the page stays short on a phone until the athlete is ready to log. */}
        <OnDemand openLabel="Open the log form" closeLabel="Close the log form" primary>
          <Suspense fallback={formLoading}>
            <TopSetForm pick={pick} unit={unit} />
          </Suspense>
        </OnDemand>
      </div>
    </section>
  );
}
