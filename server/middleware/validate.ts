import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';
import { UNCLEAN_TEXT_MESSAGE, uncleanTextPaths } from '../../shared/schemas/fields';
import { AppError, type FieldErrors } from '../errors';

export type RequestSchemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };

/** What `validate` leaves in `res.locals.input`: each part parsed by its schema (undefined without one). */
export type ValidatedInput<S extends RequestSchemas> = {
  [K in keyof Required<RequestSchemas>]: S[K] extends z.ZodType ? z.output<S[K]> : undefined;
};

/** Turns zod issues into { "field.path": [messages] }. */
export function toFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/**
 * Validates params, query and body with zod (every field error at once) and puts the parsed values in
 * `res.locals.input`; handlers read them typed through the route registry (`defineRoute`), never by casting req.
 */
export function validate(schemas: RequestSchemas) {
  return (req: Request, res: Response, next: NextFunction) => {
    const fieldErrors: FieldErrors = {};
    const input: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      // Every string a request carries must be valid Unicode without control characters (NUL, lone surrogates).
      for (const path of uncleanTextPaths(req[part])) (fieldErrors[path] ??= []).push(UNCLEAN_TEXT_MESSAGE);
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) input[part] = result.data;
      else Object.assign(fieldErrors, toFieldErrors(result.error));
    }
    if (Object.keys(fieldErrors).length) return next(AppError.validation(fieldErrors));
    res.locals.input = input;
    next();
  };
}
