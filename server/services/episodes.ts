import { sql, type Kysely } from 'kysely';
import { needsCaution } from '../../src/shared/safety';
import type { Episode, EpisodeCreate, EpisodeUpdate } from '../../src/shared/schemas/episodes';
import { slugify } from '../../src/shared/slug';
import { EMPTY_WRITE_UP, writeUpImageIds, type WriteUpDoc } from '../../src/shared/write-up';
import type { Database } from '../db/database';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';
import { figureSystemKeys } from './figures';
import { announceEpisode, type NoticeDeps } from './notices';
import { renderWriteUp, type WriteUpImages } from './write-up-html';
import { presentImage } from '../presenters/media';

type Trx = Kysely<Database>;

/** A save based on an old version: the caller answers 409 with the current episode. */
export class VersionConflict extends Error {
  constructor(readonly current: Episode) {
    super('The episode was changed elsewhere');
  }
}

async function freeEpisodeSlug(trx: Trx, buildId: number, title: string, exceptId?: number): Promise<string> {
  const base = slugify(title);
  for (let n = 1; n < 500; n += 1) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    const current = await trx
      .selectFrom('episodes')
      .select('id')
      .where('build_id', '=', buildId)
      .where('slug', '=', candidate)
      .executeTakeFirst();
    const former = await trx
      .selectFrom('episode_slugs')
      .select('episode_id')
      .where('build_id', '=', buildId)
      .where('slug', '=', candidate)
      .executeTakeFirst();
    if ((!current || current.id === exceptId) && (!former || former.episode_id === exceptId)) return candidate;
  }
  throw new HttpError(409, 'conflict', 'No free address for that title');
}

/** A new draft episode; its number defaults to the next free one in the build. */
export async function createEpisode(db: Db, buildId: number, input: EpisodeCreate): Promise<number> {
  return db.transaction().execute(async (trx) => {
    await trx.selectFrom('builds').select('id').where('id', '=', buildId).forUpdate().executeTakeFirstOrThrow();
    const max = await trx
      .selectFrom('episodes')
      .select((eb) => eb.fn.max('number').as('n'))
      .where('build_id', '=', buildId)
      .executeTakeFirst();
    const row = await trx
      .insertInto('episodes')
      .values({
        build_id: buildId,
        number: input.number ?? Number(max?.n ?? 0) + 1,
        slug: await freeEpisodeSlug(trx, buildId, input.title),
        title: input.title,
        summary: input.summary ?? null,
        write_up: JSON.stringify(EMPTY_WRITE_UP),
        write_up_html: renderWriteUp(EMPTY_WRITE_UP),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  });
}

/** The episode with its chapters, as the editor (and, when published, readers) get it. */
export async function getEpisode(db: Db | Trx, episodeId: number): Promise<Episode | null> {
  const e = await db.selectFrom('episodes').selectAll().where('id', '=', episodeId).executeTakeFirst();
  if (!e) return null;
  const [chapters, systems, partSystems, figureKeys] = await Promise.all([
    db.selectFrom('chapters').selectAll().where('episode_id', '=', episodeId).orderBy('position').execute(),
    db.selectFrom('build_systems').select(['key', 'name', 'safety_critical']).where('build_id', '=', e.build_id).execute(),
    db
      .selectFrom('part_lines')
      .select('system_key')
      .distinct()
      .where('episode_id', '=', episodeId)
      .where('system_key', 'is not', null)
      .execute(),
    figureSystemKeys(db, episodeId),
  ]);
  // The union of the systems the episode's chapters, part lines and figures name (DESIGN.md "Safety").
  const systemKeys = [...[...chapters, ...partSystems].flatMap((c) => (c.system_key ? [c.system_key] : [])), ...figureKeys];
  const caution = needsCaution(
    { raisedVehicle: e.raised_vehicle, systemKeys },
    systems.map((s) => ({ key: s.key, name: s.name, safetyCritical: s.safety_critical })),
  );
  return {
    id: e.id,
    buildId: e.build_id,
    slug: e.slug,
    number: e.number,
    title: e.title,
    summary: e.summary,
    writeUp: e.write_up as WriteUpDoc,
    writeUpHtml: e.write_up_html,
    videoUrl: e.video_url,
    durationSeconds: e.duration_seconds,
    hoursWorked: e.minutes_worked === null ? null : e.minutes_worked / 60,
    raisedVehicle: e.raised_vehicle,
    videoDisclosureConfirmed: e.video_disclosure_confirmed,
    chapters: chapters.map((c, i) => ({
      id: c.id,
      startSeconds: c.start_seconds,
      endSeconds: chapters[i + 1]?.start_seconds ?? e.duration_seconds ?? null,
      title: c.title,
      systemKey: c.system_key,
      notes: c.notes,
    })),
    status: e.status,
    publishAt: e.publish_at?.toISOString() ?? null,
    publishedAt: e.published_at?.toISOString() ?? null,
    publishError: e.publish_error,
    version: e.version,
    needsCaution: caution.needed,
    deletedAt: e.deleted_at?.toISOString() ?? null,
    createdAt: e.created_at.toISOString(),
    updatedAt: e.updated_at.toISOString(),
  };
}

/** The write-up's pictures, which must be photos of this build (400 naming the write-up otherwise), and alt text synced. */
async function writeUpImages(trx: Trx, buildId: number, doc: WriteUpDoc): Promise<WriteUpImages> {
  const ids = [...new Set(writeUpImageIds(doc))];
  if (!ids.length) return new Map();
  const rows = await trx
    .selectFrom('media')
    .selectAll()
    .where('id', 'in', ids)
    .where('build_id', '=', buildId)
    .where('kind', '=', 'photo')
    .execute();
  if (rows.length !== ids.length)
    throw new HttpError(400, 'invalid_request', 'A picture in the write-up is not a photo of this build', {
      writeUp: ['a picture is not a photo of this build'],
    });
  // The alt text typed in the editor is the photo's own.
  const walk = (nodes: WriteUpDoc['content']) => {
    for (const n of nodes ?? []) {
      if (n.type === 'mediaImage' && n.attrs.alt.trim()) alts.set(n.attrs.mediaId, n.attrs.alt.trim());
      if ('content' in n && Array.isArray(n.content)) walk(n.content as WriteUpDoc['content']);
    }
  };
  const alts = new Map<number, string>();
  walk(doc.content);
  for (const [id, alt] of alts) await trx.updateTable('media').set({ alt_text: alt }).where('id', '=', id).execute();
  const out = new Map<number, { src: string; srcset: string; width: number; height: number }>();
  for (const r of rows) {
    const img = presentImage(r);
    if (img) out.set(r.id, { src: img.src, srcset: img.srcset, width: img.width, height: img.height });
  }
  return out;
}

/** Locks the episode and checks the editor's version; returns the locked row. */
async function lockAt(trx: Trx, episodeId: number, version: number) {
  const row = await trx.selectFrom('episodes').selectAll().where('id', '=', episodeId).forUpdate().executeTakeFirstOrThrow();
  if (row.version !== version) throw new VersionConflict((await getEpisode(trx, episodeId))!);
  return row;
}

/** Saves what the editor changed (an autosave), if it was based on the current version. */
export async function updateEpisode(db: Db, episodeId: number, input: EpisodeUpdate): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const row = await lockAt(trx, episodeId, input.version);
    if (input.chapters) {
      // Order and length rules are publish checks: a draft may hold chapters still being fixed.
      const systems = new Set(
        (await trx.selectFrom('build_systems').select('key').where('build_id', '=', row.build_id).execute()).map((s) => s.key),
      );
      const unknown = input.chapters.findIndex((c) => c.systemKey !== null && !systems.has(c.systemKey));
      if (unknown >= 0)
        throw new HttpError(400, 'invalid_request', 'Unknown vehicle system', {
          [`chapters.${unknown}.systemKey`]: ['not one of this build’s systems'],
        });
      await trx.deleteFrom('chapters').where('episode_id', '=', episodeId).execute();
      if (input.chapters.length) {
        await trx
          .insertInto('chapters')
          .values(
            input.chapters.map((c, i) => ({
              episode_id: episodeId,
              position: i,
              start_seconds: c.startSeconds,
              title: c.title,
              system_key: c.systemKey,
              notes: c.notes,
            })),
          )
          .execute();
      }
    }
    let slug = row.slug;
    if (input.title !== undefined && input.title !== row.title) {
      slug = await freeEpisodeSlug(trx, row.build_id, input.title, episodeId);
      if (slug !== row.slug) {
        await trx
          .insertInto('episode_slugs')
          .values({ episode_id: episodeId, build_id: row.build_id, slug: row.slug })
          .onConflict((oc) => oc.columns(['build_id', 'slug']).doNothing())
          .execute();
        await trx.deleteFrom('episode_slugs').where('build_id', '=', row.build_id).where('slug', '=', slug).execute();
      }
    }
    await trx
      .updateTable('episodes')
      .set({
        slug,
        ...(input.title !== undefined ? { title: input.title } : {}),
        ...(input.number !== undefined ? { number: input.number } : {}),
        ...(input.summary !== undefined ? { summary: input.summary } : {}),
        ...(input.writeUp !== undefined
          ? {
              write_up: JSON.stringify(input.writeUp),
              write_up_html: renderWriteUp(input.writeUp, await writeUpImages(trx, row.build_id, input.writeUp)),
            }
          : {}),
        ...(input.videoUrl !== undefined ? { video_url: input.videoUrl } : {}),
        ...(input.durationSeconds !== undefined ? { duration_seconds: input.durationSeconds } : {}),
        ...(input.hoursWorked !== undefined
          ? { minutes_worked: input.hoursWorked === null ? null : Math.round(input.hoursWorked * 60) }
          : {}),
        ...(input.raisedVehicle !== undefined ? { raised_vehicle: input.raisedVehicle } : {}),
        ...(input.videoDisclosureConfirmed !== undefined ? { video_disclosure_confirmed: input.videoDisclosureConfirmed } : {}),
        version: row.version + 1,
        updated_at: sql<Date>`now()`,
      })
      .where('id', '=', episodeId)
      .execute();
  });
}

/** Changes the publication state under the version check; `when` is for scheduling. Publishing announces the episode to its followers (once). */
export async function setStatus(
  deps: NoticeDeps & { db: Db },
  episodeId: number,
  version: number,
  status: 'draft' | 'scheduled' | 'published',
  when?: Date,
): Promise<void> {
  await deps.db.transaction().execute(async (trx) => {
    const row = await lockAt(trx, episodeId, version);
    await trx
      .updateTable('episodes')
      .set({
        status,
        publish_at: status === 'scheduled' ? (when ?? null) : null,
        published_at: status === 'published' ? sql<Date>`now()` : null,
        publish_error: null,
        version: row.version + 1,
        updated_at: sql<Date>`now()`,
      })
      .where('id', '=', episodeId)
      .execute();
    if (status === 'published') await announceEpisode(trx, deps, episodeId);
  });
}

export async function trashEpisode(db: Db, episodeId: number): Promise<void> {
  await db
    .updateTable('episodes')
    .set({ deleted_at: sql<Date>`now()` })
    .where('id', '=', episodeId)
    .where('deleted_at', 'is', null)
    .execute();
}

export async function restoreEpisode(db: Db, episodeId: number): Promise<void> {
  const r = await db
    .updateTable('episodes')
    .set({ deleted_at: null })
    .where('id', '=', episodeId)
    .where('deleted_at', '>', sql<Date>`now() - interval '30 days'`)
    .executeTakeFirst();
  if (!r.numUpdatedRows) throw new HttpError(409, 'not_in_trash', 'This episode is not in the trash (or was removed for good)');
}

/** Renders again the stored HTML of every episode whose write-up shows this photo (its sizes are ready now). */
export async function rerenderWriteUpsShowing(db: Db, mediaId: number): Promise<number> {
  const rows = await db
    .selectFrom('episodes')
    .select(['id', 'build_id', 'write_up'])
    .where(
      sql<boolean>`jsonb_path_exists(write_up, '$.** ? (@.type == "mediaImage" && @.attrs.mediaId == $id)', jsonb_build_object('id', ${mediaId}::bigint))`,
    )
    .execute();
  for (const r of rows) {
    await db.transaction().execute(async (trx) => {
      const doc = r.write_up as WriteUpDoc;
      await trx
        .updateTable('episodes')
        .set({ write_up_html: renderWriteUp(doc, await writeUpImages(trx, r.build_id, doc)) })
        .where('id', '=', r.id)
        .execute();
    });
  }
  return rows.length;
}
