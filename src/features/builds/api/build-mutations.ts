import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { build, type BuildCreate, type BuildUpdate } from '../../../shared/schemas/builds';
import { buildKeys } from './keys';

// A build's title, existence and owner also live in the session's memberships, the Workbench and
// the build-team pages, which belong to other features: after a change every cached query is
// marked stale, and the ones on screen refetch.

/** Starts a build; the person becomes its owner. */
export function useCreateBuild() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: BuildCreate) => api.post('/api/builds', body, build),
    onSuccess: async (saved) => {
      queryClient.setQueryData(buildKeys.detail(saved.id), saved);
      await queryClient.invalidateQueries({ predicate: (q) => !sameKey(q.queryKey, buildKeys.detail(saved.id)) });
    },
  });
}

/** Saves the changed settings (owner only). */
export function useUpdateBuild(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: BuildUpdate) => api.patch(`/api/builds/${buildId}`, body, build),
    onSuccess: async (saved) => {
      queryClient.setQueryData(buildKeys.detail(buildId), saved);
      await queryClient.invalidateQueries({ predicate: (q) => !sameKey(q.queryKey, buildKeys.detail(buildId)) });
    },
  });
}

/**
 * Soft-deletes the build (owner only; undo from the Workbench for 30 days). Nothing refetches now:
 * the build's own queries would only answer 404 while the page moves on to the Workbench.
 */
export function useDeleteBuild(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.del(`/api/builds/${buildId}`, noContent),
    onSuccess: () => queryClient.invalidateQueries({ refetchType: 'none' }),
  });
}

/** Offers the build to one of its editors; it stays the owner's until they accept. */
export function useOfferTransfer(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (toUserId: number) => api.post(`/api/builds/${buildId}/transfer`, { toUserId }, build),
    onSuccess: (saved) => queryClient.setQueryData(buildKeys.detail(buildId), saved),
  });
}

/** Withdraws a pending transfer offer. */
export function useCancelTransfer(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.del(`/api/builds/${buildId}/transfer`, noContent),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: buildKeys.detail(buildId), exact: true }),
  });
}

function sameKey(a: readonly unknown[], b: readonly unknown[]): boolean {
  return a.length === b.length && a.every((part, i) => part === b[i]);
}
