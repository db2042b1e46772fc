// The coach's review of one athlete: key factory and query options.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AthleteReview } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const reviewKeys = {
  all: ['review'] as const,
  athletes: () => [...reviewKeys.all, 'athlete'] as const,
  athlete: (athleteId: number) => [...reviewKeys.athletes(), athleteId] as const,
};

export const athleteReviewQueryOptions = (athleteId: number) =>
  queryOptions({
    queryKey: reviewKeys.athlete(athleteId),
    queryFn: ({ signal }) => api<AthleteReview>(`/athletes/${athleteId}/review`, { signal }),
  });

export function useAthleteReview(athleteId: number) {
  return useQuery(athleteReviewQueryOptions(athleteId));
}
