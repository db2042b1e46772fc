// A coach's comment on a video; the athlete's review refreshes.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Video, VideoCommentBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './queries';

export function useAddComment(athleteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ videoId, ...body }: VideoCommentBody & { videoId: number }) =>
      api<Video>(`/videos/${videoId}/comments`, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.athlete(athleteId) }),
  });
}
