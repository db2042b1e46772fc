// Add an accessory or change one (archiving and bringing back included); the lists are refetched.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AccessoryPatchBody, AccessoryValues, LibraryAccessory } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { accessoryKeys } from './queries';

export function useCreateAccessory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AccessoryValues) => api<LibraryAccessory>('/accessories', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accessoryKeys.lists() }),
  });
}

export function useUpdateAccessory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: AccessoryPatchBody }) =>
      api<LibraryAccessory>(`/accessories/${id}`, { method: 'PATCH', body }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: accessoryKeys.lists() }),
  });
}
