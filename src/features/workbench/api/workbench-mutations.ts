import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useApi } from '../../../lib/api-context';
import { build } from '../../../shared/schemas/builds';
import { episode } from '../../../shared/schemas/episodes';

// Restoring a build or taking one over changes the session's memberships, the build's own pages and
// the Workbench, which live in different features' caches: everything is marked stale, and what is
// on screen refetches before the button lets go.

export type RestoreTarget = { kind: 'build' | 'episode'; id: number };

/** Undoes a soft delete of a build or an episode (owner only, until its purge date). */
export function useRestore() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ kind, id }: RestoreTarget): Promise<void> => {
      if (kind === 'build') await api.post(`/api/builds/${id}/restore`, {}, build);
      else await api.post(`/api/episodes/${id}/restore`, {}, episode);
    },
    onSuccess: () => queryClient.invalidateQueries(),
  });
}

/** Accepts a build its owner offered to me: I become the owner, they an editor. */
export function useAcceptTransfer() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (buildId: number) => api.post(`/api/builds/${buildId}/transfer/accept`, {}, build),
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
