// The coach's board page: loads this span of weeks before showing it.
import type { QueryClient } from '@tanstack/react-query';
import { boardQueryOptions, defaultRange } from '../../features/board/api/queries';
import { BoardView } from '../../features/board/components/board-view';
import { PublishWeekButton } from '../../features/publishing/components/publish-week-button';

export function makeLoader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(boardQueryOptions(defaultRange()));
    return null;
  };
}

export function Component() {
  return <BoardView range={defaultRange()} weekActions={<PublishWeekButton />} />;
}
