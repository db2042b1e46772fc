// The one way the client talks to the API: JSON in, JSON out, failures as a typed ApiError.
import type { ApiErrorBody } from '../../shared/schemas';
import { takeEarly } from './early-requests';

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields: Record<string, string[]> = {},
    public readonly body: ApiErrorBody['error'] | null = null,
  ) {
    super(message);
  }
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** A UUID naming this write: the server answers a repeat of it with the first answer, writing nothing. */
  idempotencyKey?: string;
}

export async function api<T>(path: string, opts: RequestOptions = {}): Promise<T> {
  return (await apiWithDate<T>(path, opts)).data;
}

/** The answer and when the server gave it (its Date header): an answer read from the offline cache is older. */
export async function apiWithDate<T>(path: string, opts: RequestOptions = {}): Promise<{ data: T; date: Date | null }> {
  const isForm = typeof FormData !== 'undefined' && opts.body instanceof FormData;
  let res: Response;
  try {
    const early = opts.method === undefined || opts.method === 'GET' ? takeEarly(`/api${path}`) : undefined;
    res = await (early ??
      fetch(`/api${path}`, {
        method: opts.method ?? 'GET',
        credentials: 'same-origin',
        headers: {
          Accept: 'application/json',
          ...(opts.body === undefined || isForm ? {} : { 'Content-Type': 'application/json' }),
          ...(opts.idempotencyKey ? { 'Idempotency-Key': opts.idempotencyKey } : {}),
        },
        body: opts.body === undefined ? undefined : isForm ? (opts.body as FormData) : JSON.stringify(opts.body),
        signal: opts.signal,
      }));
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    throw new ApiError(0, 'network', 'Cannot reach Rackturn. Check the connection and try again.');
  }
  const sent = res.headers.get('Date');
  const date = sent && !Number.isNaN(Date.parse(sent)) ? new Date(sent) : null;
  if (res.status === 204) return { data: undefined as T, date };
  const text = await res.text();
  let data: unknown = null;
  try {
    data = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON: handled below */
  }
  if (!res.ok) {
    // The contracts (and the validation library) load only now, so they stay out of every page's first code.
    const err = await import('./api-refusals').then(
      (m) => m.decodeErrorBody(data),
      () => null,
    );
    throw new ApiError(
      res.status,
      err?.code ?? 'http_error',
      err?.message ?? `The server answered ${res.status}.`,
      err?.fields ?? {},
      err ?? null,
    );
  }
  return { data: (data ?? (text as unknown)) as T, date };
}

export function isApiError(err: unknown, status?: number): err is ApiError {
  return err instanceof ApiError && (status === undefined || err.status === status);
}
