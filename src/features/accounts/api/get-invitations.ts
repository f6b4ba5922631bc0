import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { invitationList } from '../../../shared/schemas/accounts';
import { accountKeys } from './keys';

/** Invitations to edit this build, in every status; the owner's to see. */
export function invitationsOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: accountKeys.invitations(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/invitations`, invitationList, signal),
  });
}

export function useInvitations(buildId: number, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...invitationsOptions(useApi(), buildId), enabled });
}
