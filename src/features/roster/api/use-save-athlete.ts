// Add an athlete, change one (profile, equipment, overrides, account link), or archive one.
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { Athlete, AthleteBody, AthletePatchBody } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys } from '../../../lib/query-keys';

async function afterWrite(queryClient: QueryClient, athlete: Athlete, accountsChanged: boolean) {
  queryClient.setQueryData(athleteKeys.detail(athlete.id), athlete);
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: athleteKeys.lists() }),
    ...(accountsChanged ? [queryClient.invalidateQueries({ queryKey: athleteKeys.accounts() })] : []),
  ]);
}

export function useCreateAthlete() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AthleteBody) => api<Athlete>('/athletes', { method: 'POST', body }),
    onSuccess: (a, body) => afterWrite(queryClient, a, body.userId != null),
  });
}

export function useUpdateAthlete() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: AthletePatchBody }) =>
      api<Athlete>(`/athletes/${id}`, { method: 'PATCH', body }),
    onSuccess: (a, { body }) => afterWrite(queryClient, a, body.userId !== undefined),
  });
}

export function useArchiveAthlete() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<Athlete>(`/athletes/${id}`, { method: 'DELETE' }),
    onSuccess: (a) => afterWrite(queryClient, a, false),
  });
}
