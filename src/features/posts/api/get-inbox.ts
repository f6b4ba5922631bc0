import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { inboxResponse, type InboxQuery } from '../../../shared/schemas/posts';
import { postKeys } from './keys';

/** The filters as a query string (blank ones left out). */
export function inboxSearch(q: InboxQuery): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) if (v !== undefined) p.set(k, String(v));
  return p.toString();
}

export function inboxOptions(api: ApiClient, q: InboxQuery) {
  return queryOptions({
    queryKey: postKeys.inbox(q),
    queryFn: ({ signal }) => api.get(`/api/inbox?${inboxSearch(q)}`, inboxResponse, signal),
  });
}

export function useInbox(q: InboxQuery) {
  return useQuery(inboxOptions(useApi(), q));
}
