// Delete a variant (the server archives it instead when someone's history uses it).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { VariantDeleteResult } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { athleteKeys } from '../../../lib/query-keys';
import { variantKeys } from './queries';

export function useDeleteVariant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<VariantDeleteResult>(`/variants/${id}`, { method: 'DELETE' }),
    onSuccess: async (result, id) => {
      if (result.result === 'deleted') queryClient.removeQueries({ queryKey: variantKeys.detail(id) });
      else queryClient.setQueryData(variantKeys.detail(id), result.item);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: variantKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: variantKeys.facets() }),
        // Athletes' histories mark archived variants.
        ...(result.result === 'archived' ? [queryClient.invalidateQueries({ queryKey: athleteKeys.histories() })] : []),
      ]);
    },
  });
}
