import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { SessionResponse } from '../../../shared/schemas/accounts';
import { sessionKeys } from './keys';

/** Who is signed in (with memberships and the admin flag), or `{ account: null }` for a visitor. */
export function sessionOptions(api: ApiClient) {
  return queryOptions({
    queryKey: sessionKeys.current(),
    queryFn: ({ signal }) => api.get('/api/session', typed<SessionResponse>(), signal),
  });
}

export function useSession() {
  return useQuery(sessionOptions(useApi()));
}
