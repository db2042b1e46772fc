// E-mail driven flows: password reset, publishing a week to the athletes, and stopping weekly e-mails.
import { z } from 'zod';
import { emailField, passwordField } from './auth';
import { isoWeek } from './common';
import { linkTokenField } from './invitations';

export const forgotPasswordBody = z.object({ email: emailField });
export type ForgotPasswordBody = z.infer<typeof forgotPasswordBody>;

export const resetTokenQuery = z.object({ token: linkTokenField });

export const resetPasswordBody = z
  .object({
    token: linkTokenField,
    password: passwordField,
    confirmPassword: z.string(),
  })
  .refine((b) => b.password === b.confirmPassword, {
    path: ['confirmPassword'],
    message: 'The two passwords differ',
  });
export type ResetPasswordBody = z.infer<typeof resetPasswordBody>;

export const publishWeekParams = z.object({ week: isoWeek });

export const publicationSchema = z.object({
  week: z.string(),
  published: z.boolean(),
  publishedAt: z.string().nullable(),
  publishedByName: z.string().nullable(),
  /** Athletes with an account and weekly e-mails on: who gets (or got) the e-mail. */
  recipients: z.number(),
  /** E-mails of this publication still waiting in the outbox, and those delivered. */
  queued: z.number(),
  sent: z.number(),
});
export type Publication = z.infer<typeof publicationSchema>;

/** Lenient on purpose: a broken link gets a readable page rather than a JSON error. */
export const unsubscribeQuery = z.object({ token: z.string().trim().max(2000).default('') });
