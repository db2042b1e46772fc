// Idempotency keys for the writes an athlete's phone may send more than once (its offline queue retries
// when an answer was lost). A request with an `Idempotency-Key` header (a UUID) is run once per caller
// and key; a repeat gets the first answer again (with `Idempotent-Replayed: true`) and writes nothing;
// the same key on another request is refused with 422. Without the header nothing changes.
//
// The key is claimed before the handler runs and its answer kept before it is sent, so a copy that
// arrives at the same moment, on any instance, waits for that answer. Answers of 5xx give the key back
// (nothing was written; a retry runs again). One gap is left: an instance that stops between the
// handler's commit and keeping its answer leaves a claim that goes stale after 30 s, and a copy after
// that runs the write again; closing it would need every handler's write in the key's transaction.
import { createHash } from 'node:crypto';
import type { RequestHandler } from 'express';
import stringify from 'safe-stable-stringify';
import type { AppContext } from '../context';
import { claimIdempotencyKey, completeIdempotencyKey, releaseIdempotencyKey } from '../db/idempotency-store';
import { AppError } from '../lib/errors';
import { authOf } from './auth';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Goes after requireRole (the caller is part of the key) and before validate. */
export function idempotent(ctx: AppContext): RequestHandler {
  const db = ctx.database.db;
  return async (req, res, next) => {
    const header = req.get(IDEMPOTENCY_HEADER);
    if (header === undefined) return next();
    if (!UUID.test(header)) {
      throw new AppError(
        400,
        'invalid_idempotency_key',
        `The ${IDEMPOTENCY_HEADER} header must be a UUID such as 3f1c9a2e-7b4d-4e8a-9c61-0d2f5b7e8a14.`,
      );
    }
    const userId = authOf(req).userId;
    const idemKey = header.toLowerCase();
    const route = `${req.method} ${req.baseUrl}${req.path}`.slice(0, 255);
    const fingerprint = createHash('sha256')
      .update(`${route}\n${stringify(req.body ?? {})}`)
      .digest('hex');
    const outcome = await claimIdempotencyKey(db, { userId, idemKey, route, fingerprint });
    if (outcome.kind === 'mismatch') {
      throw new AppError(
        422,
        'idempotency_key_reused',
        `This ${IDEMPOTENCY_HEADER} was already used for another request (${outcome.route}). Send a new key with a new request.`,
      );
    }
    if (outcome.kind === 'in_progress') {
      throw new AppError(409, 'request_in_progress', 'The same request is still being handled. Try again in a moment.');
    }
    if (outcome.kind === 'answered') {
      res.setHeader('Idempotent-Replayed', 'true');
      res.status(outcome.status).type('application/json').send(outcome.response);
      return;
    }
    // Claimed: keep the answer before it leaves, so a copy that asks next finds it.
    let settled = false;
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      settled = true;
      const status = res.statusCode;
      const keep =
        status >= 500
          ? releaseIdempotencyKey(db, userId, idemKey)
          : completeIdempotencyKey(db, userId, idemKey, { status, response: JSON.stringify(body) ?? 'null' });
      keep
        .catch((err: unknown) => ctx.logger.warn({ err }, 'idempotency key: the answer could not be kept'))
        .finally(() => json(body));
      return res;
    };
    // An answer sent some other way than JSON gives the key back. A caller that went away changes nothing:
    // the handler still runs to its answer, which is kept for the retry.
    res.on('finish', () => {
      if (!settled) void releaseIdempotencyKey(db, userId, idemKey).catch(() => undefined);
    });
    next();
  };
}
