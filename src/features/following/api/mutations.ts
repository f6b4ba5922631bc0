import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent, typed } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { NoticePreferences } from '../../../shared/schemas/following';
import { followingKeys } from './keys';

export type FollowTarget = { kind: 'build'; buildId: number } | { kind: 'creator'; handle: string };

/** Follows or stops following a build or a creator. */
export function useFollow() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ target, follow }: { target: FollowTarget; follow: boolean }) => {
      const path =
        target.kind === 'build' ? `/api/builds/${target.buildId}/follow` : `/api/creators/${encodeURIComponent(target.handle)}/follow`;
      return follow ? api.put(path, {}, noContent) : api.del(path, noContent);
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: followingKeys.following() }),
  });
}

export function useMarkRead() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (ids: number[] | 'all') => api.post('/api/notifications/read', ids === 'all' ? { all: true } : { ids }, noContent),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: followingKeys.notifications() }),
  });
}

export function useSaveNoticePreferences() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (prefs: NoticePreferences) => api.put('/api/account/notices', prefs, typed<NoticePreferences>()),
    onSuccess: (saved) => queryClient.setQueryData(followingKeys.preferences(), saved),
  });
}
