// Publish a week to the athletes: one e-mail each, once, however often it is pressed.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Publication } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { publishingKeys } from './queries';

export function usePublishWeek() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (week: string) =>
      api<Publication & { alreadyPublished: boolean }>(`/weeks/${encodeURIComponent(week)}/publish`, {
        method: 'POST',
      }),
    onSuccess: (data, week) => queryClient.setQueryData(publishingKeys.week(week), data),
    onSettled: (_d, _e, week) => queryClient.invalidateQueries({ queryKey: publishingKeys.week(week) }),
  });
}
