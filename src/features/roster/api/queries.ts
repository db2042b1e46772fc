// The roster's key factory and queries: the athlete list, one athlete, their history, the linkable
// accounts, and the team rules the overrides are shown against.
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { Athlete, AthleteHistory, LinkableAccount, ListResponse, VariantFacets } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys, type RosterFilters } from '../../../lib/query-keys';

export type { RosterFilters };

export function rosterFiltersFromSearch(params: URLSearchParams): RosterFilters {
  return {
    q: params.get('q') ?? '',
    includeArchived: params.get('archived') === 'shown',
    sort: params.get('sort') ?? 'name',
  };
}

export const athleteListOptions = (f: RosterFilters) => {
  const p = new URLSearchParams({ sort: f.sort, limit: '500' });
  if (f.q.trim()) p.set('q', f.q.trim());
  if (f.includeArchived) p.set('includeArchived', 'true');
  return queryOptions({
    queryKey: athleteKeys.list(f),
    queryFn: ({ signal }) => api<ListResponse<Athlete>>(`/athletes?${p}`, { signal }),
    placeholderData: keepPreviousData,
  });
};

export const athleteOptions = (id: number) =>
  queryOptions({
    queryKey: athleteKeys.detail(id),
    queryFn: ({ signal }) => api<Athlete>(`/athletes/${id}`, { signal }),
  });

export const athleteHistoryOptions = (id: number) =>
  queryOptions({
    queryKey: athleteKeys.history(id),
    queryFn: ({ signal }) => api<AthleteHistory>(`/athletes/${id}/history`, { signal }),
  });

export const accountsOptions = () =>
  queryOptions({
    queryKey: athleteKeys.accounts(),
    queryFn: ({ signal }) => api<ListResponse<LinkableAccount>>('/athletes/accounts', { signal }),
  });

export const familiesOptions = () =>
  queryOptions({
    queryKey: athleteKeys.families(),
    queryFn: async ({ signal }) => (await api<VariantFacets>('/variants/facets', { signal })).families,
  });
