// Upload a top set's video with XMLHttpRequest, whose upload events give a progress bar and abort()
// a cancel button (fetch has neither for request bodies).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useCallback, useRef, useState } from 'react';
import { VIDEO_FIELD, type ApiErrorBody, type Video } from '../../../../shared/schemas';
import { ApiError } from '../../../lib/api-client';
import { historyKeys } from '../../../lib/query-keys';
import { myWeekKeys } from './queries';

export class UploadCancelled extends Error {
  constructor() {
    super('Upload cancelled.');
  }
}

export function uploadVideo(
  topSetId: number,
  file: File,
  opts: { onProgress: (fraction: number) => void; onStart: (xhr: XMLHttpRequest) => void },
): Promise<Video> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/top-sets/${topSetId}/video`);
    xhr.responseType = 'text';
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) opts.onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      let data: unknown = null;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(data as Video);
      const err = (data as ApiErrorBody | null)?.error;
      reject(
        new ApiError(
          xhr.status,
          err?.code ?? 'http_error',
          err?.message ?? `The server answered ${xhr.status}.`,
          err?.fields ?? {},
          err ?? null,
        ),
      );
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload stopped: check the connection and try again.'));
    xhr.onabort = () => reject(new UploadCancelled());
    const form = new FormData();
    form.append(VIDEO_FIELD, file, file.name);
    opts.onStart(xhr);
    xhr.send(form);
  });
}

export function useUploadVideo() {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState<number | null>(null);
  const xhr = useRef<XMLHttpRequest | null>(null);
  const mutation = useMutation({
    mutationFn: ({ topSetId, file }: { topSetId: number; file: File }) => {
      setProgress(0);
      return uploadVideo(topSetId, file, { onProgress: setProgress, onStart: (x) => (xhr.current = x) });
    },
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: myWeekKeys.weeks() }),
        queryClient.invalidateQueries({ queryKey: historyKeys.all }),
      ]);
    },
    onSettled: () => {
      xhr.current = null;
      setProgress(null);
    },
  });
  const cancel = useCallback(() => xhr.current?.abort(), []);
  return { ...mutation, progress, cancel };
}
