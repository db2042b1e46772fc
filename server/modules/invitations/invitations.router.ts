// /api/invitations: the head coach's invitations (list, invite, resend, revoke), and the public preview
// and acceptance behind the e-mailed link.
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import {
  acceptInvitationBody,
  createInvitationBody,
  idParams,
  invitationTokenQuery,
  listInvitationsQuery,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { MariaDbRateLimitStore } from '../../db/rate-limit-store';
import { HEAD_COACH, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { AppError } from '../../lib/errors';
import { setSessionCookie } from '../../lib/session';
import { startSession } from '../auth/sessions.service';
import {
  acceptInvitation,
  createInvitation,
  linkableAthletes,
  listTeamInvitations,
  previewInvitation,
  resendInvitation,
  revokeInvitation,
} from './invitations.service';

export function invitationsRouter(ctx: AppContext): Router {
  const router = Router();
  // Accepting with an existing account checks its password: limited like sign-in.
  const acceptLimit = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: ctx.env.LOGIN_LIMIT_PER_IP,
    store: new MariaDbRateLimitStore(ctx.database.db, 'accept-ip'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'too_many_attempts', 'Too many attempts. Wait a few minutes and try again.');
    },
  });

  router.get(
    '/invitations',
    requireRole(HEAD_COACH),
    validate({ query: listInvitationsQuery }, ({ query }, req) => listTeamInvitations(ctx, authOf(req).teamId, query)),
  );

  router.get(
    '/invitations/linkable-athletes',
    requireRole(HEAD_COACH),
    validate({}, (_input, req) => linkableAthletes(ctx, authOf(req).teamId)),
  );

  router.post(
    '/invitations',
    requireRole(HEAD_COACH),
    validate({ body: createInvitationBody }, async ({ body }, req, res) => {
      const invitation = await createInvitation(ctx, authOf(req), body);
      res.status(201);
      return invitation;
    }),
  );

  router.post(
    '/invitations/:id/resend',
    requireRole(HEAD_COACH),
    validate({ params: idParams }, ({ params }, req) => resendInvitation(ctx, authOf(req), params.id)),
  );

  router.post(
    '/invitations/:id/revoke',
    requireRole(HEAD_COACH),
    validate({ params: idParams }, ({ params }, req) => revokeInvitation(ctx, authOf(req), params.id)),
  );

  // Public: the link in the e-mail is the credential.
  router.get(
    '/invitation-links/preview',
    validate({ query: invitationTokenQuery }, ({ query }) => previewInvitation(ctx, query.token)),
  );

  router.post(
    '/invitation-links/accept',
    acceptLimit,
    validate({ body: acceptInvitationBody }, async ({ body }, req, res) => {
      const accepted = await acceptInvitation(ctx, body);
      setSessionCookie(req, res, await startSession(ctx, accepted, req.get('user-agent')));
      return { ok: true, role: accepted.role };
    }),
  );

  return router;
}
