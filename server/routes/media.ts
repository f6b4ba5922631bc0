import type { Request, Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import {
  buildCoverUpdate,
  buildPhotosQuery,
  episodePicturesUpdate,
  mediaAltUpdate,
  mediaUploadFields,
  type BuildCover,
  type BuildPhotosResponse,
  type EpisodePictures,
  type MediaItem,
} from '../../src/shared/schemas/media';
import type { AppDeps } from '../app-deps';
import { signedIn } from '../auth/policy';
import { buildResource, episodeResource, mediaResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { parse } from '../http/parse';
import { defineRoute } from '../http/registry';
import { presentMedia } from '../presenters/media';
import { MAX_UPLOAD_BYTES } from '../services/media/inspect';
import { buildCoverRow, episodePictureRows, listBuildPhotos, setBuildCover, setEpisodePictures } from '../services/media/pictures';
import { deleteMedia, storeUpload } from '../services/media/store';

// Into memory, one file per request, small text fields: nothing ever lands in a public folder.
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5, fieldSize: 2_000, parts: 8 },
}).single('file');

/** Reads the one multipart file of an upload into memory (413 past the size limit, 400 for anything else wrong). */
export function receiveFile(req: Request, res: Response): Promise<Express.Multer.File | undefined> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(
            new HttpError(413, 'file_too_large', `Files may be at most ${MAX_UPLOAD_BYTES / 1024 / 1024} MB`, { file: ['too large'] }),
          );
        return reject(new HttpError(400, 'invalid_request', 'Send one file in the field "file"', { [err.field ?? 'file']: [err.message] }));
      }
      if (err)
        return reject(
          err instanceof HttpError ? err : new HttpError(400, 'invalid_request', 'The upload could not be read', { file: ['unreadable'] }),
        );
      resolve(req.file);
    });
  });
}

async function loadMedia(deps: AppDeps, id: number) {
  const row = await deps.db.selectFrom('media').selectAll().where('id', '=', id).executeTakeFirst();
  if (!row) throw new HttpError(404, 'not_found', 'Not found');
  return row;
}

const mediaParams = z.object({ mediaId: idParam });

export const mediaRoutes = [
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/media',
    summary: 'Upload a photo or a receipt (multipart, field "file"); photos get their sizes from a job',
    action: 'episode.write',
    params: z.object({ buildId: idParam }),
    // The multipart fields are read after the file, by multer; JSON bodies reach here empty.
    body: z.object({}).passthrough(),
    resource: buildResource,
    handler: async ({ deps, req, res, actor, params }): Promise<MediaItem> => {
      const file = await receiveFile(req, res);
      const fields = parse(mediaUploadFields, req.body ?? {}, 'body');
      if (!file) throw new HttpError(400, 'invalid_request', 'Choose a file to upload', { file: ['choose a file'] });
      const id = await storeUpload(deps, {
        owner: { buildId: params.buildId },
        kind: fields.kind,
        bytes: file.buffer,
        originalName: file.originalname,
        altText: fields.altText,
        userId: signedIn(actor).userId,
      });
      res.status(201);
      return presentMedia(await loadMedia(deps, id));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/media/:mediaId',
    summary: "A stored photo's sizes and state (receipts: the build team only)",
    action: 'build.read',
    params: mediaParams,
    resource: mediaResource,
    handler: async ({ deps, params }) => presentMedia(await loadMedia(deps, params.mediaId)),
  }),
  defineRoute({
    method: 'patch',
    path: '/media/:mediaId',
    summary: "Set a photo's alt text",
    action: 'episode.write',
    params: mediaParams,
    body: mediaAltUpdate,
    resource: mediaResource,
    handler: async ({ deps, params, body }) => {
      await deps.db.updateTable('media').set({ alt_text: body.altText }).where('id', '=', params.mediaId).execute();
      return presentMedia(await loadMedia(deps, params.mediaId));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/media/:mediaId',
    summary: 'Delete a stored file and its sizes (covers, pictures and receipts pointing at it are cleared)',
    action: 'episode.write',
    params: mediaParams,
    resource: mediaResource,
    handler: async ({ deps, params, res }) => {
      await deleteMedia(deps, params.mediaId);
      res.status(204);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/media/:mediaId/download',
    summary: 'Download a receipt (the build team only), as an attachment',
    action: 'build.team.read',
    params: mediaParams,
    resource: mediaResource,
    handler: async ({ deps, params, res }) => {
      const row = await loadMedia(deps, params.mediaId);
      let bytes: Buffer;
      try {
        bytes = await deps.storage.get(row.object_key);
      } catch (err) {
        throw Object.assign(new HttpError(503, 'storage_unavailable', 'File storage is not available; try again shortly'), { cause: err });
      }
      const ext = row.object_key.split('.').pop() ?? 'bin';
      res
        .status(200)
        .type(row.content_type)
        .setHeader('content-disposition', `attachment; filename="${row.kind}-${row.id}.${ext}"`)
        .setHeader('cache-control', 'private, no-store')
        .setHeader('x-content-type-options', 'nosniff')
        .send(bytes);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/photos',
    summary: "The build's photos, newest first, to choose covers and gallery pictures from",
    action: 'build.team.read',
    params: z.object({ buildId: idParam }),
    query: buildPhotosQuery,
    resource: buildResource,
    handler: async ({ deps, params, query }): Promise<BuildPhotosResponse> => {
      const { rows, total } = await listBuildPhotos(deps.db, params.buildId, query);
      return { items: rows.map(presentMedia), page: query.page, perPage: query.perPage, total };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/cover',
    summary: "The build's cover photo, as the owner edits it",
    action: 'build.team.read',
    params: z.object({ buildId: idParam }),
    resource: buildResource,
    handler: async ({ deps, params }): Promise<BuildCover> => {
      const row = await buildCoverRow(deps.db, params.buildId);
      return { cover: row ? presentMedia(row) : null };
    },
  }),
  defineRoute({
    method: 'put',
    path: '/builds/:buildId/cover',
    summary: "Choose or clear the build's cover (one of its photos, described)",
    action: 'build.manage',
    params: z.object({ buildId: idParam }),
    body: buildCoverUpdate,
    resource: buildResource,
    handler: async ({ deps, params, body }): Promise<BuildCover> => {
      await setBuildCover(deps.db, params.buildId, body.coverMediaId);
      const row = await buildCoverRow(deps.db, params.buildId);
      return { cover: row ? presentMedia(row) : null };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/episodes/:episodeId/pictures',
    summary: "The episode's cover and gallery, as the build team edits them",
    action: 'episode.write',
    params: z.object({ episodeId: idParam }),
    resource: episodeResource,
    handler: async ({ deps, params }): Promise<EpisodePictures> => {
      const { cover, gallery } = await episodePictureRows(deps.db, params.episodeId);
      return { cover: cover ? presentMedia(cover) : null, gallery: gallery.map(presentMedia) };
    },
  }),
  defineRoute({
    method: 'put',
    path: '/episodes/:episodeId/pictures',
    summary: "Set the episode's cover and its gallery (in order)",
    action: 'episode.write',
    params: z.object({ episodeId: idParam }),
    body: episodePicturesUpdate,
    resource: episodeResource,
    handler: async ({ deps, params, body }): Promise<EpisodePictures> => {
      await setEpisodePictures(deps.db, params.episodeId, body);
      const { cover, gallery } = await episodePictureRows(deps.db, params.episodeId);
      return { cover: cover ? presentMedia(cover) : null, gallery: gallery.map(presentMedia) };
    },
  }),
];
