// Publish a week: each athlete whose week is new or changed is published and e-mailed (an update names
// what changed); pressing again with nothing new sends nothing.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { publicationSchema, publishResultSchema } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { publishingKeys } from './queries';

export function usePublishWeek() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (week: string) =>
      publishResultSchema.parse(
        await api<unknown>(`/weeks/${encodeURIComponent(week)}/publish`, { method: 'POST', body: { dryRun: false } }),
      ),
    // The publication's own fields (zod drops the rest).
    onSuccess: (data, week) => queryClient.setQueryData(publishingKeys.week(week), publicationSchema.parse(data)),
    onSettled: (_d, _e, week) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: publishingKeys.week(week) }),
        queryClient.invalidateQueries({ queryKey: publishingKeys.check(week) }),
      ]),
  });
}
