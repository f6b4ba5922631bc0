import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { invitationLookup } from '../../../shared/schemas/accounts';
import { accountKeys } from './keys';

/**
 * What an invitation link is for and whether it still works. A POST (the token stays out of URLs
 * and logs) that changes nothing, so it is read as a query.
 */
export function invitationLookupOptions(api: ApiClient, token: string) {
  return queryOptions({
    queryKey: accountKeys.invitationLookup(token),
    queryFn: ({ signal }) => api.post('/api/invitations/lookup', { token }, invitationLookup, signal),
    staleTime: 0,
  });
}

/** Waits (disabled) until the page has read the token from the URL fragment. */
export function useInvitationLookup(token: string | null) {
  const api = useApi();
  return useQuery({ ...invitationLookupOptions(api, token ?? ''), enabled: token !== null });
}
