import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../api/client';

/**
 * Maps an API error's fieldErrors onto the form's fields; returns the message to show
 * at form level (for errors that belong to no field), or undefined when every part was placed.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly FieldPath<T>[],
): string | undefined {
  if (!(error instanceof ApiError)) return 'Something went wrong. Please try again.';
  let placedAll = !!error.fieldErrors;
  for (const [name, messages] of Object.entries(error.fieldErrors ?? {})) {
    if ((fields as readonly string[]).includes(name)) setError(name as FieldPath<T>, { message: messages[0] });
    else placedAll = false;
  }
  return placedAll ? undefined : error.message;
}
