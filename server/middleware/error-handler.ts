import type { NextFunction, Request, Response } from 'express';
import { MulterError } from 'multer';
import { ConnectionAcquireTimeoutError, ConnectionError } from 'sequelize';
import { ZodError } from 'zod';
import type { ApiErrorBody } from '../../shared/schemas/api-error';
import { AppError } from '../errors';
import { StorageFullError } from '../lib/storage';
import { logger } from '../logger';
import { toFieldErrors } from './validate';

/** Seconds a client should wait before retrying when the database pool is exhausted. */
export const BUSY_RETRY_AFTER_SECONDS = 5;
/** Seconds a client should wait before retrying while the database cannot be reached. */
export const UNAVAILABLE_RETRY_AFTER_SECONDS = 10;

// PostgreSQL codes for "the server is going away or not there": class 08 (connection exception),
// 57P01-57P03 (shut down by an administrator, crash, starting up) and 53300 (too many connections).
const UNAVAILABLE_CODES = /^(08|57P0[123]$|53300$)/;
const UNAVAILABLE_MESSAGES = /Connection terminated|ECONNREFUSED|ECONNRESET|EPIPE|ETIMEDOUT|the database system is (starting up|shutting down)/i;

// What the multipart parser (busboy, under multer) throws for a body without a boundary or cut short.
const MULTIPART_BROKEN = /^(Multipart: |Unexpected end of (form|file)|Malformed part header|Malformed urlencoded form)/;

/** True when an error means the database could not be reached or dropped the connection (not a bad query). */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as { code?: unknown; message?: unknown; original?: unknown; parent?: unknown } | undefined, depth = 0; e && depth < 4; depth += 1) {
    if (e instanceof ConnectionError) return true;
    if (typeof e.code === 'string' && UNAVAILABLE_CODES.test(e.code)) return true;
    if (typeof e.message === 'string' && UNAVAILABLE_MESSAGES.test(e.message)) return true;
    e = (e.original ?? e.parent) as typeof e;
  }
  return false;
}

function send(res: Response, status: number, body: ApiErrorBody) {
  res.status(status).json(body);
}

/** The catch-all 404 for API paths nothing answered. */
export function notFoundHandler(req: Request, _res: Response, next: NextFunction) {
  next(new AppError(404, 'not_found', `No API route for ${req.method} ${req.path}.`));
}

/** The last middleware: one error format for everything, never a stack trace. */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  if (err instanceof AppError) {
    return send(res, err.status, { error: { code: err.code, message: err.message, fieldErrors: err.fieldErrors } });
  }
  if (err instanceof ZodError) {
    return send(res, 400, { error: { code: 'validation_failed', message: 'Some fields are invalid.', fieldErrors: toFieldErrors(err) } });
  }
  if (err instanceof ConnectionAcquireTimeoutError) {
    // Every pooled database connection stayed busy for the whole acquire timeout: ask the client to retry.
    logger.warn({ method: req.method, path: req.path }, 'database pool exhausted');
    res.set('Retry-After', String(BUSY_RETRY_AFTER_SECONDS));
    return send(res, 503, { error: { code: 'busy', message: 'The server is busy. Please try again in a few seconds.' } });
  }
  if (isDatabaseUnavailable(err)) {
    // The database is down or restarting: nothing was acknowledged, so a retry is safe once it is back.
    logger.warn({ err, method: req.method, path: req.path }, 'database unavailable');
    res.set('Retry-After', String(UNAVAILABLE_RETRY_AFTER_SECONDS));
    return send(res, 503, { error: { code: 'unavailable', message: 'The database cannot be reached just now. Please try again in a few seconds.' } });
  }
  if (err instanceof StorageFullError) {
    logger.error({ err, method: req.method, path: req.path }, 'file storage full');
    return send(res, 507, { error: { code: 'storage_full', message: 'There is no room to store the file just now. Nothing was saved; please try again later.' } });
  }
  if (err instanceof URIError) {
    // A path segment that is not valid percent-encoding ("%", "%ED%A0%80"): Express fails to decode the param.
    return send(res, 400, { error: { code: 'validation_failed', message: 'That address is not valid.' } });
  }
  if (err instanceof Error && MULTIPART_BROKEN.test(err.message)) {
    return send(res, 400, { error: { code: 'validation_failed', message: 'The upload was not a complete multipart form. Please send it again.' } });
  }
  if (err instanceof MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return send(res, 413, { error: { code: 'payload_too_large', message: 'That file is too large.' } });
    }
    return send(res, 400, { error: { code: 'validation_failed', message: err.message, fieldErrors: err.field ? { [err.field]: [err.message] } : undefined } });
  }
  const httpErr = err as { type?: string; status?: number };
  if (httpErr?.type === 'entity.too.large') {
    return send(res, 413, { error: { code: 'payload_too_large', message: 'The request body is too large.' } });
  }
  if (httpErr?.type === 'entity.parse.failed') {
    return send(res, 400, { error: { code: 'validation_failed', message: 'The request body is not valid JSON.' } });
  }
  logger.error({ err, method: req.method, path: req.path }, 'unhandled error');
  return send(res, 500, { error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
}
