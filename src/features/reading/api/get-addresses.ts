import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import type { ApiClient } from '../../../lib/api-client';
import { readingKeys } from './keys';

const buildAddress = z.object({ buildId: z.number().int(), path: z.string(), movedFrom: z.string().nullable() });
const episodeAddress = z.object({ episodeId: z.number().int(), slug: z.string(), movedFrom: z.string().nullable() });

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
