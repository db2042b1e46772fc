// A meet's result sheet (coaches): print it or save it as PDF from the browser; after the meet, write the
// results into the athletes' histories from here.
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { Button, buttonClass } from '../../components/ui/button';
import { Notice, PageHeader } from '../../components/ui/page';
import { meetDayOptions } from '../../features/meets/api/queries';
import { useSaveResults } from '../../features/meets/api/use-meet-day';
import { ResultSheet } from '../../features/meets/components/result-sheet';
import { meetIdOf } from './meet-day';

// The same data as meet day: its loader is shared.
export { makeLoader } from './meet-day';

export function Component() {
  const id = meetIdOf(useParams());
  const { data: day } = useSuspenseQuery(meetDayOptions(id));
  const save = useSaveResults(id);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <section className="flex flex-col gap-4">
      <div className="print:hidden">
        <PageHeader
          title="Result sheet"
          subtitle="Print it, or choose “Save as PDF” in the print dialog."
          actions={
            <>
              <Link to={`/meets/${id}/day`} className={buttonClass('ghost', 'md')}>
                Back to meet day
              </Link>
              <Button variant="secondary" onClick={() => window.print()}>
                Print
              </Button>
              {day.meet.resultsSavedAt === null && day.meet.date <= today ? (
                <Button onClick={() => save.mutate()} disabled={save.isPending}>
                  Save results to histories
                </Button>
              ) : null}
            </>
          }
        />
        {day.meet.resultsSavedAt ? (
          <Notice tone="success">
            The best good lift of each athlete is in their history as a top set on the competition lift.
          </Notice>
        ) : null}
        {save.error ? <Notice tone="error">{save.error.message}</Notice> : null}
      </div>
      <ResultSheet day={day} />
    </section>
  );
}
