// The board's key factory and query options: the board snapshot per week span and a cell's history.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { addWeeks, weekOfDate } from '../../../../shared/engine/weeks';
import type { BoardData, PlanHistoryList } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import type { CellRef } from '../model/board-model';

export const planKeys = {
  all: ['plans'] as const,
  boards: () => [...planKeys.all, 'board'] as const,
  board: (range: BoardRange) => [...planKeys.boards(), range] as const,
  histories: () => [...planKeys.all, 'history'] as const,
  history: (cell: CellRef) => [...planKeys.histories(), cell] as const,
};

export interface BoardRange {
  from: string;
  to: string;
}

/** The past four weeks, this week and the next eight. */
export function defaultRange(now = new Date()): BoardRange {
  const week = weekOfDate(now);
  return { from: addWeeks(week, -4), to: addWeeks(week, 8) };
}

/** Stamped when a snapshot arrives, so the time to draw it can be measured from there. */
export const BOARD_DATA_MARK = 'board:data';

export const boardQueryOptions = (range: BoardRange) =>
  queryOptions({
    queryKey: planKeys.board(range),
    queryFn: async ({ signal }) => {
      const data = await api<BoardData>(`/board?from=${range.from}&to=${range.to}`, { signal });
      performance.mark(BOARD_DATA_MARK);
      return data;
    },
    // Another coach's picks show up within half a minute, and at once after a conflict.
    refetchInterval: 30_000,
  });

export function useBoard(range: BoardRange) {
  return useQuery(boardQueryOptions(range));
}

export const cellHistoryQueryOptions = (cell: CellRef) =>
  queryOptions({
    queryKey: planKeys.history(cell),
    queryFn: ({ signal }) =>
      api<PlanHistoryList>(`/plans/${cell.athleteId}/${cell.week}/${cell.slotId}/history?limit=50`, { signal }),
  });

export function useCellHistory(cell: CellRef | null) {
  return useQuery({
    ...cellHistoryQueryOptions(cell ?? { athleteId: 0, week: '', slotId: '' }),
    enabled: cell !== null,
  });
}
