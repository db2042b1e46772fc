// Marks or unmarks an athlete's rest (deload) week; the board then reloads with it.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RestWeek } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { planKeys } from './queries';

export function useRestWeek() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ athleteId, week, rest }: { athleteId: number; week: string; rest: boolean }) => {
      const path = `/athletes/${athleteId}/rest-weeks/${week}`;
      if (rest) await api<RestWeek>(path, { method: 'PUT' });
      else await api<null>(path, { method: 'DELETE' });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: planKeys.boards() }),
  });
}
