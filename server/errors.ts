import type { ApiErrorCode } from '../shared/schemas/api-error';

export type FieldErrors = Record<string, string[]>;

/** An error with an HTTP status and a message that is safe to show to a person. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = 'AppError';
  }

  static validation(fieldErrors: FieldErrors, message = 'Some fields are invalid.') {
    return new AppError(400, 'validation_failed', message, fieldErrors);
  }
  static unauthorized(message = 'Please sign in.') {
    return new AppError(401, 'unauthorized', message);
  }
  static forbidden(message = 'You do not have access to this.') {
    return new AppError(403, 'forbidden', message);
  }
  static notFound(what = 'resource') {
    return new AppError(404, 'not_found', `That ${what} was not found.`);
  }
  static conflict(message: string, fieldErrors?: FieldErrors) {
    return new AppError(409, 'conflict', message, fieldErrors);
  }
  static unprocessable(message: string, fieldErrors?: FieldErrors) {
    return new AppError(422, 'unprocessable', message, fieldErrors);
  }
}
