/**
 * Query-key factory for the episode editor: every variable a fetcher uses is in its key. The
 * editor reads the episode and its build for writing (drafts included), so its entries live under
 * their own root and never stand in for the public pages' cached copies.
 */
export const editorKeys = {
  all: ['episode-editor'] as const,
  episode: (episodeId: number) => [...editorKeys.all, 'episode', episodeId] as const,
  build: (buildId: number) => [...editorKeys.all, 'build', buildId] as const,
  openItems: (buildId: number, episodeId: number) => [...editorKeys.all, 'open-items', buildId, episodeId] as const,
  figures: (episodeId: number) => [...editorKeys.all, 'figures', episodeId] as const,
};
