import type { EpisodePage } from '../../../shared/schemas/episode-page';
import { typed, type ApiClient } from '../../../lib/api-client';

/**
 * The episode page's data in one request. Not a query of its own: the route's loader puts each part
 * into the cache entry its section reads (so the hydration data carries it once).
 */
export function fetchEpisodePage(api: ApiClient, buildId: number, episodeSlug: string, signal?: AbortSignal): Promise<EpisodePage> {
  return api.get(`/api/builds/${buildId}/episode-page/${encodeURIComponent(episodeSlug)}`, typed<EpisodePage>(), signal);
}
