import type { Selectable } from 'kysely';
import type { BuildPhotosQuery, EpisodePicturesUpdate } from '../../../src/shared/schemas/media';
import type { MediaTable } from '../../db/database';
import type { Db } from '../../db/kysely';
import { HttpError } from '../../http/http-error';

type MediaRow = Selectable<MediaTable>;

// Covers and the episode gallery: which of a build's stored photos readers see, and where.

/** A page of the build's photos, newest first (receipts and logos never appear here). */
export async function listBuildPhotos(db: Db, buildId: number, q: BuildPhotosQuery): Promise<{ rows: MediaRow[]; total: number }> {
  const base = db.selectFrom('media').where('build_id', '=', buildId).where('kind', '=', 'photo');
  const [rows, count] = await Promise.all([
    base
      .selectAll()
      .orderBy('created_at', 'desc')
      .orderBy('id', 'desc')
      .limit(q.perPage)
      .offset((q.page - 1) * q.perPage)
      .execute(),
    base.select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow(),
  ]);
  return { rows, total: Number(count.n) };
}

/**
 * The episode's chosen cover and its gallery in order, in one query: each row says whether it is the
 * cover, and its gallery position (null when it is only the cover).
 */
export async function episodePictureRows(db: Db, episodeId: number): Promise<{ cover: MediaRow | null; gallery: MediaRow[] }> {
  const rows = await db
    .selectFrom('media as m')
    .leftJoin('episode_gallery as g', (j) => j.onRef('g.media_id', '=', 'm.id').on('g.episode_id', '=', episodeId))
    .leftJoin('episodes as e', (j) => j.onRef('e.cover_media_id', '=', 'm.id').on('e.id', '=', episodeId))
    .selectAll('m')
    .select(['g.position as gallery_position', 'e.id as cover_of'])
    .where((eb) => eb.or([eb('g.episode_id', 'is not', null), eb('e.id', 'is not', null)]))
    .orderBy('g.position')
    .execute();
  const strip = ({ gallery_position: _p, cover_of: _c, ...m }: (typeof rows)[number]): MediaRow => m;
  const cover = rows.find((r) => r.cover_of !== null);
  return {
    cover: cover ? strip(cover) : null,
    gallery: rows.filter((r) => r.gallery_position !== null).map(strip),
  };
}

/**
 * Checks that every id is a photo of this build; with `needAlt`, that each has its alt text too.
 * Answers 400 naming the field of the first bad one (`coverMediaId`, `gallery.2`).
 */
async function checkPhotos(db: Db, buildId: number, ids: Array<{ field: string; id: number }>, needAlt: boolean): Promise<void> {
  if (!ids.length) return;
  const rows = await db
    .selectFrom('media')
    .select(['id', 'alt_text'])
    .where('build_id', '=', buildId)
    .where('kind', '=', 'photo')
    .where(
      'id',
      'in',
      ids.map((x) => x.id),
    )
    .execute();
  const found = new Map(rows.map((r) => [r.id, r.alt_text?.trim() ?? '']));
  const fields: Record<string, string[]> = {};
  for (const { field, id } of ids) {
    if (!found.has(id)) fields[field] = ['choose one of this build’s photos'];
    else if (needAlt && !found.get(id)) fields[field] = ['describe the picture (alt text) first: readers see it as soon as it is saved'];
  }
  if (Object.keys(fields).length) throw new HttpError(400, 'invalid_request', 'Some pictures cannot be used here', fields);
}

/** Sets the episode's cover and replaces its gallery, in one transaction. Public episodes need alt text now. */
export async function setEpisodePictures(db: Db, episodeId: number, input: EpisodePicturesUpdate): Promise<void> {
  const e = await db.selectFrom('episodes').select(['build_id', 'status']).where('id', '=', episodeId).executeTakeFirstOrThrow();
  const wanted = [
    ...(input.coverMediaId === null ? [] : [{ field: 'coverMediaId', id: input.coverMediaId }]),
    ...input.gallery.map((id, i) => ({ field: `gallery.${i}`, id })),
  ];
  // A draft may hold undescribed pictures (the publish check asks for them); a public episode may not.
  await checkPhotos(db, e.build_id, wanted, e.status !== 'draft');
  await db.transaction().execute(async (trx) => {
    await trx.updateTable('episodes').set({ cover_media_id: input.coverMediaId }).where('id', '=', episodeId).execute();
    await trx.deleteFrom('episode_gallery').where('episode_id', '=', episodeId).execute();
    if (input.gallery.length)
      await trx
        .insertInto('episode_gallery')
        .values(input.gallery.map((media_id, position) => ({ episode_id: episodeId, media_id, position })))
        .execute();
  });
}

/** The build's cover row, if one is chosen. */
export async function buildCoverRow(db: Db, buildId: number): Promise<MediaRow | null> {
  const row = await db
    .selectFrom('builds as b')
    .innerJoin('media as m', 'm.id', 'b.cover_media_id')
    .selectAll('m')
    .where('b.id', '=', buildId)
    .executeTakeFirst();
  return row ?? null;
}

/** Sets or clears the build's cover; a cover is public at once, so it needs its alt text. */
export async function setBuildCover(db: Db, buildId: number, mediaId: number | null): Promise<void> {
  if (mediaId !== null) await checkPhotos(db, buildId, [{ field: 'coverMediaId', id: mediaId }], true);
  await db.updateTable('builds').set({ cover_media_id: mediaId }).where('id', '=', buildId).execute();
}
