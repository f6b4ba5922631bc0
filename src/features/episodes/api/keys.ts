import type { LatestEpisodesQuery } from '../../../shared/schemas/episodes';

/** Query-key factory for episodes: every variable a fetcher uses is in its key. */
export const episodeKeys = {
  all: ['episodes'] as const,
  lists: () => [...episodeKeys.all, 'list'] as const,
  latest: (q: LatestEpisodesQuery) => [...episodeKeys.lists(), 'latest', q] as const,
  detail: (id: number) => [...episodeKeys.all, 'detail', id] as const,
};
