// Upload a CSV file of accessories; on success the library's lists are refetched.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LibraryImportResult } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { accessoryKeys } from './queries';

export const ACCESSORY_EXPORT_URL = '/api/accessories/export';

export function useImportAccessories() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const body = new FormData();
      body.append('file', file);
      return api<LibraryImportResult>('/accessories/import', { method: 'POST', body });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accessoryKeys.all }),
  });
}
