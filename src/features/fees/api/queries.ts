// Coaching fees: the key factory and queries for the plans, the head coach's athlete table (its
// filters live in the page's URL) and the athlete's own fee.
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { AthleteFee, FeePlanList, ListResponse, PaymentStatus } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export type PlanStatusFilter = 'active' | 'all';

export interface AthleteFeeFilters {
  status: PaymentStatus | '';
  sort: string;
}

export const feeKeys = {
  all: ['fees'] as const,
  plans: () => [...feeKeys.all, 'plans'] as const,
  planList: (status: PlanStatusFilter) => [...feeKeys.plans(), status] as const,
  athletes: () => [...feeKeys.all, 'athletes'] as const,
  athleteList: (f: AthleteFeeFilters) => [...feeKeys.athletes(), f] as const,
  mine: () => [...feeKeys.all, 'mine'] as const,
};

const STATUSES = new Set<string>(['none', 'pending', 'active', 'past_due', 'cancelled']);
const SORTS = new Set(['name', 'status', 'renewal', 'lastPayment'].flatMap((s) => [s, `-${s}`]));

/** The Fees page's URL search → the athlete table's filters; the loader and the page read them alike. */
export function athleteFiltersFromSearch(params: URLSearchParams): AthleteFeeFilters {
  const status = params.get('status') ?? '';
  const sort = params.get('sort') ?? '';
  return {
    status: STATUSES.has(status) ? (status as PaymentStatus) : '',
    sort: SORTS.has(sort) ? sort : 'status',
  };
}

export const planListOptions = (status: PlanStatusFilter = 'active') =>
  queryOptions({
    queryKey: feeKeys.planList(status),
    queryFn: ({ signal }) => api<FeePlanList>(`/fees/plans?status=${status}&limit=500`, { signal }),
  });

export const athleteFeeListOptions = (f: AthleteFeeFilters) =>
  queryOptions({
    queryKey: feeKeys.athleteList(f),
    queryFn: ({ signal }) => {
      const p = new URLSearchParams({ sort: f.sort, limit: '500' });
      if (f.status) p.set('status', f.status);
      return api<ListResponse<AthleteFee>>(`/fees/athletes?${p.toString()}`, { signal });
    },
    placeholderData: keepPreviousData,
  });

export const myFeeOptions = () =>
  queryOptions({
    queryKey: feeKeys.mine(),
    queryFn: ({ signal }) => api<AthleteFee>('/my-fee', { signal }),
  });
