import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { EpisodeParts } from '../../../shared/schemas/parts';
import { partKeys } from './keys';

/** An episode's parts list with its totals. */
export function episodePartsOptions(api: ApiClient, episodeId: number) {
  return queryOptions({
    queryKey: partKeys.episode(episodeId),
    queryFn: ({ signal }) => api.get(`/api/episodes/${episodeId}/part-lines`, typed<EpisodeParts>(), signal),
  });
}

export function useEpisodeParts(episodeId: number) {
  return useQuery(episodePartsOptions(useApi(), episodeId));
}
