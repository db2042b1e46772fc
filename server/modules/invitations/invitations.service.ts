// Invitations: invite by e-mail (the mail is queued in the same transaction), resend with a fresh token,
// revoke, and accept — which creates the account or adds a membership and signs the invitee in.
import { inTransaction } from '../../db/transaction';
import type {
  CreateInvitationBody,
  Invitation,
  InvitationPreview,
  InvitationStatus,
  ListInvitationsParams,
} from '../../../shared/schemas';
import { acceptExistingAccountBody, acceptInvitationBody, acceptNewAccountBody } from '../../../shared/schemas';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import type { AuthContext } from '../../middleware/auth';
import { fieldErrors } from '../../middleware/validate';
import { isDuplicateKey } from '../../db/errors';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { hashPassword, verifyPassword } from '../../lib/passwords';
import { invitationMail } from '../../services/mail/templates';
import { findUserByEmail } from '../auth/auth.service';
import { appLink, hashLinkToken, newLinkToken } from '../../lib/link-tokens';
import * as repo from './invitations.repository';
import type { InvitationRow } from './invitations.repository';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export function statusOf(row: Pick<InvitationRow, 'acceptedAt' | 'revokedAt' | 'expiresAt'>, now = new Date()) {
  if (row.acceptedAt) return 'accepted' satisfies InvitationStatus;
  if (row.revokedAt) return 'revoked' satisfies InvitationStatus;
  return row.expiresAt.getTime() <= now.getTime() ? 'expired' : 'pending';
}

export function toInvitation(row: InvitationRow, now = new Date()): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    athleteId: row.athleteId,
    athleteName: row.athleteName,
    status: statusOf(row, now),
    invitedByName: row.invitedByName,
    expiresAt: row.expiresAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}

export async function listTeamInvitations(ctx: AppContext, teamId: number, q: ListInvitationsParams) {
  const { items, total } = await repo.listInvitations(ctx.database.db, teamId, q);
  const now = new Date();
  return { items: items.map((r) => toInvitation(r, now)), total };
}

async function queueInvitationMail(
  ctx: AppContext,
  db: Parameters<typeof repo.findInvitation>[0],
  inv: { id: number; teamId: number; email: string; role: InvitationRow['role']; expiresAt: Date },
  token: string,
  hash: string,
  inviterName: string | null,
) {
  const mail = invitationMail({
    teamName: await repo.teamName(db, inv.teamId),
    inviterName,
    role: inv.role === 'coach' ? 'coach' : 'athlete',
    url: appLink(ctx.env.APP_ORIGIN, '/accept-invitation', { token }),
    expiresAt: inv.expiresAt,
  });
  await ctx.services.mail.enqueue(db, {
    kind: 'invitation',
    // One message per token: a resend has a new token and so a new message.
    dedupeKey: `invitation:${inv.id}:${hash.slice(0, 24)}`,
    teamId: inv.teamId,
    to: inv.email,
    ...mail,
  });
}

const alreadyInvited = () =>
  new AppError(409, 'already_invited', 'That address already has an open invitation: resend it from the list instead.');

export async function createInvitation(ctx: AppContext, auth: AuthContext, body: CreateInvitationBody) {
  const now = new Date();
  const expiresAt = new Date(now.getTime() + INVITATION_TTL_MS);
  const { token, hash } = newLinkToken();
  const id = await inTransaction(ctx.database.db, async (tx) => {
    if (await repo.isMemberByEmail(tx, auth.teamId, body.email))
      throw new AppError(409, 'already_member', 'That address already belongs to someone in this team.');
    if (await repo.findPendingForEmail(tx, auth.teamId, body.email, now)) throw alreadyInvited();
    let athleteId: number | null = null;
    if (body.role === 'athlete') {
      if (body.athleteId !== null) {
        const athlete = await repo.findTeamAthleteForLink(tx, auth.teamId, body.athleteId);
        if (!athlete || athlete.archivedAt) throw new NotFoundError('That roster entry');
        if (athlete.userId !== null)
          throw new AppError(409, 'athlete_has_account', `${athlete.name} already has an account.`);
        if (await repo.athleteHasPendingInvitation(tx, athlete.id, now))
          throw new AppError(409, 'athlete_already_invited', `${athlete.name} already has an open invitation.`);
        athleteId = athlete.id;
      } else {
        athleteId = await repo.insertRosterEntry(tx, auth.teamId, body.athleteName, body.sex!);
      }
    }
    await repo.revokeExpiredForEmail(tx, auth.teamId, body.email, now);
    const invitationId = await repo
      .insertInvitation(tx, {
        teamId: auth.teamId,
        email: body.email,
        role: body.role,
        athleteId,
        tokenHash: hash,
        expiresAt,
        invitedBy: auth.userId,
      })
      .catch((err: unknown) => {
        // Another request opened one for this address a moment ago: the unique key said no, and
        // throwing here rolls back the roster entry made for it above.
        throw isDuplicateKey(err) ? alreadyInvited() : err;
      });
    await queueInvitationMail(
      ctx,
      tx,
      { id: invitationId, teamId: auth.teamId, email: body.email, role: body.role, expiresAt },
      token,
      hash,
      auth.name,
    );
    return invitationId;
  });
  ctx.services.mail.kick();
  return toInvitation((await repo.findInvitation(ctx.database.db, auth.teamId, id))!);
}

/** A fresh token and expiry; the old link stops working at once. */
export async function resendInvitation(ctx: AppContext, auth: AuthContext, id: number) {
  const { token, hash } = newLinkToken();
  await inTransaction(ctx.database.db, async (tx) => {
    const row = await repo.findInvitation(tx, auth.teamId, id);
    if (!row) throw new NotFoundError('That invitation');
    const status = statusOf(row);
    if (status === 'accepted' || status === 'revoked')
      throw new ConflictError(`That invitation was ${status} and cannot be sent again.`, toInvitation(row));
    const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
    await repo.replaceToken(tx, id, hash, expiresAt);
    await queueInvitationMail(ctx, tx, { ...row, expiresAt }, token, hash, auth.name);
  });
  ctx.services.mail.kick();
  return toInvitation((await repo.findInvitation(ctx.database.db, auth.teamId, id))!);
}

export async function revokeInvitation(ctx: AppContext, auth: AuthContext, id: number) {
  const row = await repo.findInvitation(ctx.database.db, auth.teamId, id);
  if (!row) throw new NotFoundError('That invitation');
  if (row.acceptedAt) throw new ConflictError('That invitation was already accepted.', toInvitation(row));
  if (!row.revokedAt) await repo.markRevoked(ctx.database.db, id);
  return toInvitation((await repo.findInvitation(ctx.database.db, auth.teamId, id))!);
}

export async function linkableAthletes(ctx: AppContext, teamId: number) {
  const items = await repo.listLinkableAthletes(ctx.database.db, teamId);
  return { items, total: items.length };
}

const UNKNOWN = () =>
  new AppError(404, 'invitation_not_found', 'This invitation link is not valid. Check that you opened the whole link.');

/** Why a link can no longer be used, in words for the invitee. */
function refuseUnusable(status: InvitationStatus): void {
  if (status === 'accepted')
    throw new AppError(410, 'invitation_used', 'This invitation has already been used. Sign in instead.');
  if (status === 'revoked')
    throw new AppError(
      410,
      'invitation_revoked',
      'This invitation was withdrawn. Ask your coach if that is a mistake.',
    );
  if (status === 'expired')
    throw new AppError(410, 'invitation_expired', 'This invitation has expired. Ask your coach to send a new one.');
}

export async function previewInvitation(ctx: AppContext, token: string): Promise<InvitationPreview> {
  const row = await repo.findByTokenHash(ctx.database.db, hashLinkToken(token));
  if (!row) throw UNKNOWN();
  refuseUnusable(statusOf(row));
  const existing = await findUserByEmail(ctx.database.db, row.email);
  return {
    email: row.email,
    role: row.role,
    teamName: row.teamName,
    invitedByName: row.invitedByName,
    athleteName: row.athleteName,
    existingAccount: Boolean(existing),
    expiresAt: row.expiresAt.toISOString(),
  };
}

function parseOrThrow<T extends z.ZodType>(schema: T, value: unknown): z.output<T> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw new ValidationError('Some fields need attention.', fieldErrors(parsed.error));
  return parsed.data;
}

/**
 * Uses the invitation once: a new account (name and password) or, for an address that already has an
 * account, that account's password; then the membership, the roster link and the acceptance, all in one
 * transaction. Returns who to sign in, and where.
 */
export async function acceptInvitation(ctx: AppContext, body: z.output<typeof acceptInvitationBody>) {
  const hash = hashLinkToken(body.token);
  return inTransaction(ctx.database.db, async (tx) => {
    const row = await repo.findByTokenHash(tx, hash, true);
    if (!row) throw UNKNOWN();
    refuseUnusable(statusOf(row));
    const existing = await findUserByEmail(tx, row.email);
    let userId: number;
    if (existing) {
      const { password } = parseOrThrow(acceptExistingAccountBody, body);
      if (!(await verifyPassword(password, existing.passwordHash)))
        throw new ValidationError('Some fields need attention.', {
          password: ['That is not the password of the account for this address.'],
        });
      if (await repo.isMemberByEmail(tx, row.teamId, row.email))
        throw new AppError(409, 'already_member', 'You are already in this team. Sign in instead.');
      userId = existing.id;
    } else {
      const fresh = parseOrThrow(acceptNewAccountBody, body);
      userId = await repo.insertUser(tx, {
        email: row.email,
        name: fresh.name,
        passwordHash: await hashPassword(fresh.password),
      });
    }
    await repo.insertMembership(tx, row.teamId, userId, row.role);
    if (row.role === 'athlete' && row.athleteId !== null) {
      if (!(await repo.linkAthlete(tx, row.teamId, row.athleteId, userId)))
        throw new AppError(409, 'athlete_has_account', 'That roster entry already has an account. Ask your coach.');
    }
    await repo.markAccepted(tx, row.id);
    return { userId, teamId: row.teamId, role: row.role };
  });
}
