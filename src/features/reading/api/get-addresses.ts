import { queryOptions } from '@tanstack/react-query';
import { typed, type ApiClient } from '../../../lib/api-client';
import { readingKeys } from './keys';

const buildAddress = typed<{ buildId: number; path: string; movedFrom: string | null }>();
const episodeAddress = typed<{ episodeId: number; slug: string; movedFrom: string | null }>();

/** A build's id from its public address (a former slug resolves to the current one). */
export function buildAddressOptions(api: ApiClient, handle: string, buildSlug: string) {
  return queryOptions({
    queryKey: readingKeys.buildAddress(handle, buildSlug),
    queryFn: ({ signal }) =>
      api.get(`/api/creators/${encodeURIComponent(handle)}/builds/${encodeURIComponent(buildSlug)}`, buildAddress, signal),
  });
}

/** An episode's id from its slug within a build (a former slug resolves to the current one). */
export function episodeAddressOptions(api: ApiClient, buildId: number, episodeSlug: string) {
  return queryOptions({
    queryKey: readingKeys.episodeAddress(buildId, episodeSlug),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/episodes-by-slug/${encodeURIComponent(episodeSlug)}`, episodeAddress, signal),
  });
}
