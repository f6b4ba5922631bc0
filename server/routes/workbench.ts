import { z } from 'zod';
import { handle, idParam } from '../../src/shared/schemas/accounts';
import { paths } from '../../src/shared/paths';
import { canSee, signedIn } from '../auth/policy';
import { buildResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { getWorkbench } from '../services/workbench';
import { findEpisodeBySlug, getEpisodePage } from '../services/episode-page';
import { sendCachedBody } from '../services/reading-cache';
import type { EpisodePage } from '../../src/shared/schemas/episode-page';
import { sql } from 'kysely';

const slug = z.string().regex(/^[a-z0-9-]{1,80}$/);

export const workbenchRoutes = [
  defineRoute({
    method: 'get',
    path: '/workbench',
    summary: "The signed-in creator's builds, drafts, scheduled episodes, trash and transfers offered",
    action: 'account.self',
    handler: ({ deps, actor }) => getWorkbench(deps.db, signedIn(actor).userId),
  }),
  defineRoute({
    method: 'get',
    path: '/creators/:handle/builds/:buildSlug',
    summary: 'Find a build by its address; a former slug answers 301 to the current one',
    action: 'site.read',
    params: z.object({ handle, buildSlug: slug }),
    handler: async ({ deps, actor, params, res }) => {
      const owner = await deps.db
        .selectFrom('users')
        .select('id')
        .where(sql`lower(handle)`, '=', params.handle)
        .executeTakeFirst();
      if (!owner) throw new HttpError(404, 'not_found', 'Not found');
      let b = await deps.db
        .selectFrom('builds')
        .select(['id', 'slug', 'visibility', 'deleted_at', 'pending_transfer_to'])
        .where('owner_id', '=', owner.id)
        .where('slug', '=', params.buildSlug)
        .executeTakeFirst();
      let moved = false;
      if (!b) {
        const former = await deps.db
          .selectFrom('build_slugs')
          .select('build_id')
          .where('owner_id', '=', owner.id)
          .where('slug', '=', params.buildSlug)
          .executeTakeFirst();
        if (former)
          b = await deps.db
            .selectFrom('builds')
            .select(['id', 'slug', 'visibility', 'deleted_at', 'pending_transfer_to'])
            .where('id', '=', former.build_id)
            .executeTakeFirst();
        moved = b !== undefined;
      }
      if (
        !b ||
        !canSee(actor, {
          kind: 'build',
          id: b.id,
          visibility: b.visibility,
          deleted: b.deleted_at !== null,
          pendingTransferTo: b.pending_transfer_to,
        })
      )
        throw new HttpError(404, 'not_found', 'Not found');
      const current = await deps.db
        .selectFrom('users')
        .select('handle')
        .innerJoin('builds', 'builds.owner_id', 'users.id')
        .where('builds.id', '=', b.id)
        .executeTakeFirstOrThrow();
      const path = paths.build(current.handle, b.slug);
      if (moved) {
        res.status(301).setHeader('location', `/api/creators/${encodeURIComponent(current.handle)}/builds/${encodeURIComponent(b.slug)}`);
        return { buildId: b.id, path, movedFrom: params.buildSlug };
      }
      return { buildId: b.id, path, movedFrom: null };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/episodes-by-slug/:episodeSlug',
    summary: 'Find an episode of a build by its slug; a former slug answers 301 to the current one',
    action: 'episode.read',
    params: z.object({ buildId: idParam, episodeSlug: slug }),
    resource: buildResource,
    handler: async ({ deps, actor, params, res }) => {
      const e = await findEpisodeBySlug(deps.db, actor, params.buildId, params.episodeSlug);
      if (!e) throw new HttpError(404, 'not_found', 'Not found');
      if (e.moved) res.status(301).setHeader('location', `/api/builds/${params.buildId}/episodes-by-slug/${encodeURIComponent(e.slug)}`);
      return { episodeId: e.id, slug: e.slug, movedFrom: e.moved ? params.episodeSlug : null };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/episode-page/:episodeSlug',
    summary: "The episode page in one response: address, reading, parts, the build's totals, figures and posts",
    action: 'episode.read',
    params: z.object({ buildId: idParam, episodeSlug: slug }),
    resource: buildResource,
    handler: async ({ deps, actor, params, req, res, resource }): Promise<EpisodePage | void> => {
      const load = async () => {
        const e = await findEpisodeBySlug(deps.db, actor, params.buildId, params.episodeSlug);
        const page = e ? await getEpisodePage(deps, actor, params.buildId, e, params.episodeSlug) : null;
        return e && page ? { e, page } : null;
      };
      let found: Awaited<ReturnType<typeof load>> | undefined;
      // A visitor's page is the same for every visitor: kept per build content revision, which
      // posts bump too (migration 2026-12-03_1400). A former slug (301), a missing episode and a
      // page with a failed section are answered fresh and not kept.
      const revision = actor === null && resource?.kind === 'build' ? resource.contentRevision : undefined;
      if (revision !== undefined) {
        const held: { found?: typeof found } = {};
        const body = await deps.readingCache.get(`episode-page:${params.buildId}:${params.episodeSlug}`, revision, async () => {
          held.found = await load();
          const p = held.found?.page;
          return p && !held.found?.e.moved && p.parts && p.totals && p.figures && p.posts ? p : null;
        });
        if (body) return sendCachedBody(req, res, body);
        found = held.found;
      }
      found ??= await load();
      if (!found) throw new HttpError(404, 'not_found', 'Not found');
      const { e, page } = found;
      if (e.moved) res.status(301).setHeader('location', `/api/builds/${params.buildId}/episode-page/${encodeURIComponent(e.slug)}`);
      return page;
    },
  }),
];
