import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts the server's per-field messages (`error.fields`) onto the form's fields; anything the form
 * has no field for goes to `root.server`. Returns true when the error was shown in the form, so the
 * caller can skip a toast that would only repeat it (false: not an API error, e.g. a crash).
 * `byCode` names the field an error without `fields` is about (e.g. `email_taken` → `email`).
 */
export function applyServerErrors<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  known: ReadonlyArray<Path<T>>,
  byCode: Partial<Record<string, Path<T>>> = {},
): boolean {
  if (!isApiError(err)) return false;
  let placed = false;
  const codeField = byCode[err.code];
  if (codeField && Object.keys(err.fields).length === 0) {
    setError(codeField, { type: 'server', message: err.message });
    return true;
  }
  for (const [field, message] of Object.entries(err.fields)) {
    if ((known as readonly string[]).includes(field)) {
      setError(field as Path<T>, { type: 'server', message });
      placed = true;
    }
  }
  if (!placed) setError('root.server' as Path<T>, { type: 'server', message: err.message });
  return true;
}
