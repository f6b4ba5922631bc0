import type { BuildDirectoryQuery } from '../../../shared/schemas/reading';

/** Query-key factory for the public reading pages: every variable a fetcher uses is in its key. */
export const readingKeys = {
  all: ['reading'] as const,
  directory: (q: BuildDirectoryQuery) => [...readingKeys.all, 'directory', q] as const,
  buildAddress: (handle: string, buildSlug: string) => [...readingKeys.all, 'build-address', handle, buildSlug] as const,
  episodeAddress: (buildId: number, episodeSlug: string) => [...readingKeys.all, 'episode-address', buildId, episodeSlug] as const,
  build: (buildId: number) => [...readingKeys.all, 'build', buildId] as const,
  episode: (episodeId: number) => [...readingKeys.all, 'episode', episodeId] as const,
  creator: (handle: string) => [...readingKeys.all, 'creator', handle] as const,
  search: (q: string, page: number) => [...readingKeys.all, 'search', q, page] as const,
};
