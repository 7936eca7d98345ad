import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../api/client';

/**
 * Maps an API error's fieldErrors onto the form's fields; returns the message to show at form level (for errors
 * that belong to no field), or undefined when every part was placed. `fields` lists the form's fields whose names
 * match the request's; or give a function from the request's path (e.g. "ingredients.2.grams") to a form field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly FieldPath<T>[] | ((path: string) => string | undefined),
): string | undefined {
  if (!(error instanceof ApiError)) return 'Something went wrong. Please try again.';
  const fieldOf = typeof fields === 'function' ? fields : (path: string) => ((fields as readonly string[]).includes(path) ? path : undefined);
  let placedAll = !!error.fieldErrors;
  for (const [path, messages] of Object.entries(error.fieldErrors ?? {})) {
    const field = fieldOf(path);
    if (field) setError(field as FieldPath<T>, { message: messages[0] });
    else placedAll = false;
  }
  return placedAll ? undefined : error.message;
}
