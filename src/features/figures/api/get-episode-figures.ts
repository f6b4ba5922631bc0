import { queryOptions, useQuery } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import type { FigureList } from '../../../shared/schemas/figures';
import { figureKeys } from './keys';

/** An episode's figures with their checks and cautions; prime it in the episode page's loader. */
export function episodeFiguresOptions(api: ApiClient, episodeId: number) {
  return queryOptions({
    queryKey: figureKeys.episode(episodeId),
    queryFn: ({ signal }) => api.get(`/api/episodes/${episodeId}/figures`, typed<FigureList>(), signal),
  });
}

export function useEpisodeFigures(episodeId: number) {
  return useQuery(episodeFiguresOptions(useApi(), episodeId));
}
