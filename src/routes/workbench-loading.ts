import { ApiError } from '../lib/api-client';
import { idParam } from '../shared/schemas/accounts';
import { rethrowAsRouteError } from './route-guards';

/**
 * Awaits a loader's cache priming. "Not signed in", "not yours" and "not there" become those error
 * pages; any other failure is left for the screen, which shows its error state with a retry.
 */
export async function primeOrRouteError<T>(pending: Promise<T>): Promise<T | null> {
  try {
    return await pending;
  } catch (err) {
    if (err instanceof ApiError && (err.status === 401 || err.status === 403 || err.status === 404)) rethrowAsRouteError(err);
    return null;
  }
}

/** A positive integer id from a path segment, or null. */
export function parseId(value: string | undefined): number | null {
  const parsed = idParam.safeParse(value);
  return parsed.success ? parsed.data : null;
}
