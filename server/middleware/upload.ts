// The one place multipart uploads are received: one file in one field, into memory or a temporary file,
// with every way a form can be broken answered as a clear 400, 413 or 415 instead of a 500.
import type { RequestHandler } from 'express';
import multer from 'multer';
import { tmpdir } from 'node:os';
import { AppError, ValidationError } from '../lib/errors';

export interface UploadOptions {
  /** The form field that carries the file. */
  field: string;
  maxBytes: number;
  /** Memory for small files read at once (CSV), a temporary file for large ones (video). */
  storage: 'memory' | 'disk';
  /** The 413 message, e.g. "That video is larger than the 200 MB limit." */
  tooLarge: string;
  /** The field error when more than one file, or a file under another field name, is sent. */
  oneFile: string;
}

export function megabytes(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return mb >= 1 ? `${Math.round(mb * 10) / 10} MB` : `${Math.round(bytes / 1024)} kB`;
}

const NOT_A_FORM = () =>
  new AppError(
    415,
    'unsupported_media_type',
    'Send the file as multipart/form-data, the way a file picker in a form sends it.',
  );

/** What busboy and multer report, as a client error; null for failures of our own (a full disk). */
function toClientError(err: unknown, opts: UploadOptions): AppError | null {
  const e = err as { code?: string; message?: string; syscall?: string };
  if (err instanceof AppError) return err;
  if (e.syscall) return null;
  switch (e.code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError(413, 'file_too_large', opts.tooLarge);
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT':
      return new ValidationError('Some fields need attention.', { [opts.field]: [opts.oneFile] });
  }
  const message = e.message ?? '';
  if (/unexpected end|terminated early|truncated/i.test(message)) {
    return new AppError(
      400,
      'upload_incomplete',
      'The upload ended before the file was complete. Check the connection and send it again.',
    );
  }
  if (/boundary/i.test(message)) {
    return new AppError(
      400,
      'invalid_upload',
      'The upload could not be read: the form has no boundary. Send the file from a form or file picker.',
    );
  }
  return new AppError(400, 'invalid_upload', 'The upload could not be read as a form with one file. Send it again.');
}

export function receiveFile(opts: UploadOptions): RequestHandler {
  const upload = multer({
    storage: opts.storage === 'memory' ? multer.memoryStorage() : multer.diskStorage({ destination: tmpdir() }),
    limits: { fileSize: opts.maxBytes, files: 1, fields: 4, parts: 5 },
  }).single(opts.field);
  return (req, res, next) => {
    const type = req.get('content-type');
    const hasBody = Number(req.get('content-length') ?? 0) > 0 || req.get('transfer-encoding') !== undefined;
    // Without any body the route asks for the file; a body of another kind is the wrong media type.
    if (hasBody && !req.is('multipart/form-data')) return next(NOT_A_FORM());
    if (!hasBody && type && !req.is('multipart/form-data')) return next(NOT_A_FORM());
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      next(toClientError(err, opts) ?? err);
    });
  };
}
