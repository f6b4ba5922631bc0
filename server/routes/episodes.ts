import { latestEpisodesQuery, type LatestEpisodesResponse } from '../../src/shared/schemas/episodes';
import { listLatestEpisodes } from '../db/episodes.queries';
import { defineRoute } from '../http/registry';
import { presentEpisodeListItem } from '../presenters/episodes';

export const episodeRoutes = [
  defineRoute({
    method: 'get',
    path: '/episodes',
    summary: 'Latest published episodes of public builds (the front page)',
    action: 'site.read',
    query: latestEpisodesQuery,
    shareWhileRunning: true,
    handler: async ({ deps, query }): Promise<LatestEpisodesResponse> => {
      const { rows, total } = await listLatestEpisodes(deps.db, { limit: query.perPage, offset: (query.page - 1) * query.perPage });
      return { items: rows.map(presentEpisodeListItem), page: query.page, perPage: query.perPage, total };
    },
  }),
];
