// My week (athlete, phone first): the week's max-effort picks with warm-ups and logging, connective-
// tissue work and its check-in, bodyweight, the training caution below the picks, and the week's sessions.
import { Suspense, lazy, useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';
import { addWeeks, mondayOf } from '../../../shared/engine/weeks';
import { MY_WEEK_DRAFT_NOTICE, MY_WEEK_EMPTY_NOTICE, weekSpanLabel } from '../../../shared/labels';
import { Loading, Notice, PageHeader, TrainingCaution } from '../../components/ui/page';
import { myWeekQueryOptions, useMyWeek } from '../../features/my-week/api/queries';
import { OfflineLine } from '../../features/my-week/components/offline-line';
import { WaitingToSend } from '../../features/my-week/components/waiting-to-send';
import { PickCard } from '../../features/my-week/components/pick-card';
import { TissueWork } from '../../features/my-week/components/tissue-work';
import { WeekSessions } from '../../features/my-week/components/week-sessions';
import { useMe } from '../../lib/me';
import { firstScreenShown } from '../../lib/service-worker';
import { weekParam } from './my-week.loader';

// Below the picks: the thread (its request and its form) starts once the picks are on screen.
const MessageThread = lazy(() =>
  import('../../features/messages/components/message-thread').then((m) => ({ default: m.MessageThread })),
);
// Below the picks, with forms: their code (and the validation library) loads after the picks are shown.
const CheckinForm = lazy(() =>
  import('../../features/my-week/components/checkin-form').then((m) => ({ default: m.CheckinForm })),
);
const BodyweightCard = lazy(() =>
  import('../../features/my-week/components/bodyweight-card').then((m) => ({ default: m.BodyweightCard })),
);

const navClass =
  'inline-flex min-h-11 items-center rounded-md border border-ink-300 bg-chalk-50 px-3 font-semibold text-ink-800 hover:bg-chalk-200';

export function Component() {
  const [search] = useSearchParams();
  const requested = weekParam(search);
  const { data, error } = useMyWeek(requested);
  const queryClient = useQueryClient();
  const { data: me } = useMe();
  // The picks go on screen first; the rest of the page (and the code and requests it starts) a frame
  // later, so that work never holds the picks back on a slow phone. Then the service worker may fetch
  // the app's files for offline use.
  const shown = data !== undefined;
  const [rest, setRest] = useState(false);
  useEffect(() => {
    if (!shown) return;
    firstScreenShown();
    // After the frame that paints the picks, not before it.
    let timer: ReturnType<typeof setTimeout> | undefined;
    const frame = requestAnimationFrame(() => (timer = setTimeout(() => setRest(true))));
    return () => {
      cancelAnimationFrame(frame);
      clearTimeout(timer);
    };
  }, [shown]);
  // Next week read once too (after the picks are shown), so the phone keeps it for a gym without signal.
  const nextWeek = rest && data && !requested && !data.fromCache ? addWeeks(data.week, 1) : null;
  useEffect(() => {
    if (nextWeek) void queryClient.prefetchQuery(myWeekQueryOptions(nextWeek));
  }, [queryClient, nextWeek]);
  if (error) return <Notice tone="error">{error.message}</Notice>;
  if (!data) return <Loading />;
  const isCurrent = !requested;
  // A week that has started: its sessions and back-off sets can be logged.
  const started = mondayOf(data.week).toISOString().slice(0, 10) <= data.today;
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-4">
      <PageHeader
        title="My week"
        subtitle={`${data.week} · ${weekSpanLabel(data.week)}${data.meet && data.meet.daysOut >= 0 ? ` · ${data.meet.name} in ${data.meet.daysOut} days` : ''}`}
      />
      <OfflineLine receivedAt={data.receivedAt} fromCache={data.fromCache} />
      <WaitingToSend athleteId={data.athlete.id} />
      <nav aria-label="Weeks" className="flex flex-wrap gap-2">
        <Link className={navClass} to={`/my-week?week=${addWeeks(data.week, -1)}`}>
          ← Previous week
        </Link>
        {!isCurrent ? (
          <Link className={navClass} to="/my-week">
            This week
          </Link>
        ) : null}
        <Link className={navClass} to={`/my-week?week=${addWeeks(data.week, 1)}`}>
          Next week →
        </Link>
      </nav>
      {!data.published ? (
        <Notice>{MY_WEEK_DRAFT_NOTICE}</Notice>
      ) : data.picks.length === 0 ? (
        <Notice>{MY_WEEK_EMPTY_NOTICE}</Notice>
      ) : (
        data.picks.map((p) => (
          <PickCard
            key={p.planEntryId}
            pick={p}
            unit={data.unit}
            backOff={
              data.backOff && {
                rule: data.backOff,
                session: data.sessions.find((s) => s.parts.includes('maxEffort') && s.slotId === p.slotId),
                week: data.week,
                editable: started,
              }
            }
          />
        ))
      )}
      <TrainingCaution />
      {rest ? (
        <>
          <WeekSessions
            sessions={data.sessions}
            week={data.week}
            today={data.today}
            editable={started}
            unit={data.unit}
            picks={data.picks}
            deload={data.deload}
          />
          {me?.athleteId ? (
            <Suspense fallback={<Loading />}>
              <MessageThread
                athleteId={me.athleteId}
                week={data.week}
                side="athlete"
                slotLabels={Object.fromEntries(data.picks.map((p) => [p.slotId, p.slotLabel]))}
              />
            </Suspense>
          ) : null}
          <TissueWork tissue={data.tissue} />
          <Suspense fallback={<Loading />}>
            <CheckinForm weeks={data.checkins} thisWeek={data.week} />
            <BodyweightCard bodyweight={data.bodyweight} unit={data.unit} today={data.today} meet={data.meet} />
          </Suspense>
        </>
      ) : null}
    </div>
  );
}
