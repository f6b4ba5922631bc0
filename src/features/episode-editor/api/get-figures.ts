import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { figureList } from '../../../shared/schemas/figures';
import { editorKeys } from './keys';

/** The episode's figures as its build team edits them (drafts included), with their checks. */
export function figuresOptions(api: ApiClient, episodeId: number) {
  return queryOptions({
    queryKey: editorKeys.figures(episodeId),
    queryFn: ({ signal }) => api.get(`/api/episodes/${episodeId}/figures`, figureList, signal),
  });
}

export function useFigures(episodeId: number) {
  return useQuery(figuresOptions(useApi(), episodeId));
}
