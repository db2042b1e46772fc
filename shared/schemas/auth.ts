// Sign-in, session and account contracts.
import { z } from 'zod';
import { roleSchema, unitSchema } from './common';

export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: 'Enter a valid e-mail address' }).max(254));

export const passwordField = z.string().min(10, 'Use at least 10 characters').max(200, 'Use at most 200 characters');

export const loginBody = z.object({
  email: emailField,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginBody = z.infer<typeof loginBody>;

export const meResponse = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  teamId: z.number(),
  teamName: z.string(),
  unit: unitSchema,
  athleteId: z.number().nullable(),
});
export type Me = z.infer<typeof meResponse>;

/** One signed-in browser or device of the caller's account. */
export const sessionItem = z.object({
  id: z.number(),
  /** Browser and system, read from the user agent ("Firefox on Linux"). */
  device: z.string(),
  createdAt: z.string(),
  lastSeenAt: z.string(),
  /** The session this request came from. */
  current: z.boolean(),
});
export type SessionItem = z.infer<typeof sessionItem>;

export const sessionList = z.object({ items: z.array(sessionItem), total: z.number() });
export type SessionList = z.infer<typeof sessionList>;

export const signOutEverywhereResponse = z.object({ ok: z.literal(true), ended: z.number() });
export type SignOutEverywhereResponse = z.infer<typeof signOutEverywhereResponse>;
