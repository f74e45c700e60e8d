import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts the server's per-field messages (`error.fields`) onto the form's fields; anything the form
 * has no field for goes to `root.server`. Returns true when the error was shown in the form, so the
 * caller can skip a toast that would only repeat it (false: not an API error, e.g. a crash).
 */
export function applyServerErrors<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  known: ReadonlyArray<Path<T>>,
): boolean {
  if (!isApiError(err)) return false;
  let placed = false;
  for (const [field, message] of Object.entries(err.fields)) {
    if ((known as readonly string[]).includes(field)) {
      setError(field as Path<T>, { type: 'server', message });
      placed = true;
    }
  }
  if (!placed) setError('root.server' as Path<T>, { type: 'server', message: err.message });
  return true;
}
