// Athlete week (coaches): one athlete's whole training week beyond the max-effort pick, editable.
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { addWeeks, isIsoWeek } from '../../../shared/engine/weeks';
import { PageHeader, TrainingCaution } from '../../components/ui/page';
import { athleteWeekOptions } from '../../features/week/api/queries';
import { WeekEditor } from '../../features/week/components/week-editor';
import type { LoaderMaker } from '../guards';

function paramsOf(params: Record<string, string | undefined>): { athleteId: number; week: string } {
  const athleteId = Number(params.athleteId);
  const week = params.week ?? '';
  if (!Number.isInteger(athleteId) || athleteId <= 0 || !isIsoWeek(week))
    throw new Response('Not found', { status: 404 });
  return { athleteId, week };
}

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ params }) => {
    const { athleteId, week } = paramsOf(params);
    await queryClient.ensureQueryData(athleteWeekOptions(athleteId, week));
    return null;
  };

const navClass =
  'inline-flex min-h-11 items-center rounded-md border border-ink-300 bg-chalk-50 px-3 font-semibold text-ink-800 hover:bg-chalk-200';

export function Component() {
  const { athleteId, week } = paramsOf(useParams());
  const { data } = useSuspenseQuery(athleteWeekOptions(athleteId, week));
  return (
    <div className="mx-auto flex max-w-4xl flex-col gap-4">
      <PageHeader title="Training week" subtitle={`${week}${data.deload ? ' · deload' : ''}`} />
      <nav aria-label="Weeks" className="flex flex-wrap gap-2">
        <Link className={navClass} to={`/athletes/${athleteId}`}>
          ← Athlete
        </Link>
        <Link className={navClass} to={`/athletes/${athleteId}/weeks/${addWeeks(week, -1)}`}>
          Previous week
        </Link>
        <Link className={navClass} to={`/athletes/${athleteId}/weeks/${addWeeks(week, 1)}`}>
          Next week
        </Link>
      </nav>
      <TrainingCaution />
      <WeekEditor key={week} athleteId={athleteId} data={data} />
    </div>
  );
}
