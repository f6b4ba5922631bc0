import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../../../lib/api-client';

/**
 * Puts the server's 400 field messages on the form's fields (the server validates with the same
 * schema, but it also knows things the client cannot, such as a taken address). Returns whether any
 * field took a message; other errors stay with the mutation for the form's own notice.
 */
export function applyFieldErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>, names: readonly Path<T>[]): boolean {
  if (!(err instanceof ApiError) || !err.fields) return false;
  let applied = false;
  for (const name of names) {
    const message = err.fields[name]?.[0];
    if (message) {
      setError(name, { type: 'server', message });
      applied = true;
    }
  }
  return applied;
}
