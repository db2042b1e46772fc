// Building blocks shared by every request and response contract.
import { z } from 'zod';
import { isIsoWeek } from '../engine/weeks';

export const isoWeek = z.string().trim().refine(isIsoWeek, { message: 'Use an ISO week like 2027-W05' });

export const isoDate = z.iso.date({ message: 'Use a date like 2027-03-14' });

/** Database ids travel as positive integers; in paths they arrive as strings. */
export const idParam = z.coerce
  .number({ message: 'Must be a number' })
  .int('Must be a whole number')
  .positive('Must be positive')
  .max(Number.MAX_SAFE_INTEGER);

export const idParams = z.object({ id: idParam });

export const listQuery = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
});

export const roleSchema = z.enum(['head_coach', 'coach', 'athlete']);
export type Role = z.infer<typeof roleSchema>;

export const unitSchema = z.enum(['kg', 'lb']);
export type Unit = z.infer<typeof unitSchema>;

export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    fields?: Record<string, string[]>;
    [extra: string]: unknown;
  };
}

/** The same body as the client decodes it; extra keys (`current`, `rows`, `violations` …) pass through. */
export const apiErrorBodySchema = z.object({
  error: z.looseObject({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.array(z.string())).optional(),
  }),
});

/** A save refused as stale (409) carries the row as it is stored now, in the shape its read answers with. */
export const staleSaveErrorSchema = z.object({ current: z.looseObject({}) });

export interface ListResponse<T> {
  items: T[];
  total: number;
}

/** A version the client read, sent back so the server can refuse a write that would lose someone's edit. */
export const versionField = z.number().int().positive();
