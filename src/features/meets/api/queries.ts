// The meets' key factory and queries: every meet with its entries, and one meet.
import { queryOptions } from '@tanstack/react-query';
import type { ListResponse, Meet } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const meetKeys = {
  all: ['meets'] as const,
  lists: () => [...meetKeys.all, 'list'] as const,
  list: (when: 'upcoming' | 'past' | 'all') => [...meetKeys.lists(), { when }] as const,
  details: () => [...meetKeys.all, 'detail'] as const,
  detail: (id: number) => [...meetKeys.details(), id] as const,
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
