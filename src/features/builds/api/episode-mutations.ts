import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { episode, type EpisodeCreate } from '../../../shared/schemas/episodes';

// The Workbench's drafts and the build's counts change with every episode, and they belong to other
// features' caches: each mutation marks everything stale.

/**
 * Starts an episode of the build as a draft (next free number unless one is given). The page moves
 * on to the editor, so nothing refetches here; the build page refetches when it is shown again.
 */
export function useCreateEpisode(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: EpisodeCreate) => api.post(`/api/builds/${buildId}/episodes`, body, episode),
    onSuccess: () => queryClient.invalidateQueries({ refetchType: 'none' }),
  });
}

/** Soft-deletes an episode (owner only); it can be restored from the Workbench for 30 days. */
export function useDeleteEpisode() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (episodeId: number) => api.del(`/api/episodes/${episodeId}`, noContent),
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
