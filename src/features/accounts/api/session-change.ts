import type { QueryClient } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import type { Account } from '../../../shared/schemas/accounts';
import { sessionOptions } from './get-session';
import { sessionKeys } from './keys';

const notSession = (query: { queryKey: readonly unknown[] }) => query.queryKey[0] !== sessionKeys.all[0];

/**
 * After sign-in, sign-out or account deletion the person behind every cached answer has changed:
 * the CSRF token is tied to the old session, and data fetched for the old person must not be shown.
 * Unused entries go; entries on screen refetch in the background (so nothing flashes empty).
 */
export function applySessionChange(queryClient: QueryClient, api: ApiClient, account: Account | null): void {
  api.forgetCsrfToken();
  // Answers only a signed-in person can have go before anything refetches: on screen they would
  // otherwise ask once more with the old (now signed-out) session and get 401.
  if (!account) queryClient.removeQueries({ predicate: (q) => q.meta?.signedInOnly === true });
  queryClient.setQueryData(sessionOptions(api).queryKey, { account });
  queryClient.removeQueries({ type: 'inactive', predicate: notSession });
  void queryClient.invalidateQueries({ predicate: notSession });
}
