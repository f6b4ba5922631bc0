import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { openItemList } from '../../../shared/schemas/episodes';
import { editorKeys } from './keys';

/** The build's items still open when this episode starts, plus those opened in it. */
export function openItemsOptions(api: ApiClient, buildId: number, episodeId: number) {
  return queryOptions({
    queryKey: editorKeys.openItems(buildId, episodeId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/open-items?episodeId=${episodeId}`, openItemList, signal),
  });
}

export function useOpenItems(buildId: number, episodeId: number) {
  return useQuery(openItemsOptions(useApi(), buildId, episodeId));
}
