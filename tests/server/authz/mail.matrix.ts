// Invitations, password reset, publishing a week and the weekly e-mail's unsubscribe links.
import { randomBytes } from 'node:crypto';
import { invitations } from '../../../server/db/schema';
import { all, headOnly, staff, type MatrixModule } from './types';

const headCoachOnlyBody = { signedOut: 401, athlete: 403, coach: 403, headCoach: 422, otherTeam: 422 };
const staffBody = { signedOut: 401, athlete: 403, coach: 422, headCoach: 422, otherTeam: 422 };

export const matrix: MatrixModule = {
  async setup(db, team) {
    const make = async (email: string) => {
      const [row] = await db
        .insert(invitations)
        .values({
          teamId: team.teamId,
          email,
          role: 'coach',
          tokenHash: randomBytes(32).toString('hex'),
          expiresAt: new Date(Date.now() + 86_400_000),
          invitedBy: team.headCoach.id,
        })
        .$returningId();
      return row!.id;
    };
    return {
      invitationToResend: await make(`matrix-resend-${randomBytes(4).toString('hex')}@example.test`),
      invitationToRevoke: await make(`matrix-revoke-${randomBytes(4).toString('hex')}@example.test`),
    };
  },
  cases: {
    'GET /api/invitations': { path: () => '/api/invitations', expect: headOnly(200, 200) },
    'GET /api/invitations/linkable-athletes': {
      path: () => '/api/invitations/linkable-athletes',
      expect: headOnly(200, 200),
    },
    'POST /api/invitations': { path: () => '/api/invitations', invalidBody: {}, expect: headCoachOnlyBody },
    'POST /api/invitations/:id/resend': {
      path: (f) => `/api/invitations/${f.ids.invitationToResend}/resend`,
      expect: headOnly(200),
    },
    'POST /api/invitations/:id/revoke': {
      path: (f) => `/api/invitations/${f.ids.invitationToRevoke}/revoke`,
      expect: headOnly(200),
    },
    'GET /api/invitation-links/preview': { path: () => '/api/invitation-links/preview', expect: all(422) },
    'POST /api/invitation-links/accept': {
      path: () => '/api/invitation-links/accept',
      invalidBody: {},
      expect: all(422),
    },
    'POST /api/auth/password-reset': { path: () => '/api/auth/password-reset', invalidBody: {}, expect: all(422) },
    'GET /api/auth/password-reset/check': { path: () => '/api/auth/password-reset/check', expect: all(422) },
    'POST /api/auth/password-reset/complete': {
      path: () => '/api/auth/password-reset/complete',
      invalidBody: {},
      expect: all(422),
    },
    'GET /api/weeks/:week/publication': { path: () => '/api/weeks/2031-W10/publication', expect: staff(200, 200) },
    'POST /api/weeks/:week/publish': { path: () => '/api/weeks/2031-W99/publish', expect: staffBody },
    'GET /api/email/unsubscribe': { path: () => '/api/email/unsubscribe', expect: all(400) },
    'POST /api/email/unsubscribe': { path: () => '/api/email/unsubscribe', expect: all(400) },
    'POST /api/email/resubscribe': { path: () => '/api/email/resubscribe', expect: all(400) },
    'GET /api/email/font/:weight.woff2': { path: () => '/api/email/font/400.woff2', expect: all(200) },
  },
};
