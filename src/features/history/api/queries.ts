// The athlete's history: records per variant, e1RM and bodyweight series, and the sets of one variant.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, Series, TopSet, Unit, VariantHistory, Video } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { historyKeys, type TopSetFilter } from '../../../lib/query-keys';

export interface MyHistory {
  unit: Unit;
  variants: VariantHistory[];
  series: Series;
  videos: Video[];
}

export const myHistoryQueryOptions = () =>
  queryOptions({
    queryKey: historyKeys.mine(),
    queryFn: ({ signal }) => api<MyHistory>('/my-history', { signal }),
  });

export function useMyHistory() {
  return useQuery(myHistoryQueryOptions());
}

export const topSetsQueryOptions = (filter: TopSetFilter) =>
  queryOptions({
    queryKey: historyKeys.topSets(filter),
    queryFn: ({ signal }) => {
      const q = new URLSearchParams({ variantId: String(filter.variantId), sort: 'newest', limit: '50' });
      if (filter.athleteId) q.set('athleteId', String(filter.athleteId));
      return api<ListResponse<TopSet>>(`/top-sets?${q.toString()}`, { signal });
    },
  });

export function useTopSets(filter: TopSetFilter, enabled = true) {
  return useQuery({ ...topSetsQueryOptions(filter), enabled });
}
