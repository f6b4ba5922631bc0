import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { creatorPage } from '../../../shared/schemas/reading';
import { readingKeys } from './keys';

export function creatorOptions(api: ApiClient, handle: string) {
  return queryOptions({
    queryKey: readingKeys.creator(handle),
    queryFn: ({ signal }) => api.get(`/api/creators/${encodeURIComponent(handle)}`, creatorPage, signal),
  });
}

export function useCreator(handle: string) {
  return useQuery(creatorOptions(useApi(), handle));
}
