// Upload a CSV file of variants; on success everything about the library is refetched.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LibraryImportResult } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { variantKeys } from './queries';

export function useImportLibrary() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const body = new FormData();
      body.append('file', file);
      return api<LibraryImportResult>('/variants/import', { method: 'POST', body });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: variantKeys.all }),
  });
}
