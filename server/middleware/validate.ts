// One validation step for params, query and body, fed by the shared zod contracts. A handler wrapped
// in `validate` receives typed, parsed input; whatever it returns is sent as JSON.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { ValidationError } from '../lib/errors';

interface Schemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}
type Parsed<S extends Schemas, K extends keyof Schemas> = S[K] extends z.ZodType ? z.output<S[K]> : undefined;
export interface Input<S extends Schemas> {
  params: Parsed<S, 'params'>;
  query: Parsed<S, 'query'>;
  body: Parsed<S, 'body'>;
}

export function fieldErrors(error: z.ZodError, prefix = ''): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export function validate<S extends Schemas>(
  schemas: S,
  handler: (input: Input<S>, req: Request, res: Response) => unknown,
): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const input: Record<string, unknown> = {};
    const fields: Record<string, string[]> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const source = part === 'body' ? (req.body ?? {}) : req[part];
      const result = schema.safeParse(source);
      if (result.success) input[part] = result.data;
      else Object.assign(fields, fieldErrors(result.error, part === 'body' ? '' : part));
    }
    if (Object.keys(fields).length > 0) {
      next(new ValidationError('Some fields need attention.', fields));
      return;
    }
    const out = await handler(input as unknown as Input<S>, req, res);
    if (out !== undefined && !res.headersSent) res.json(out);
  };
}
