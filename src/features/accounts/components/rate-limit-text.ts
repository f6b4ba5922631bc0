import { ApiError } from '../../../lib/api-client';

/** "Try again in 40 seconds / 3 minutes" for a 429, or null for any other error. */
export function rateLimitText(error: Error): string | null {
  if (!(error instanceof ApiError) || error.status !== 429) return null;
  const seconds = error.retryAfter;
  if (seconds === undefined) return 'Too many tries for now. Try again in a little while.';
  const wait = seconds < 90 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`;
  return `Too many tries for now. Try again in ${wait}.`;
}
