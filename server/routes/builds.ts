import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import { buildCreate, buildTransferCreate, buildUpdate } from '../../src/shared/schemas/builds';
import { episodeCreate, type EpisodeSummary } from '../../src/shared/schemas/episodes';
import { signedIn } from '../auth/policy';
import { buildResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import type { AppDeps } from '../app-deps';
import {
  acceptTransfer,
  cancelTransfer,
  createBuild,
  getBuild,
  offerTransfer,
  restoreBuild,
  trashBuild,
  updateBuild,
} from '../services/builds';
import { createEpisode, getEpisode } from '../services/episodes';

const buildParams = z.object({ buildId: idParam });
const empty = z.object({}).strict();

async function present(deps: AppDeps, buildId: number, viewerId: number | null) {
  const b = await getBuild(deps.db, buildId, viewerId);
  if (!b) throw new HttpError(404, 'not_found', 'Not found');
  return b;
}

export const buildRoutes = [
  defineRoute({
    method: 'post',
    path: '/builds',
    summary: 'Start a build (the creator becomes its owner)',
    action: 'build.create',
    body: buildCreate,
    handler: async ({ deps, actor, body, res }) => {
      const me = signedIn(actor);
      const id = await createBuild(deps.db, me.userId, body);
      res.status(201);
      return present(deps, id, me.userId);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId',
    summary: 'A build with its vehicle, systems, budget and totals',
    action: 'build.read',
    params: buildParams,
    resource: buildResource,
    handler: ({ deps, actor, params }) => present(deps, params.buildId, actor?.userId ?? null),
  }),
  defineRoute({
    method: 'patch',
    path: '/builds/:buildId',
    summary: 'Edit a build: vehicle, budget, currency, systems, visibility, video link pattern',
    action: 'build.manage',
    params: buildParams,
    body: buildUpdate,
    resource: buildResource,
    handler: async ({ deps, actor, params, body }) => {
      await updateBuild(deps.db, params.buildId, body);
      return present(deps, params.buildId, actor?.userId ?? null);
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/builds/:buildId',
    summary: 'Move a build to the trash (its owner can restore it for 30 days)',
    action: 'build.manage',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, params, res }) => {
      await trashBuild(deps.db, params.buildId);
      res.status(204);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/restore',
    summary: 'Take a build back out of the trash',
    action: 'build.manage',
    params: buildParams,
    body: empty,
    resource: buildResource,
    handler: async ({ deps, actor, params }) => {
      await restoreBuild(deps.db, params.buildId);
      return present(deps, params.buildId, actor?.userId ?? null);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/transfer',
    summary: 'Offer the build to one of its editors',
    action: 'build.manage',
    params: buildParams,
    body: buildTransferCreate,
    resource: buildResource,
    handler: async ({ deps, actor, params, body }) => {
      await offerTransfer(deps.db, params.buildId, body.toUserId);
      return present(deps, params.buildId, actor?.userId ?? null);
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/builds/:buildId/transfer',
    summary: 'Withdraw an offer to hand the build over',
    action: 'build.manage',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, params, res }) => {
      await cancelTransfer(deps.db, params.buildId);
      res.status(204);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/transfer/accept',
    summary: 'Take over a build offered to me (the old owner becomes an editor)',
    action: 'build.transfer.accept',
    params: buildParams,
    body: empty,
    resource: buildResource,
    handler: async ({ deps, actor, params }) => {
      const me = signedIn(actor);
      await acceptTransfer(deps.db, params.buildId, me.userId);
      return present(deps, params.buildId, me.userId);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/episodes',
    summary: "A build's episodes in order: all of them for its team, published ones for others",
    action: 'build.read',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, actor, params }) => {
      const team = actor?.builds.has(params.buildId) ?? false;
      const rows = await deps.db
        .selectFrom('episodes')
        .select(['id', 'build_id', 'number', 'slug', 'title', 'status', 'publish_at', 'published_at', 'minutes_worked', 'updated_at'])
        .where('build_id', '=', params.buildId)
        .where('deleted_at', 'is', null)
        .$if(!team, (q) => q.where('status', '=', 'published'))
        .orderBy('number')
        .execute();
      const items: EpisodeSummary[] = rows.map((r) => ({
        id: r.id,
        buildId: r.build_id,
        number: r.number,
        slug: r.slug,
        title: r.title,
        status: r.status,
        publishAt: r.publish_at?.toISOString() ?? null,
        publishedAt: r.published_at?.toISOString() ?? null,
        hoursWorked: r.minutes_worked === null ? null : r.minutes_worked / 60,
        updatedAt: r.updated_at.toISOString(),
      }));
      return { items };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/episodes',
    summary: 'Start a new draft episode (number defaults to the next free one)',
    action: 'episode.write',
    params: buildParams,
    body: episodeCreate,
    resource: buildResource,
    handler: async ({ deps, params, body, res }) => {
      const id = await createEpisode(deps.db, params.buildId, body);
      res.status(201);
      return getEpisode(deps.db, id);
    },
  }),
];
