import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { FollowingResponse, NoticePreferences, NotificationsResponse } from '../../../shared/schemas/following';
import { SIGNED_IN_ONLY } from '../../../lib/query-client';
import { followingKeys } from './keys';

export function followingOptions(api: ApiClient) {
  return queryOptions({
    queryKey: followingKeys.following(),
    queryFn: ({ signal }) => api.get('/api/following', typed<FollowingResponse>(), signal),
    meta: SIGNED_IN_ONLY,
  });
}
export function useFollowing(enabled = true) {
  return useQuery({ ...followingOptions(useApi()), enabled });
}

export function notificationsOptions(api: ApiClient) {
  return queryOptions({
    queryKey: followingKeys.notifications(),
    queryFn: ({ signal }) => api.get('/api/notifications', typed<NotificationsResponse>(), signal),
    meta: SIGNED_IN_ONLY,
  });
}
/** Notifications, refreshed each minute while a page is open (the header's count). */
export function useNotifications(enabled = true) {
  return useQuery({ ...notificationsOptions(useApi()), enabled, refetchInterval: 60_000 });
}

export function noticePreferencesOptions(api: ApiClient) {
  return queryOptions({
    queryKey: followingKeys.preferences(),
    queryFn: ({ signal }) => api.get('/api/account/notices', typed<NoticePreferences>(), signal),
  });
}
export function useNoticePreferences() {
  return useQuery(noticePreferencesOptions(useApi()));
}
