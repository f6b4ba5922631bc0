import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { build } from '../../../shared/schemas/builds';
import { buildKeys } from './keys';

/** One build with the reader's role on it; 404 when it is hidden from them. */
export function buildOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: buildKeys.detail(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}`, build, signal),
  });
}

export function useBuild(buildId: number) {
  return useQuery(buildOptions(useApi(), buildId));
}
