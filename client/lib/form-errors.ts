import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-error';

/** Puts the server's field messages (ApiError.fields) on the form fields they name. Returns true
 * when at least one field got a message, so the caller can skip a general notice. */
export function applyServerFieldErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fields: readonly Path<T>[]): boolean {
  if (!isApiError(error) || !error.fields) return false;
  let applied = false;
  for (const field of fields) {
    const message = error.fields[field];
    if (message) {
      setError(field, { type: 'server', message });
      applied = true;
    }
  }
  return applied;
}
