// The library's key factory and queries: the filtered list (filters live in the page's URL), one
// variant, and the families, bars and equipment in use.
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { Lift } from '../../../../shared/engine/types';
import type { LibraryVariant, ListResponse, VariantFacets, VariantNarrowing } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

/** The library page's filters: the narrowing the board's drawer shares, plus archive, sort and page. */
export interface LibraryFilters extends VariantNarrowing {
  includeArchived: boolean;
  sort: string;
  page: number;
}

export const LIBRARY_PAGE_SIZE = 100;

export const variantKeys = {
  all: ['variants'] as const,
  lists: () => [...variantKeys.all, 'list'] as const,
  list: (f: LibraryFilters) => [...variantKeys.lists(), f] as const,
  details: () => [...variantKeys.all, 'detail'] as const,
  detail: (id: number) => [...variantKeys.details(), id] as const,
  facets: () => [...variantKeys.all, 'facets'] as const,
};

const LIFTS = new Set(['squat', 'bench', 'deadlift']);

/** The page's URL search → filters; the loader and the page read them the same way. */
export function filtersFromSearch(params: URLSearchParams): LibraryFilters {
  const lift = params.get('lift') ?? '';
  const risk = params.get('risk') ?? '';
  const page = Number(params.get('page') ?? '1');
  return {
    q: params.get('q') ?? '',
    lift: LIFTS.has(lift) ? (lift as Lift) : '',
    family: params.get('family') ?? '',
    equipment: params.get('equipment') ?? '',
    risk: risk === '1' || risk === '2' || risk === '3' ? risk : '',
    includeArchived: params.get('archived') === 'shown',
    sort: params.get('sort') ?? 'name',
    page: Number.isInteger(page) && page > 0 ? page : 1,
  };
}

function toQuery(f: LibraryFilters): string {
  const p = new URLSearchParams();
  if (f.q.trim()) p.set('q', f.q.trim());
  if (f.lift) p.set('lift', f.lift);
  if (f.family) p.set('family', f.family);
  if (f.equipment) p.set('equipment', f.equipment);
  if (f.risk) p.set('risk', f.risk);
  if (f.includeArchived) p.set('includeArchived', 'true');
  p.set('sort', f.sort);
  p.set('limit', String(LIBRARY_PAGE_SIZE));
  p.set('offset', String((f.page - 1) * LIBRARY_PAGE_SIZE));
  return p.toString();
}

export const variantListOptions = (f: LibraryFilters) =>
  queryOptions({
    queryKey: variantKeys.list(f),
    queryFn: ({ signal }) => api<ListResponse<LibraryVariant>>(`/variants?${toQuery(f)}`, { signal }),
    // Keeps the table on screen while the next filter's answer is on its way.
    placeholderData: keepPreviousData,
  });

export const variantFacetsOptions = () =>
  queryOptions({
    queryKey: variantKeys.facets(),
    queryFn: ({ signal }) => api<VariantFacets>('/variants/facets', { signal }),
  });

export const EXPORT_URL = '/api/variants/export';
