// Puts the server's field errors (`{ fields: { "stress.elbow": [...] } }`) on the matching form fields.
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';
import { staleSaveCurrent } from './api-refusals';

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

/**
 * After a save refused as stale (409 with the stored row): loads their edit into the form, so nothing of
 * it is lost, and returns it with a message naming the fields whose changes of this user were not saved.
 * Anything else: null.
 */
export function loadTheirEdit<Row extends object, V extends object>(
  err: unknown,
  form: { getValues: () => object; reset: (values: V) => void },
  valuesOf: (row: Row) => V,
): { row: Row; message: string } | null {
  const row = staleSaveCurrent<Row>(err);
  if (!row || !isApiError(err)) return null;
  const theirs = valuesOf(row);
  const mine = form.getValues() as Record<string, unknown>;
  const stored = theirs as Record<string, unknown>;
  const changed = Object.keys(mine).filter((k) => JSON.stringify(mine[k]) !== JSON.stringify(stored[k]));
  form.reset(theirs);
  return {
    row,
    message: `${err.message}${changed.length ? ` Your changes to ${changed.join(', ')} were not saved.` : ''}`,
  };
}
