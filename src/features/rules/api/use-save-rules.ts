// Save the whole rules document with the version it was read at.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeamRulesBody, TeamRulesDoc } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { rulesKeys } from './queries';

export function useSaveRules() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TeamRulesBody) => api<TeamRulesDoc>('/rules', { method: 'PUT', body }),
    onSuccess: (doc) => queryClient.setQueryData(rulesKeys.doc(), doc),
  });
}
