// Add a variant or change one; the lists and the filter choices are refetched, the one variant updated.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LibraryVariant, VariantPatchBody, VariantValues } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { variantKeys } from './queries';

export function useCreateVariant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: VariantValues) => api<LibraryVariant>('/variants', { method: 'POST', body }),
    onSuccess: async (created) => {
      queryClient.setQueryData(variantKeys.detail(created.id), created);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: variantKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: variantKeys.facets() }),
      ]);
    },
  });
}

export function useUpdateVariant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: VariantPatchBody }) =>
      api<LibraryVariant>(`/variants/${id}`, { method: 'PATCH', body }),
    onSuccess: async (updated) => {
      queryClient.setQueryData(variantKeys.detail(updated.id), updated);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: variantKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: variantKeys.facets() }),
      ]);
    },
  });
}
