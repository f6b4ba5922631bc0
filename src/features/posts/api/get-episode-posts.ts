import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { EpisodePosts } from '../../../shared/schemas/posts';
import { postKeys } from './keys';

/** An episode's posts with replies; prime it in the episode page's loader. */
export function episodePostsOptions(api: ApiClient, episodeId: number) {
  return queryOptions({
    queryKey: postKeys.episode(episodeId),
    queryFn: ({ signal }) => api.get(`/api/episodes/${episodeId}/posts`, typed<EpisodePosts>(), signal),
  });
}

export function useEpisodePosts(episodeId: number) {
  return useQuery(episodePostsOptions(useApi(), episodeId));
}
