// The one place errors become JSON `{ error: { code, message, fields? } }`. Stack traces stay in the log.
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { Logger } from '../lib/logger';
import { AppError } from '../lib/errors';
import { fieldErrors } from './validate';

export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.path}.` } });
};

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  code?: string;
  field?: string;
}

const DB_DOWN = new Set([
  'ECONNREFUSED',
  'PROTOCOL_CONNECTION_LOST',
  'ETIMEDOUT',
  'ECONNRESET',
  'EPIPE',
  'ER_SERVER_SHUTDOWN',
]);

/** mysql2 connection failures, possibly wrapped by drizzle as the `cause`. */
function isDatabaseDown(err: unknown): boolean {
  for (let e = err as { code?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; depth++) {
    if (typeof e.code === 'string' && DB_DOWN.has(e.code)) return true;
    e = e.cause as typeof e;
  }
  return false;
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) {
      res.destroy();
      return;
    }
    if (err instanceof AppError) {
      res.status(err.status).json({ error: { code: err.code, message: err.message, ...err.extra } });
      return;
    }
    if (err instanceof ZodError) {
      res.status(422).json({
        error: { code: 'validation_failed', message: 'Some fields need attention.', fields: fieldErrors(err) },
      });
      return;
    }
    const e = (err ?? {}) as HttpishError;
    // body-parser and multer errors carry their own client-error status.
    if (e.type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'invalid_json', message: 'The request body is not valid JSON.' } });
      return;
    }
    if (e.type === 'entity.too.large' || e.code === 'LIMIT_FILE_SIZE') {
      res.status(413).json({ error: { code: 'payload_too_large', message: 'The request is too large.' } });
      return;
    }
    if (typeof e.code === 'string' && e.code.startsWith('LIMIT_')) {
      res
        .status(400)
        .json({ error: { code: 'invalid_upload', message: `The upload was refused (${e.code.toLowerCase()}).` } });
      return;
    }
    if (isDatabaseDown(err)) {
      res.status(503).json({
        error: { code: 'db_unavailable', message: 'The database is not reachable right now. Try again in a moment.' },
      });
      return;
    }
    const status = e.status ?? e.statusCode;
    if (status && status >= 400 && status < 500) {
      res.status(status).json({ error: { code: e.type ?? 'bad_request', message: 'The request could not be read.' } });
      return;
    }
    logger.error({ err, method: req.method, path: req.path }, 'unhandled error');
    res
      .status(500)
      .json({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
  };
}
