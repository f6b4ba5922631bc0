import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import { openItemCreate, openItemUpdate } from '../../src/shared/schemas/episodes';
import { buildResource, openItemResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { createOpenItem, getOpenItem, openItemsForEpisode, updateOpenItem } from '../services/open-items';
import type { AppDeps } from '../app-deps';

const buildParams = z.object({ buildId: idParam });
const itemParams = z.object({ openItemId: idParam });

/** An episode id from the request must belong to the build (never another build's episode). */
async function episodeOfBuild(deps: AppDeps, buildId: number, episodeId: number, field: string) {
  const e = await deps.db
    .selectFrom('episodes')
    .select('id')
    .where('id', '=', episodeId)
    .where('build_id', '=', buildId)
    .executeTakeFirst();
  if (!e)
    throw new HttpError(400, 'invalid_request', 'That episode is not part of this build', { [field]: ['not an episode of this build'] });
}

export const openItemRoutes = [
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/open-items',
    summary: "The build's open items (with ?episodeId: those still open when that episode starts, and its own)",
    action: 'episode.write',
    params: buildParams,
    query: z.object({ episodeId: idParam.optional() }),
    resource: buildResource,
    handler: async ({ deps, params, query }) => ({ items: await openItemsForEpisode(deps.db, params.buildId, query.episodeId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/open-items',
    summary: 'Note work left open at the end of an episode',
    action: 'episode.write',
    params: buildParams,
    body: openItemCreate,
    resource: buildResource,
    handler: async ({ deps, params, body, res }) => {
      await episodeOfBuild(deps, params.buildId, body.openedInEpisodeId, 'openedInEpisodeId');
      const id = await createOpenItem(deps.db, params.buildId, body);
      res.status(201);
      return getOpenItem(deps.db, id);
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/open-items/:openItemId',
    summary: 'Edit an open item, or close it in an episode (null reopens it)',
    action: 'episode.write',
    params: itemParams,
    body: openItemUpdate,
    resource: openItemResource,
    handler: async ({ deps, params, body }) => {
      const item = await getOpenItem(deps.db, params.openItemId);
      if (body.closedInEpisodeId) await episodeOfBuild(deps, item!.buildId, body.closedInEpisodeId, 'closedInEpisodeId');
      await updateOpenItem(deps.db, params.openItemId, body);
      return getOpenItem(deps.db, params.openItemId);
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/open-items/:openItemId',
    summary: 'Remove an open item noted by mistake',
    action: 'episode.write',
    params: itemParams,
    resource: openItemResource,
    handler: async ({ deps, params, res }) => {
      await deps.db.deleteFrom('open_items').where('id', '=', params.openItemId).execute();
      res.status(204);
    },
  }),
];
