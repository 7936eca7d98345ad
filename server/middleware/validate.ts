import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';
import { AppError, type FieldErrors } from '../errors';

type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };

/** Turns zod issues into { "field.path": [messages] }. */
export function toFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/** Validates body, query and params with zod and replaces them with the parsed values. */
export function validate(schemas: Schemas) {
  return (req: Request, _res: Response, next: NextFunction) => {
    const fieldErrors: FieldErrors = {};
    const parsed: Partial<Record<keyof Schemas, unknown>> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) parsed[part] = result.data;
      else Object.assign(fieldErrors, toFieldErrors(result.error));
    }
    if (Object.keys(fieldErrors).length) return next(AppError.validation(fieldErrors));
    if ('body' in parsed) req.body = parsed.body;
    // Express 5 exposes req.query through a getter; shadow it with the parsed value.
    if ('query' in parsed) Object.defineProperty(req, 'query', { value: parsed.query, writable: true, configurable: true });
    if ('params' in parsed) req.params = parsed.params as Request['params'];
    next();
  };
}
