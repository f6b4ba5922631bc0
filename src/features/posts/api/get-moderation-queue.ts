import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { moderationQueue } from '../../../shared/schemas/posts';
import { postKeys } from './keys';

export function moderationQueueOptions(api: ApiClient) {
  return queryOptions({
    queryKey: postKeys.moderation(),
    queryFn: ({ signal }) => api.get('/api/moderation/queue', moderationQueue, signal),
  });
}

export function useModerationQueue() {
  return useQuery(moderationQueueOptions(useApi()));
}
