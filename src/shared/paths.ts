/** Public URL paths, built in one place so links and the server's routes agree. */
export const paths = {
  home: () => '/',
  frontPage: (page: number) => (page <= 1 ? '/' : `/?page=${page}`),
  workshop: () => '/workshop',
  creator: (handle: string) => `/creators/${encodeURIComponent(handle)}`,
  builds: (q: { kind?: string; make?: string; decade?: number; page?: number } = {}) => {
    const p = new URLSearchParams();
    if (q.kind) p.set('kind', q.kind);
    if (q.make) p.set('make', q.make);
    if (q.decade !== undefined) p.set('decade', String(q.decade));
    if (q.page && q.page > 1) p.set('page', String(q.page));
    const s = p.toString();
    return s ? `/builds?${s}` : '/builds';
  },
  build: (handle: string, buildSlug: string) => `/builds/${encodeURIComponent(handle)}/${encodeURIComponent(buildSlug)}`,
  episode: (handle: string, buildSlug: string, episodeSlug: string) =>
    `/builds/${encodeURIComponent(handle)}/${encodeURIComponent(buildSlug)}/episodes/${encodeURIComponent(episodeSlug)}`,
  /** An episode at a moment of its video: the page opens at the chapter that holds it. */
  episodeAt: (handle: string, buildSlug: string, episodeSlug: string, seconds: number) =>
    `${paths.episode(handle, buildSlug, episodeSlug)}#${momentAnchor(seconds)}`,
  search: (q: string, page = 1) => `/search?q=${encodeURIComponent(q)}${page > 1 ? `&page=${page}` : ''}`,
  feeds: {
    site: () => '/feeds/episodes.atom',
    build: (buildId: number) => `/feeds/builds/${buildId}.atom`,
  },
};

/** The in-page anchor of a moment in an episode (`#at-312`); chapters carry their start's anchor. */
export function momentAnchor(seconds: number): string {
  return `at-${Math.max(0, Math.floor(seconds))}`;
}

/** The moment an anchor names, or null: `#at-312` → 312. */
export function parseMomentAnchor(hash: string): number | null {
  const m = /^#?at-(\d{1,6})$/.exec(hash);
  return m ? Number(m[1]) : null;
}
