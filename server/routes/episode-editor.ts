import type { Response } from 'express';
import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import { episodeSchedule, episodeUpdate, episodeVersionBody } from '../../src/shared/schemas/episodes';
import type { AppDeps } from '../app-deps';
import { episodeResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { PUBLISH_DUE_JOB } from '../jobs/episodes';
import { getEpisode, restoreEpisode, setStatus, trashEpisode, updateEpisode, VersionConflict } from '../services/episodes';
import { runPublishChecks } from '../services/publish-checks';

const episodeParams = z.object({ episodeId: idParam });

async function present(deps: AppDeps, id: number) {
  const e = await getEpisode(deps.db, id);
  if (!e) throw new HttpError(404, 'not_found', 'Not found');
  return e;
}

/** Runs a versioned write; a stale version answers 409 with the current episode so the editor can choose. */
async function versioned(deps: AppDeps, res: Response, id: number, write: () => Promise<void>) {
  try {
    await write();
  } catch (err) {
    if (!(err instanceof VersionConflict)) throw err;
    res.status(409).json({
      error: { code: 'version_conflict', message: 'This episode was changed in another tab or by someone else' },
      current: err.current,
    });
    return undefined;
  }
  return present(deps, id);
}

async function refuseUnpublishable(deps: AppDeps, id: number, publishAt?: Date) {
  const problems = await runPublishChecks(deps.db, id, publishAt);
  if (!problems.length) return;
  const fields: Record<string, string[]> = {};
  for (const p of problems) (fields[p.field] ??= []).push(p.message);
  throw new HttpError(422, 'publish_checks_failed', `Not ready to publish: ${problems.map((p) => p.message).join('; ')}`, fields);
}

export const episodeEditorRoutes = [
  defineRoute({
    method: 'get',
    path: '/episodes/:episodeId',
    summary: 'An episode with its write-up and chapters (drafts only for its build team)',
    action: 'episode.read',
    params: episodeParams,
    resource: episodeResource,
    handler: ({ deps, params }) => present(deps, params.episodeId),
  }),
  defineRoute({
    method: 'patch',
    path: '/episodes/:episodeId',
    summary: 'Save changes to an episode (autosave); a stale version gets 409 with the current one',
    action: 'episode.write',
    params: episodeParams,
    body: episodeUpdate,
    resource: episodeResource,
    handler: ({ deps, params, body, res }) => versioned(deps, res, params.episodeId, () => updateEpisode(deps.db, params.episodeId, body)),
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/publish',
    summary: 'Publish now, after the publish checks',
    action: 'episode.write',
    params: episodeParams,
    body: episodeVersionBody,
    resource: episodeResource,
    handler: async ({ deps, params, body, res }) => {
      await refuseUnpublishable(deps, params.episodeId);
      return versioned(deps, res, params.episodeId, () => setStatus(deps, params.episodeId, body.version, 'published'));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/schedule',
    summary: 'Schedule publication; the checks run now and again at that time',
    action: 'episode.write',
    params: episodeParams,
    body: episodeSchedule,
    resource: episodeResource,
    handler: async ({ deps, params, body, res }) => {
      const when = new Date(body.publishAt);
      if (when.getTime() <= Date.now() + 30_000)
        throw new HttpError(400, 'invalid_request', 'Pick a time in the future', { publishAt: ['must be in the future'] });
      await refuseUnpublishable(deps, params.episodeId, when);
      const out = await versioned(deps, res, params.episodeId, () => setStatus(deps, params.episodeId, body.version, 'scheduled', when));
      if (out) await deps.queue.send(PUBLISH_DUE_JOB, { episodeId: params.episodeId }, { startAfter: when });
      return out;
    },
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/unpublish',
    summary: 'Back to draft (published or scheduled)',
    action: 'episode.write',
    params: episodeParams,
    body: episodeVersionBody,
    resource: episodeResource,
    handler: ({ deps, params, body, res }) =>
      versioned(deps, res, params.episodeId, () => setStatus(deps, params.episodeId, body.version, 'draft')),
  }),
  defineRoute({
    method: 'delete',
    path: '/episodes/:episodeId',
    summary: 'Move an episode to the trash (its build owner can restore it for 30 days)',
    action: 'episode.delete',
    params: episodeParams,
    resource: episodeResource,
    handler: async ({ deps, params, res }) => {
      await trashEpisode(deps.db, params.episodeId);
      res.status(204);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/restore',
    summary: 'Take an episode back out of the trash',
    action: 'episode.delete',
    params: episodeParams,
    body: z.object({}).strict(),
    resource: episodeResource,
    handler: async ({ deps, params }) => {
      await restoreEpisode(deps.db, params.episodeId);
      return present(deps, params.episodeId);
    },
  }),
];
