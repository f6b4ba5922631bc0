import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { workbench } from '../../../shared/schemas/episodes';
import { workbenchKeys } from './keys';

/** The signed-in creator's builds, drafts, scheduled episodes, recently deleted and offered builds. */
export function workbenchOptions(api: ApiClient) {
  return queryOptions({
    queryKey: workbenchKeys.current(),
    queryFn: ({ signal }) => api.get('/api/workbench', workbench, signal),
  });
}

export function useWorkbench() {
  return useQuery(workbenchOptions(useApi()));
}
