import { z } from 'zod';
import { handle, idParam } from '../../src/shared/schemas/accounts';
import { buildDirectoryQuery, searchQuery, type BuildDirectoryResponse } from '../../src/shared/schemas/reading';
import { buildResource, episodeResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { listBuildDirectory } from '../db/reading.queries';
import { getBuildOverview, getCreatorPage, getEpisodeReading, presentBuildCard } from '../services/reading';
import { search } from '../services/search';
import { sendCachedBody } from '../services/reading-cache';

const orNotFound = <T>(value: T | null): T => {
  if (value === null) throw new HttpError(404, 'not_found', 'Not found');
  return value;
};

/** The public side: directory, build and episode pages, creators, search. */
export const readingRoutes = [
  defineRoute({
    method: 'get',
    path: '/builds',
    summary: 'The builds directory: public builds filtered by kind of vehicle, make and decade',
    action: 'site.read',
    query: buildDirectoryQuery,
    shareWhileRunning: true,
    handler: async ({ deps, query }): Promise<BuildDirectoryResponse> => {
      const { rows, total, makes, decades } = await listBuildDirectory(deps.db, query);
      return { items: rows.map(presentBuildCard), page: query.page, perPage: query.perPage, total, makes, decades };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/overview',
    summary: 'The build page: vehicle, team, published episodes in order, open items, hours worked',
    action: 'build.read',
    params: z.object({ buildId: idParam }),
    resource: buildResource,
    handler: async ({ deps, params }) => orNotFound(await getBuildOverview(deps.db, params.buildId)),
  }),
  defineRoute({
    method: 'get',
    path: '/episodes/:episodeId/reading',
    summary: 'The episode page: write-up, chapters with their moments, caution, neighbours, open items',
    action: 'episode.read',
    params: z.object({ episodeId: idParam }),
    resource: episodeResource,
    // Served from the cache while the build's content revision is unchanged (no second query, no
    // serialising, gzip made once); the response is the same for everyone the policy lets in.
    handler: async ({ deps, params, req, res, resource }) => {
      const revision = resource?.kind === 'episode' ? resource.contentRevision : undefined;
      const body =
        revision === undefined
          ? null
          : await deps.readingCache.get(`reading:${params.episodeId}`, revision, () => getEpisodeReading(deps.db, params.episodeId));
      if (revision !== undefined && !body) throw new HttpError(404, 'not_found', 'Not found');
      if (body) return sendCachedBody(req, res, body);
      return orNotFound(await getEpisodeReading(deps.db, params.episodeId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/creators/:handle',
    summary: "A creator's page: their public builds and latest episodes",
    action: 'site.read',
    params: z.object({ handle }),
    handler: async ({ deps, params }) => orNotFound(await getCreatorPage(deps.db, params.handle)),
  }),
  defineRoute({
    method: 'get',
    path: '/search',
    summary: 'Full-text search over published episodes and public builds',
    action: 'site.read',
    query: searchQuery,
    // Everyone searching the same words at once shares one run of the query (it ranks every match).
    shareWhileRunning: true,
    handler: ({ deps, query }) => search(deps.db, query.q, query.page),
  }),
];
