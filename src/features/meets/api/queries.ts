// The meets' key factory and queries: every meet with its entries, one meet, and its meet-day state.
import { queryOptions } from '@tanstack/react-query';
import type { ListResponse, Meet, MeetDay } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const meetKeys = {
  all: ['meets'] as const,
  lists: () => [...meetKeys.all, 'list'] as const,
  list: (when: 'upcoming' | 'past' | 'all') => [...meetKeys.lists(), { when }] as const,
  details: () => [...meetKeys.all, 'detail'] as const,
  detail: (id: number) => [...meetKeys.details(), id] as const,
  day: (id: number) => [...meetKeys.detail(id), 'day'] as const,
};

export const meetListOptions = (when: 'upcoming' | 'past' | 'all' = 'all') =>
  queryOptions({
    queryKey: meetKeys.list(when),
    queryFn: ({ signal }) => api<ListResponse<Meet>>(`/meets?when=${when}&sort=date&limit=200`, { signal }),
  });

export const meetOptions = (id: number) =>
  queryOptions({
    queryKey: meetKeys.detail(id),
    queryFn: ({ signal }) => api<Meet>(`/meets/${id}`, { signal }),
  });

export const meetDayOptions = (id: number) =>
  queryOptions({
    queryKey: meetKeys.day(id),
    queryFn: ({ signal }) => api<MeetDay>(`/meets/${id}/day`, { signal }),
    // Other coaches mark too: keep the screen close to live without hammering a weak connection.
    refetchInterval: 15_000,
  });
