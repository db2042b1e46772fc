// The coach's board page: loads this span of weeks before showing it; a link may name a cell to open, and
// a cell's details carry the thread of that athlete's week.
import type { QueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { isIsoWeek } from '../../../shared/engine/weeks';
import { boardQueryOptions, defaultRange } from '../../features/board/api/queries';
import { BoardView } from '../../features/board/components/board-view';
import { MessageThread } from '../../features/messages/components/message-thread';
import { PublishWeekButton } from '../../features/publishing/components/publish-week-button';

export function makeLoader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(boardQueryOptions(defaultRange()));
    return null;
  };
}

/** The cell named by `?athlete=…&week=…&slot=…`, if all three are there and well formed. */
function cellFromSearch(search: URLSearchParams) {
  const athleteId = Number(search.get('athlete'));
  const week = search.get('week') ?? '';
  const slotId = search.get('slot') ?? '';
  if (!Number.isInteger(athleteId) || athleteId <= 0 || !isIsoWeek(week) || slotId === '') return null;
  return { athleteId, week, slotId };
}

export function Component() {
  const [search] = useSearchParams();
  const athlete = search.get('athlete');
  const week = search.get('week');
  const slot = search.get('slot');
  // eslint-disable-next-line react-hooks/exhaustive-deps -- the three values are the whole input
  const openCell = useMemo(() => cellFromSearch(search), [athlete, week, slot]);
  return (
    <BoardView
      range={defaultRange()}
      weekActions={<PublishWeekButton />}
      openCell={openCell}
      cellExtras={(cell, label) => (
        <MessageThread
          athleteId={cell.athleteId}
          week={cell.week}
          side="coach"
          heading="h3"
          title="Messages this week"
          cell={{ week: cell.week, slotId: cell.slotId, label }}
        />
      )}
    />
  );
}
