import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { episode } from '../../../shared/schemas/episodes';
import { editorKeys } from './keys';

export function episodePath(episodeId: number): string {
  return `/api/episodes/${episodeId}`;
}

/** One episode as its build team sees it: draft, write-up JSON, chapters and version. */
export function editorEpisodeOptions(api: ApiClient, episodeId: number) {
  return queryOptions({
    queryKey: editorKeys.episode(episodeId),
    queryFn: ({ signal }) => api.get(episodePath(episodeId), episode, signal),
  });
}

export function useEditorEpisode(episodeId: number) {
  return useQuery(editorEpisodeOptions(useApi(), episodeId));
}
