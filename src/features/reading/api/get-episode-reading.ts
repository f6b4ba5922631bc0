import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { EpisodeReading } from '../../../shared/schemas/reading';
import { readingKeys } from './keys';

export function episodeReadingOptions(api: ApiClient, episodeId: number) {
  return queryOptions({
    queryKey: readingKeys.episode(episodeId),
    queryFn: ({ signal }) => api.get(`/api/episodes/${episodeId}/reading`, typed<EpisodeReading>(), signal),
  });
}

export function useEpisodeReading(episodeId: number) {
  return useQuery(episodeReadingOptions(useApi(), episodeId));
}
