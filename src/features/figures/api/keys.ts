/** Query-key factory for the public figures of an episode. */
export const figureKeys = {
  all: ['figures'] as const,
  episode: (episodeId: number) => [...figureKeys.all, 'episode', episodeId] as const,
};
