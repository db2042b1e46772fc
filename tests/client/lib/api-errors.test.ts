// Error bodies are decoded once, in the API client: a refusal becomes a typed ApiError, a stale save's
// stored row and an import's row problems are read through their schemas, anything else is left out.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, api } from '../../../src/lib/api-client';
import { refusedCsvRows, staleSaveCurrent } from '../../../src/lib/api-refusals';

function answer(status: number, body: string) {
  vi.stubGlobal('fetch', async () => new Response(body, { status, headers: { 'Content-Type': 'application/json' } }));
}
const refusal = (promise: Promise<unknown>) =>
  promise.then(
    () => expect.unreachable('the request should fail'),
    (err: unknown) => err as ApiError,
  );

afterEach(() => vi.unstubAllGlobals());

describe('api() decodes refusals', () => {
  it('reads the code, message, field errors and extra keys of a well-formed body', async () => {
    answer(
      409,
      JSON.stringify({
        error: {
          code: 'stale_version',
          message: 'Saved by someone else.',
          fields: { name: ['Taken'] },
          current: { version: 4 },
        },
      }),
    );
    const err = await refusal(api('/meets/1', { method: 'PUT', body: {} }));
    expect(err).toBeInstanceOf(ApiError);
    expect([err.status, err.code, err.message]).toEqual([409, 'stale_version', 'Saved by someone else.']);
    expect(err.fields).toEqual({ name: ['Taken'] });
    expect(staleSaveCurrent<{ version: number }>(err)).toEqual({ version: 4 });
  });

  it('falls back to the status when the body is not an error body', async () => {
    answer(502, '<html>Bad gateway</html>');
    const err = await refusal(api('/meets'));
    expect([err.status, err.code, err.message, err.fields]).toEqual([
      502,
      'http_error',
      'The server answered 502.',
      {},
    ]);
    answer(500, JSON.stringify({ error: { code: 7, message: ['not text'] } }));
    expect((await refusal(api('/meets'))).code).toBe('http_error');
  });
});

describe('staleSaveCurrent and refusedCsvRows', () => {
  const refused = (status: number, extra: Record<string, unknown>) =>
    new ApiError(status, 'x', 'Refused.', {}, { code: 'x', message: 'Refused.', ...extra });

  it('give the stored row of a 409 only', () => {
    expect(staleSaveCurrent(refused(409, { current: { id: 1, version: 2 } }))).toEqual({ id: 1, version: 2 });
    expect(staleSaveCurrent(refused(409, {}))).toBeNull();
    expect(staleSaveCurrent(refused(409, { current: 'not a row' }))).toBeNull();
    expect(staleSaveCurrent(refused(422, { current: { id: 1 } }))).toBeNull();
    expect(staleSaveCurrent(new Error('network'))).toBeNull();
  });

  it('give the row problems of a refused import, and nothing for a malformed list', () => {
    const rows = [{ row: 3, field: 'lift', message: 'Unknown lift' }];
    expect(refusedCsvRows(refused(422, { rows }))).toEqual(rows);
    expect(refusedCsvRows(refused(422, { rows: [{ row: 'three' }] }))).toBeNull();
    expect(refusedCsvRows(refused(400, {}))).toBeNull();
    expect(refusedCsvRows(undefined)).toBeNull();
  });
});
