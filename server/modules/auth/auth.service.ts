// Signing in: one answer for an unknown e-mail and a wrong password, held back after repeated failures.
import type { Me } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { SessionAuth } from '../../lib/session';
import { UnauthorizedError } from '../../lib/errors';
import { verifyPassword } from '../../lib/passwords';
import { findDefaultMembership, findUserByEmail } from './auth.repository';
import { startSession } from './sessions.service';
import { checkSignInAllowed, recordSignInFailure, recordSignInSuccess } from './sign-in-limits';

export const BAD_CREDENTIALS = 'That e-mail and password do not match an account.';

export interface Caller {
  /** The client's address as Express sees it (behind TRUST_PROXY hops). */
  address: string;
  userAgent: string | undefined;
}

export async function signIn(ctx: AppContext, email: string, password: string, caller: Caller) {
  await checkSignInAllowed(ctx, email, caller.address);
  const user = await findUserByEmail(ctx.database.db, email);
  const ok = await verifyPassword(password, user?.passwordHash ?? null);
  const membership = user && ok ? await findDefaultMembership(ctx.database.db, user.id) : null;
  if (!user || !membership) {
    await recordSignInFailure(ctx, email, caller.address);
    throw new UnauthorizedError(BAD_CREDENTIALS, 'invalid_credentials');
  }
  await recordSignInSuccess(ctx, email, caller.address);
  const token = await startSession(
    ctx,
    { userId: user.id, teamId: membership.teamId, role: membership.role },
    caller.userAgent,
  );
  return { token, userId: user.id, teamId: membership.teamId };
}

/** Who is signed in, as /api/auth/me answers it (and the first glance of My week carries it). */
export function meOf(a: SessionAuth): Me {
  return {
    id: a.userId,
    email: a.email,
    name: a.name,
    role: a.role,
    teamId: a.teamId,
    teamName: a.teamName,
    unit: a.unit,
    athleteId: a.athleteId,
  };
}

// Offered to invitations and password resets: finding an account, through this module's service.
export { findDefaultMembership, findUserByEmail } from './auth.repository';
