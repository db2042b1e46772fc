// Meet day (coaches, tablet or phone): every entered athlete of the team, live, in lifting order.
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { PageHeader, TrainingCaution } from '../../components/ui/page';
import { meetDayOptions } from '../../features/meets/api/queries';
import { MeetDayBoard } from '../../features/meets/components/meet-day-board';
import { dateText } from '../../features/meets/components/when';
import type { LoaderMaker } from '../guards';

export function meetIdOf(params: Record<string, string | undefined>): number {
  const id = Number(params.meetId);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ params }) => {
    await queryClient.ensureQueryData(meetDayOptions(meetIdOf(params)));
    return null;
  };

export function Component() {
  const id = meetIdOf(useParams());
  const { data: day } = useSuspenseQuery(meetDayOptions(id));
  return (
    <section className="flex flex-col gap-4">
      <PageHeader
        title={`Meet day: ${day.meet.name}`}
        subtitle={`${dateText(day.meet.date)} · ${day.meet.equipment === 'equipped' ? 'equipped' : 'classic'} · points by DOTS and GL`}
        actions={
          <>
            <Link to={`/meets?meet=${id}`} className={buttonClass('ghost', 'md')}>
              Back to the meet
            </Link>
            <Link to={`/meets/${id}/sheet`} className={buttonClass('secondary', 'md')}>
              Result sheet
            </Link>
          </>
        }
      />
      <TrainingCaution />
      <MeetDayBoard day={day} />
    </section>
  );
}
