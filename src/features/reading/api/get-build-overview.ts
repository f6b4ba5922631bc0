import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { buildOverview } from '../../../shared/schemas/reading';
import { readingKeys } from './keys';

export function buildOverviewOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: readingKeys.build(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/overview`, buildOverview, signal),
  });
}

export function useBuildOverview(buildId: number) {
  return useQuery(buildOverviewOptions(useApi(), buildId));
}
