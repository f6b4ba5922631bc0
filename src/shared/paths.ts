/** Public URL paths, built in one place so links and the server's routes agree. */
export const paths = {
  home: () => '/',
  frontPage: (page: number) => (page <= 1 ? '/' : `/?page=${page}`),
  workshop: () => '/workshop',
  creator: (handle: string) => `/creators/${encodeURIComponent(handle)}`,
  build: (handle: string, buildSlug: string) => `/builds/${encodeURIComponent(handle)}/${encodeURIComponent(buildSlug)}`,
  episode: (handle: string, buildSlug: string, episodeSlug: string) =>
    `/builds/${encodeURIComponent(handle)}/${encodeURIComponent(buildSlug)}/episodes/${encodeURIComponent(episodeSlug)}`,
};
