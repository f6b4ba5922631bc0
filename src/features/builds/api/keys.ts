/** Query-key factory for builds and their episode lists: every variable a fetcher uses is in its key. */
export const buildKeys = {
  all: ['builds'] as const,
  details: () => [...buildKeys.all, 'detail'] as const,
  detail: (buildId: number) => [...buildKeys.details(), buildId] as const,
  episodes: (buildId: number) => [...buildKeys.detail(buildId), 'episodes'] as const,
};
