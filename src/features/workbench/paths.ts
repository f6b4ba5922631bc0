/** URL paths of the Workbench screens: the creator's home, builds, their settings and ledger, and the episode editor. */
export const workbenchPaths = {
  home: () => '/workbench',
  newBuild: () => '/workbench/builds/new',
  build: (buildId: number) => `/workbench/builds/${buildId}`,
  buildSettings: (buildId: number) => `/workbench/builds/${buildId}/settings`,
  /** `search` is the ledger's filter, sort and page as URL search params (without '?'). */
  buildLedger: (buildId: number, search = '') => `/workbench/builds/${buildId}/ledger${search ? `?${search}` : ''}`,
  episodeEditor: (episodeId: number) => `/workbench/episodes/${episodeId}/edit`,
};
