import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { sponsorList } from '../../../shared/schemas/sponsors';
import { partKeys } from './keys';

/** Every sponsor organisation, for the support cells of a part line. */
export function sponsorOptions(api: ApiClient) {
  return queryOptions({
    queryKey: partKeys.sponsors(),
    queryFn: ({ signal }) => api.get('/api/sponsors', sponsorList, signal),
    staleTime: 5 * 60_000,
  });
}

export function useSponsorOptions() {
  return useQuery(sponsorOptions(useApi()));
}
