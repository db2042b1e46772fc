// Reading a refusal's body through its contracts (zod): the error body itself, a stale save's stored row
// and an import's row problems. Kept apart from the API client so the validation library is not in the
// code every page loads first: the client reads this module only once a request has been refused.
import {
  apiErrorBodySchema,
  csvImportErrorSchema,
  staleSaveErrorSchema,
  type ApiErrorBody,
  type CsvProblem,
} from '../../shared/schemas';
import { isApiError } from './api-client';

/** The error of a well-formed error body, or null for anything else (an HTML page, a broken shape). */
export function decodeErrorBody(data: unknown): ApiErrorBody['error'] | null {
  const decoded = apiErrorBodySchema.safeParse(data);
  return decoded.success ? decoded.data.error : null;
}

/**
 * The stored row a save refused as stale (409) carries — the other person's edit — or null for any other
 * failure. The body's shape is checked here; the row's type is the one the caller saved.
 */
export function staleSaveCurrent<Row extends object>(err: unknown): Row | null {
  if (!isApiError(err, 409)) return null;
  const parsed = staleSaveErrorSchema.safeParse(err.body);
  return parsed.success ? (parsed.data.current as Row) : null;
}

/** The problems, row by row, of a CSV import the server refused; null for any other failure. */
export function refusedCsvRows(err: unknown): CsvProblem[] | null {
  if (!isApiError(err)) return null;
  const parsed = csvImportErrorSchema.safeParse(err.body);
  return parsed.success ? parsed.data.rows : null;
}
