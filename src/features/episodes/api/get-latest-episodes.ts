import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { LatestEpisodesQuery, LatestEpisodesResponse } from '../../../shared/schemas/episodes';
import { episodeKeys } from './keys';

/** Latest published episodes of public builds, for the front page. */
export function latestEpisodesOptions(api: ApiClient, q: LatestEpisodesQuery) {
  return queryOptions({
    queryKey: episodeKeys.latest(q),
    queryFn: ({ signal }) => api.get(`/api/episodes?page=${q.page}&perPage=${q.perPage}`, typed<LatestEpisodesResponse>(), signal),
  });
}

export function useLatestEpisodes(q: LatestEpisodesQuery) {
  return useQuery(latestEpisodesOptions(useApi(), q));
}
