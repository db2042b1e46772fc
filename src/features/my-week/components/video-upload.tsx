// Attach a video to a logged top set: a progress bar while it uploads, and a way to cancel.
import { useEffect, useId, useRef, useState } from 'react';
import { VIDEO_TYPES } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CleanIcon } from '../../../components/ui/icons';
import { UploadCancelled, useUploadVideo } from '../api/use-upload-video';

export const VIDEO_ACCEPT = Object.values(VIDEO_TYPES).join(',');

export function VideoUpload({ topSetId, file: given }: { topSetId: number; file?: File | null }) {
  const id = useId();
  const upload = useUploadVideo();
  const [started, setStarted] = useState<File | null>(null);

  const { mutate } = upload;
  const start = (file: File) => {
    setStarted(file);
    mutate({ topSetId, file });
  };

  // A file chosen in the log form starts uploading as soon as the set is saved (once, even when React
  // runs effects twice in development).
  const autoStarted = useRef(false);
  useEffect(() => {
    if (!given || autoStarted.current) return;
    autoStarted.current = true;
    setStarted(given);
    mutate({ topSetId, file: given });
  }, [given, topSetId, mutate]);

  const pct = upload.progress === null ? 0 : Math.round(upload.progress * 100);
  const cancelled = upload.error instanceof UploadCancelled;
  return (
    <div className="flex flex-col gap-2">
      {upload.isPending ? (
        <div className="flex flex-col gap-2" aria-live="polite">
          <label htmlFor={`${id}-progress`} className="text-sm font-semibold text-ink-800">
            Uploading {started?.name ?? 'video'}… {pct}%
          </label>
          <progress id={`${id}-progress`} max={100} value={pct} className="h-3 w-full accent-rust-500" />
          <Button variant="secondary" onClick={upload.cancel} className="self-start">
            Cancel upload
          </Button>
        </div>
      ) : upload.isSuccess ? (
        <p role="status" className="flex items-center gap-2 text-sm font-semibold text-clean-700">
          <CleanIcon /> Video uploaded: your coach can watch it now.
        </p>
      ) : (
        <>
          {upload.error ? (
            <p role="alert" className="text-sm font-medium text-breach-700">
              {cancelled ? 'Upload cancelled. You can choose the video again.' : upload.error.message}
            </p>
          ) : null}
          <label
            htmlFor={id}
            className="inline-flex min-h-11 cursor-pointer items-center justify-center self-start rounded-md border border-ink-600 bg-chalk-50 px-4 font-semibold text-ink-900 hover:bg-chalk-200"
          >
            {upload.error ? 'Choose the video again' : 'Add a video of this set'}
          </label>
          <input
            id={id}
            type="file"
            accept={VIDEO_ACCEPT}
            className="sr-only"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) start(file);
              e.target.value = '';
            }}
          />
          <p className="text-sm text-ink-500">MP4, MOV or WebM, up to 200 MB.</p>
        </>
      )}
    </div>
  );
}
