import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { BuildTotals } from '../../../shared/schemas/parts';
import { partKeys } from './keys';

/** A build's spend totals; `all` includes unpublished episodes' lines (the build team only). */
export function buildTotalsOptions(api: ApiClient, buildId: number, scope: 'published' | 'all' = 'published') {
  return queryOptions({
    queryKey: partKeys.buildTotals(buildId, scope),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/totals?scope=${scope}`, typed<BuildTotals>(), signal),
  });
}

export function useBuildTotals(buildId: number, scope: 'published' | 'all' = 'published') {
  return useQuery(buildTotalsOptions(useApi(), buildId, scope));
}
