// Signing in: one answer for an unknown e-mail and a wrong password.
import type { AppContext } from '../../context';
import { UnauthorizedError } from '../../lib/errors';
import { verifyPassword } from '../../lib/passwords';
import { findDefaultMembership, findUserByEmail } from './auth.repository';

export const BAD_CREDENTIALS = 'That e-mail and password do not match an account.';

export async function signIn(ctx: AppContext, email: string, password: string) {
  const user = await findUserByEmail(ctx.database.db, email);
  const ok = await verifyPassword(password, user?.passwordHash ?? null);
  if (!user || !ok) throw new UnauthorizedError(BAD_CREDENTIALS, 'invalid_credentials');
  const membership = await findDefaultMembership(ctx.database.db, user.id);
  if (!membership) throw new UnauthorizedError(BAD_CREDENTIALS, 'invalid_credentials');
  const token = await ctx.sessions.sign(user.id, membership.teamId);
  return { token, userId: user.id, teamId: membership.teamId };
}
