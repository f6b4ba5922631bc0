import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { adminAccountList, adminAccountsQuery } from '../../../shared/schemas/accounts';
import { adminKeys, type AdminAccountsQuery } from './keys';

export type { AdminAccountsQuery };

export const ADMIN_ACCOUNTS_PAGE_SIZE = 25;

/** The query for these search params; bad values quietly fall back (page 1, no search). */
export function adminAccountsQueryFrom(searchParams: URLSearchParams): AdminAccountsQuery {
  const parsed = adminAccountsQuery.safeParse({
    q: searchParams.get('q') ?? undefined,
    page: searchParams.get('page') ?? undefined,
    perPage: ADMIN_ACCOUNTS_PAGE_SIZE,
  });
  const query = parsed.success ? parsed.data : { page: 1, perPage: ADMIN_ACCOUNTS_PAGE_SIZE };
  // An empty search is no search: one cache entry, one URL.
  return query.q ? query : { page: query.page, perPage: query.perPage };
}

/** Accounts for the admin list, searched by handle, name or address. */
export function adminAccountsOptions(api: ApiClient, q: AdminAccountsQuery) {
  return queryOptions({
    queryKey: adminKeys.accountList(q),
    queryFn: ({ signal }) => {
      const params = new URLSearchParams({ page: String(q.page), perPage: String(q.perPage) });
      if (q.q) params.set('q', q.q);
      return api.get(`/api/admin/accounts?${params.toString()}`, adminAccountList, signal);
    },
  });
}

export function useAdminAccounts(q: AdminAccountsQuery) {
  return useQuery(adminAccountsOptions(useApi(), q));
}
