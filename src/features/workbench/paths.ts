/** URL paths of the Workbench screens: the creator's home, builds, their settings and the episode editor. */
export const workbenchPaths = {
  home: () => '/workbench',
  newBuild: () => '/workbench/builds/new',
  build: (buildId: number) => `/workbench/builds/${buildId}`,
  buildSettings: (buildId: number) => `/workbench/builds/${buildId}/settings`,
  episodeEditor: (episodeId: number) => `/workbench/episodes/${episodeId}/edit`,
};
