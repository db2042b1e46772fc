// "Publish week": sends every athlete with an account their picks and tissue work for one week, once.
// Without a `week` the coach picks this week or next; a second press never sends again.
import { useQuery } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { addWeeks, weekOfDate } from '../../../../shared/engine/weeks';
import { Button } from '../../../components/ui/button';
import { CleanIcon } from '../../../components/ui/icons';
import { publicationQueryOptions } from '../api/queries';
import { usePublishWeek } from '../api/use-publish-week';

const when = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

export function PublishWeekButton({ week: fixedWeek }: { week?: string }) {
  const thisWeek = weekOfDate(new Date());
  const [chosen, setChosen] = useState(addWeeks(thisWeek, 1));
  const week = fixedWeek ?? chosen;
  const [confirming, setConfirming] = useState(false);
  const publication = useQuery(publicationQueryOptions(week));
  const publish = usePublishWeek();
  const selectId = useId();
  const status = publication.data;

  return (
    <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Publish week">
      {fixedWeek ? null : (
        <>
          <label htmlFor={selectId} className="sr-only">
            Week to publish
          </label>
          <select
            id={selectId}
            value={chosen}
            onChange={(e) => {
              setChosen(e.target.value);
              setConfirming(false);
            }}
            className="min-h-11 rounded-md border border-ink-300 bg-chalk-50 px-2 text-ink-900"
          >
            <option value={thisWeek}>This week ({thisWeek})</option>
            <option value={addWeeks(thisWeek, 1)}>Next week ({addWeeks(thisWeek, 1)})</option>
          </select>
        </>
      )}
      {status?.published ? (
        <p role="status" className="inline-flex items-center gap-1 text-sm text-ink-700">
          <CleanIcon className="text-clean-600" />
          Published {status.publishedAt ? when.format(new Date(status.publishedAt)) : ''}
          {status.publishedByName ? ` by ${status.publishedByName}` : ''} · {status.sent} sent
          {status.queued ? `, ${status.queued} waiting` : ''}
        </p>
      ) : confirming ? (
        <>
          <span className="text-sm text-ink-800">
            E-mail {status?.recipients ?? 'every'} athlete{status?.recipients === 1 ? '' : 's'} their {week}?
          </span>
          <Button
            disabled={publish.isPending}
            onClick={() => publish.mutate(week, { onSettled: () => setConfirming(false) })}
          >
            {publish.isPending ? 'Sending…' : 'Send e-mails'}
          </Button>
          <Button variant="ghost" onClick={() => setConfirming(false)}>
            Cancel
          </Button>
        </>
      ) : (
        <Button variant="secondary" disabled={publication.isPending} onClick={() => setConfirming(true)}>
          Publish week
        </Button>
      )}
      {publish.error ? (
        <p role="alert" className="text-sm font-medium text-breach-700">
          {publish.error.message}
        </p>
      ) : null}
    </div>
  );
}
