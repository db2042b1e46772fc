// Log a top set; the week page and the history both change.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LogTopSetBody, LoggedTopSet } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { historyKeys } from '../../history/api/queries';
import { myWeekKeys } from './queries';

export function useLogTopSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: LogTopSetBody) => api<LoggedTopSet>('/top-sets', { method: 'POST', body }),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
        queryClient.invalidateQueries({ queryKey: historyKeys.all }),
      ]);
    },
  });
}
