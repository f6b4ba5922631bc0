import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { buildMemberList } from '../../../shared/schemas/accounts';
import { accountKeys } from './keys';

/** The build team (owner and editors); readable by its members only. */
export function buildMembersOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: accountKeys.members(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/members`, buildMemberList, signal),
  });
}

export function useBuildMembers(buildId: number) {
  return useQuery(buildMembersOptions(useApi(), buildId));
}
