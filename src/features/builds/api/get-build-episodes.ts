import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { episodeSummaryList } from '../../../shared/schemas/episodes';
import { buildKeys } from './keys';

/** Every episode of a build the build team may see: drafts, scheduled and published. */
export function buildEpisodesOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: buildKeys.episodes(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/episodes`, episodeSummaryList, signal),
  });
}

export function useBuildEpisodes(buildId: number) {
  return useQuery(buildEpisodesOptions(useApi(), buildId));
}
