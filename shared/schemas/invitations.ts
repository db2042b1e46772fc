// Invitations: the head coach invites a coach or an athlete by e-mail; the invitee accepts with a link.
import { z } from 'zod';
import { emailField, passwordField } from './auth';
import { listQuery, roleSchema } from './common';

export const invitableRoleSchema = z.enum(['coach', 'athlete']);
export type InvitableRole = z.infer<typeof invitableRoleSchema>;

/** The token in an e-mailed link: 32 random bytes, base64url. */
export const linkTokenField = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9_-]{43}$/, 'This link is incomplete: open it again from the e-mail');

export const createInvitationBody = z
  .object({
    email: emailField,
    role: invitableRoleSchema,
    /** For an athlete: the roster entry (without an account) the new account takes over. */
    athleteId: z.number().int().positive().nullable().default(null),
    /** For an athlete not yet on the roster: the entry made for them now. */
    athleteName: z.string().trim().max(120, 'Use at most 120 characters').default(''),
    sex: z.enum(['M', 'F']).nullable().default(null),
  })
  .superRefine((b, ctx) => {
    if (b.role !== 'athlete' || b.athleteId !== null) return;
    if (!b.athleteName)
      ctx.addIssue({ code: 'custom', path: ['athleteName'], message: 'Give the athlete’s name for the roster' });
    if (!b.sex) ctx.addIssue({ code: 'custom', path: ['sex'], message: 'Pick the category the athlete competes in' });
  });
export type CreateInvitationInput = z.input<typeof createInvitationBody>;
export type CreateInvitationBody = z.output<typeof createInvitationBody>;

export const invitationStatusSchema = z.enum(['pending', 'expired', 'accepted', 'revoked']);
export type InvitationStatus = z.infer<typeof invitationStatusSchema>;

export const invitationSchema = z.object({
  id: z.number(),
  email: z.string(),
  role: roleSchema,
  athleteId: z.number().nullable(),
  athleteName: z.string().nullable(),
  status: invitationStatusSchema,
  invitedByName: z.string().nullable(),
  expiresAt: z.string(),
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const INVITATION_SORTS = ['createdAt', '-createdAt', 'email', '-email', 'expiresAt', '-expiresAt'] as const;

export const listInvitationsQuery = listQuery.extend({
  /** `open` is pending and expired together: what the head coach may still resend. */
  status: z.enum(['open', 'pending', 'expired', 'accepted', 'revoked', 'all']).default('open'),
  role: invitableRoleSchema.optional(),
  sort: z.enum(INVITATION_SORTS).default('-createdAt'),
});
export type ListInvitationsQuery = z.input<typeof listInvitationsQuery>;
export type ListInvitationsParams = z.output<typeof listInvitationsQuery>;

/** Roster entries without an account and without an open invitation: what an athlete invitation can link. */
export const linkableAthleteSchema = z.object({ id: z.number(), name: z.string() });
export type LinkableAthlete = z.infer<typeof linkableAthleteSchema>;

export const invitationTokenQuery = z.object({ token: linkTokenField });

/** What the invitee sees before accepting. */
export const invitationPreviewSchema = z.object({
  email: z.string(),
  role: roleSchema,
  teamName: z.string(),
  invitedByName: z.string().nullable(),
  athleteName: z.string().nullable(),
  /** The address already has a Rackturn account: accepting asks for its password instead of a new one. */
  existingAccount: z.boolean(),
  expiresAt: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const acceptNewAccountBody = z
  .object({
    token: linkTokenField,
    name: z.string().trim().min(1, 'Enter your name').max(120, 'Use at most 120 characters'),
    password: passwordField,
    confirmPassword: z.string(),
  })
  .refine((b) => b.password === b.confirmPassword, {
    path: ['confirmPassword'],
    message: 'The two passwords differ',
  });
export type AcceptNewAccountBody = z.infer<typeof acceptNewAccountBody>;

export const acceptExistingAccountBody = z.object({
  token: linkTokenField,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type AcceptExistingAccountBody = z.infer<typeof acceptExistingAccountBody>;

/** The accept route takes either shape; the server checks it against the kind of account the address has. */
export const acceptInvitationBody = z.object({
  token: linkTokenField,
  name: z.string().optional(),
  password: z.string().max(200),
  confirmPassword: z.string().optional(),
});
