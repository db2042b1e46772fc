// Coaches' notices: key factory, query options and the mutations that mark them read or change the
// daily e-mail setting.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { NoticeList, NoticeSettings } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const noticeKeys = {
  all: ['notices'] as const,
  list: () => [...noticeKeys.all, 'list'] as const,
  settings: () => [...noticeKeys.all, 'settings'] as const,
};

/** Live updates ask for the list again when a notice comes; the slow poll covers a stream that is down. */
export const noticeListOptions = () =>
  queryOptions({
    queryKey: noticeKeys.list(),
    queryFn: ({ signal }) => api<NoticeList>('/notices?limit=30', { signal }),
    refetchInterval: 5 * 60_000,
  });

export function useNotices(enabled: boolean) {
  return useQuery({ ...noticeListOptions(), enabled });
}

export function useNoticeSettings(enabled: boolean) {
  return useQuery({
    queryKey: noticeKeys.settings(),
    queryFn: ({ signal }) => api<NoticeSettings>('/notices/settings', { signal }),
    enabled,
  });
}

export function useMarkNoticeRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number | 'all') =>
      api(id === 'all' ? '/notices/read-all' : `/notices/${id}/read`, { method: 'PUT' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: noticeKeys.list() }),
  });
}

export function useSetDailyEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NoticeSettings) => api<NoticeSettings>('/notices/settings', { method: 'PUT', body }),
    onSuccess: (saved) => queryClient.setQueryData(noticeKeys.settings(), saved),
  });
}
