// Puts the server's field errors (`{ fields: { "stress.elbow": [...] } }`) on the matching form fields.
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/** True when at least one field error was placed; the caller shows anything else as a notice. */
export function applyFieldErrors<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  rename: (field: string) => string = (f) => f,
): boolean {
  if (!isApiError(err)) return false;
  const entries = Object.entries(err.fields);
  for (const [field, messages] of entries) {
    setError(rename(field) as Path<T>, { type: 'server', message: messages[0] });
  }
  return entries.length > 0;
}
