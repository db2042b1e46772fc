// The accessory library's key factory and queries: the list filtered by category, search and archived.
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  ACCESSORY_CATEGORIES,
  type AccessoryCategory,
  type LibraryAccessory,
  type ListResponse,
} from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export interface AccessoryFilters {
  q: string;
  category: AccessoryCategory | '';
  includeArchived: boolean;
}

export const accessoryKeys = {
  all: ['accessories'] as const,
  lists: () => [...accessoryKeys.all, 'list'] as const,
  list: (f: AccessoryFilters) => [...accessoryKeys.lists(), f] as const,
};

/** The page's URL search → filters; the loader and the page read them the same way. */
export function accessoryFiltersFromSearch(params: URLSearchParams): AccessoryFilters {
  const category = params.get('category') ?? '';
  return {
    q: params.get('q') ?? '',
    category: (ACCESSORY_CATEGORIES as readonly string[]).includes(category) ? (category as AccessoryCategory) : '',
    includeArchived: params.get('archived') === 'shown',
  };
}

export function accessorySearch(f: AccessoryFilters): URLSearchParams {
  const p = new URLSearchParams();
  if (f.q) p.set('q', f.q);
  if (f.category) p.set('category', f.category);
  if (f.includeArchived) p.set('archived', 'shown');
  return p;
}

function toQuery(f: AccessoryFilters): string {
  const p = new URLSearchParams({ limit: '500', sort: 'category' });
  if (f.q.trim()) p.set('q', f.q.trim());
  if (f.category) p.set('category', f.category);
  if (f.includeArchived) p.set('includeArchived', 'true');
  return p.toString();
}

export const accessoryListOptions = (f: AccessoryFilters) =>
  queryOptions({
    queryKey: accessoryKeys.list(f),
    queryFn: ({ signal }) => api<ListResponse<LibraryAccessory>>(`/accessories?${toQuery(f)}`, { signal }),
    placeholderData: keepPreviousData,
  });
