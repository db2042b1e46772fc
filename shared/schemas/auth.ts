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
