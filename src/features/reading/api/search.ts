import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { searchResponse } from '../../../shared/schemas/reading';
import { readingKeys } from './keys';

export function searchOptions(api: ApiClient, q: string, page: number) {
  return queryOptions({
    queryKey: readingKeys.search(q, page),
    queryFn: ({ signal }) => api.get(`/api/search?q=${encodeURIComponent(q)}&page=${page}`, searchResponse, signal),
    enabled: q.trim().length > 0,
  });
}

export function useSearch(q: string, page: number) {
  return useQuery({ ...searchOptions(useApi(), q, page), placeholderData: keepPreviousData });
}
