import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent, typed } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { PostCreate, PostStateChange } from '../../../shared/schemas/posts';
import { postKeys } from './keys';

// Every change to a post can show in the episode's list, the inbox and the moderation queue (and
// the header's counts): all post queries are marked stale, plus notifications.

const created = typed<{ id: number }>();

function useInvalidate() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: postKeys.all }),
      queryClient.invalidateQueries({ queryKey: ['notifications'] }),
      queryClient.invalidateQueries({ queryKey: ['workbench'] }),
    ]);
}

export function useCreatePost(episodeId: number) {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({ mutationFn: (input: PostCreate) => api.post(`/api/episodes/${episodeId}/posts`, input, created), onSuccess });
}

export function useReply() {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({
    mutationFn: ({ postId, body }: { postId: number; body: string }) => api.post(`/api/posts/${postId}/replies`, { body }, created),
    onSuccess,
  });
}

export function useEditPost() {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({
    mutationFn: ({ postId, body }: { postId: number; body: string }) => api.patch(`/api/posts/${postId}`, { body }, noContent),
    onSuccess,
  });
}

export function useDeletePost() {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({ mutationFn: (postId: number) => api.del(`/api/posts/${postId}`, noContent), onSuccess });
}

export function useSetPostState() {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({
    mutationFn: ({ postId, change }: { postId: number; change: PostStateChange }) =>
      api.put(`/api/posts/${postId}/state`, change, noContent),
    onSuccess,
  });
}

export function useReportPost() {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({
    mutationFn: ({ postId, reason }: { postId: number; reason: string }) => api.post(`/api/posts/${postId}/reports`, { reason }, noContent),
    onSuccess,
  });
}

export function useModeratePost() {
  const api = useApi();
  const onSuccess = useInvalidate();
  return useMutation({
    mutationFn: ({ postId, hidden, reason }: { postId: number; hidden: boolean; reason: string }) =>
      api.put(`/api/posts/${postId}/visibility`, { hidden, reason }, noContent),
    onSuccess,
  });
}
