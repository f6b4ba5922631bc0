import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

/** One QueryClient per browser session, and a fresh one per server render. */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        // Server-rendered data is fresh on arrival; do not refetch it during hydration.
        staleTime: 30_000,
        retry: (failures, error) => !(error instanceof ApiError && error.status < 500) && failures < 2,
      },
    },
  });
}

/**
 * `meta` for queries only a signed-in person can make (their notifications, what they follow). On
 * sign-out the session change removes them before anything refetches (features/accounts
 * session-change), so a header still on screen never asks again with a session that has ended.
 */
export const SIGNED_IN_ONLY = { signedInOnly: true } as const;
