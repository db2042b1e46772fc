// The team rules' key factory and query (every coach reads them; the Rules page writes them).
import { queryOptions } from '@tanstack/react-query';
import type { TeamRulesDoc } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const rulesKeys = {
  all: ['rules'] as const,
  doc: () => [...rulesKeys.all, 'doc'] as const,
};

export const rulesOptions = () =>
  queryOptions({
    queryKey: rulesKeys.doc(),
    queryFn: ({ signal }) => api<TeamRulesDoc>('/rules', { signal }),
  });
