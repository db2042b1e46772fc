// Password reset: a request answers the same whether or not the address has an account; a known address
// gets a single-use link valid for an hour. Using it sets the new password, ends every other session
// (their rows are deleted at once) and every other outstanding reset link of that account.
import { inTransaction } from '../../db/transaction';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/errors';
import { hashPassword } from '../../lib/passwords';
import { passwordChangedMail, passwordResetMail } from '../../services/mail/templates';
import { findDefaultMembership, findUserByEmail } from '../auth/auth.service';
import { endUserSessions } from '../auth/sessions.service';
import { appLink, hashLinkToken, newLinkToken } from '../../lib/link-tokens';
import * as repo from './password-reset.repository';

export const RESET_TTL_MS = 60 * 60 * 1000;

export const RESET_REQUESTED =
  'If that address has a Rackturn account, a link to choose a new password is on its way. It works for one hour.';

export async function requestReset(ctx: AppContext, email: string): Promise<void> {
  const user = await findUserByEmail(ctx.database.db, email);
  if (!user) return;
  const { token, hash } = newLinkToken();
  await inTransaction(ctx.database.db, async (tx) => {
    await repo.insertReset(tx, user.id, hash, new Date(Date.now() + RESET_TTL_MS));
    const mail = passwordResetMail({
      url: appLink(ctx.env.APP_ORIGIN, '/reset-password', { token }),
      validMinutes: RESET_TTL_MS / 60_000,
    });
    await ctx.services.mail.enqueue(tx, {
      kind: 'password_reset',
      dedupeKey: `password-reset:${hash.slice(0, 32)}`,
      to: user.email,
      ...mail,
    });
  });
  ctx.services.mail.kick();
}

type ResetRow = NonNullable<Awaited<ReturnType<typeof repo.findReset>>>;

function usable(row: ResetRow | null, now = new Date()): ResetRow {
  if (!row)
    throw new AppError(404, 'reset_not_found', 'This reset link is not valid. Check that you opened the whole link.');
  if (row.usedAt)
    throw new AppError(410, 'reset_used', 'This reset link has already been used. Ask for a new one if you need it.');
  if (row.expiresAt.getTime() <= now.getTime())
    throw new AppError(
      410,
      'reset_expired',
      'This reset link has expired: links work for one hour. Ask for a new one.',
    );
  return row;
}

export async function checkResetToken(ctx: AppContext, token: string) {
  usable(await repo.findReset(ctx.database.db, hashLinkToken(token)));
  return { ok: true as const };
}

/** Sets the new password; returns the session to start (the account's default team). */
export async function completeReset(ctx: AppContext, token: string, password: string) {
  const passwordHash = await hashPassword(password);
  const result = await inTransaction(ctx.database.db, async (tx) => {
    const row = usable(await repo.findReset(tx, hashLinkToken(token), true));
    const now = new Date();
    await repo.setPassword(tx, row.userId, passwordHash, now);
    await repo.useAllResets(tx, row.userId, now);
    await endUserSessions(ctx, row.userId, { db: tx });
    const mail = passwordChangedMail({ forgotUrl: appLink(ctx.env.APP_ORIGIN, '/forgot-password'), when: now });
    await ctx.services.mail.enqueue(tx, {
      kind: 'password_changed',
      dedupeKey: `password-changed:${row.id}`,
      to: row.email,
      ...mail,
    });
    return { userId: row.userId, membership: await findDefaultMembership(tx, row.userId) };
  });
  ctx.services.mail.kick();
  return result;
}
