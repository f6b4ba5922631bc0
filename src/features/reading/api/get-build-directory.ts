import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { buildDirectoryResponse, type BuildDirectoryQuery } from '../../../shared/schemas/reading';
import { readingKeys } from './keys';

export function buildDirectoryOptions(api: ApiClient, q: BuildDirectoryQuery) {
  const p = new URLSearchParams({ page: String(q.page), perPage: String(q.perPage) });
  if (q.kind) p.set('kind', q.kind);
  if (q.make) p.set('make', q.make);
  if (q.decade !== undefined) p.set('decade', String(q.decade));
  return queryOptions({
    queryKey: readingKeys.directory(q),
    queryFn: ({ signal }) => api.get(`/api/builds?${p.toString()}`, buildDirectoryResponse, signal),
  });
}

export function useBuildDirectory(q: BuildDirectoryQuery) {
  return useQuery(buildDirectoryOptions(useApi(), q));
}
