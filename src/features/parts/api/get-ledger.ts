import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { ledgerQuery, ledgerResponse, type LedgerQuery } from '../../../shared/schemas/parts';
import { partKeys } from './keys';

/** The ledger's filter, sort and page from the URL; anything malformed falls back to the defaults. */
export function ledgerQueryFrom(params: URLSearchParams): LedgerQuery {
  const raw = Object.fromEntries(params.entries());
  const parsed = ledgerQuery.safeParse(raw);
  if (parsed.success) return parsed.data;
  // Drop only what is wrong, keep the rest of the filter.
  const kept: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw)) {
    if (ledgerQuery.safeParse({ [key]: value }).success) kept[key] = value;
  }
  return ledgerQuery.parse(kept);
}

/** The same query as URL search params, defaults left out (for links and the API). */
export function ledgerSearch(q: LedgerQuery): string {
  const params = new URLSearchParams();
  const defaults = ledgerQuery.parse({});
  for (const [key, value] of Object.entries(q)) {
    if (value === undefined || value === defaults[key as keyof LedgerQuery]) continue;
    params.set(key, String(value));
  }
  return params.toString();
}

/** One page of the build's ledger with the totals of the whole filter. */
export function ledgerOptions(api: ApiClient, buildId: number, q: LedgerQuery) {
  return queryOptions({
    queryKey: partKeys.ledger(buildId, q),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/ledger?${ledgerSearch(q)}`, ledgerResponse, signal),
  });
}

export function useLedger(buildId: number, q: LedgerQuery) {
  return useQuery({ ...ledgerOptions(useApi(), buildId, q), placeholderData: keepPreviousData });
}
