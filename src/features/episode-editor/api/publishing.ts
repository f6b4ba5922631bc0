import type { ApiClient } from '../../../lib/api-client';
import { episode, type Episode } from '../../../shared/schemas/episodes';
import { episodePath } from './get-episode';

/**
 * Publish, schedule and unpublish all carry the version the editor last saw. They are plain
 * functions, not mutations, because the autosave hook runs them inside its own lock (after
 * flushing what is unsaved), so no autosave can slip in between with the same version.
 */
export function publishEpisode(api: ApiClient, episodeId: number, version: number): Promise<Episode> {
  return api.post(`${episodePath(episodeId)}/publish`, { version }, episode);
}

export function scheduleEpisode(api: ApiClient, episodeId: number, version: number, publishAt: string): Promise<Episode> {
  return api.post(`${episodePath(episodeId)}/schedule`, { version, publishAt }, episode);
}

export function unpublishEpisode(api: ApiClient, episodeId: number, version: number): Promise<Episode> {
  return api.post(`${episodePath(episodeId)}/unpublish`, { version }, episode);
}
