// Message threads: key factory and query options.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, MessageThread, ThreadSummary } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const messageKeys = {
  all: ['messages'] as const,
  lists: () => [...messageKeys.all, 'list'] as const,
  list: (athleteId: number | null) => [...messageKeys.lists(), athleteId ?? 'all'] as const,
  threads: () => [...messageKeys.all, 'thread'] as const,
  athleteThreads: (athleteId: number) => [...messageKeys.threads(), athleteId] as const,
  thread: (athleteId: number, week: string) => [...messageKeys.athleteThreads(athleteId), week] as const,
};

export const threadQueryOptions = (athleteId: number, week: string) =>
  queryOptions({
    queryKey: messageKeys.thread(athleteId, week),
    queryFn: ({ signal }) => api<MessageThread>(`/messages/threads/${athleteId}/${week}`, { signal }),
  });

export function useThread(athleteId: number, week: string) {
  return useQuery(threadQueryOptions(athleteId, week));
}

export const threadListQueryOptions = (athleteId: number | null) =>
  queryOptions({
    queryKey: messageKeys.list(athleteId),
    queryFn: ({ signal }) =>
      api<ListResponse<ThreadSummary>>(`/messages/threads${athleteId ? `?athleteId=${athleteId}` : ''}`, { signal }),
  });

export function useThreadList(athleteId: number | null) {
  return useQuery(threadListQueryOptions(athleteId));
}
