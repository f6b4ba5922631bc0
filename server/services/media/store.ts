import type { Kysely } from 'kysely';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import type { AppDeps } from '../../app-deps';
import { HttpError } from '../../http/http-error';
import { rerenderWriteUpsShowing } from '../episodes';
import { inspectUpload, type MediaKind } from './inspect';
import { cleanOriginal, makeVariants, sha256, type Variant } from './pipeline';

export const MEDIA_VARIANTS_JOB = 'media.variants';
export const MEDIA_SWEEP_JOB = 'media.sweep';
/** Objects without a row are removed once they are this old (an upload in flight has no row yet). */
export const ORPHAN_AGE_MS = 24 * 3600 * 1000;

export type MediaOwner = { buildId: number } | { sponsorId: number };

/** Keys derive from the content under the owner's prefix, so the same bytes are stored once per owner. */
export function mediaPrefix(owner: MediaOwner, kind: MediaKind, hash: string): string {
  return 'buildId' in owner ? `builds/${owner.buildId}/${kind}/${hash}` : `sponsors/${owner.sponsorId}/${kind}/${hash}`;
}

function storageError(err: unknown): HttpError {
  return Object.assign(new HttpError(503, 'storage_unavailable', 'File storage is not available; try again shortly'), { cause: err });
}

/**
 * Stores an upload: checks its real type, cleans images of metadata, writes the object, then the row
 * (in a transaction). A failure after the object was written deletes it again; the same bytes under the
 * same owner return the existing row. Photos get their variants from a job.
 */
export async function storeUpload(
  deps: AppDeps,
  input: { owner: MediaOwner; kind: MediaKind; bytes: Buffer; originalName: string; altText: string | null; userId: number },
): Promise<number> {
  const { owner, kind, bytes } = input;
  const inspected = await inspectUpload(bytes, input.originalName, kind);
  const hash = sha256(bytes);
  const q = deps.db.selectFrom('media').select('id');
  const existing = await ('buildId' in owner ? q.where('build_id', '=', owner.buildId) : q.where('sponsor_id', '=', owner.sponsorId))
    .where('kind', '=', kind)
    .where('sha256', '=', hash)
    .executeTakeFirst();
  if (existing) return existing.id;

  const clean = inspected.mime === 'application/pdf' ? null : await cleanOriginal(bytes, inspected);
  const stored = clean ?? { bytes, contentType: inspected.mime, ext: inspected.ext, width: null, height: null };
  const key = `${mediaPrefix(owner, kind, hash)}/original.${stored.ext}`;
  try {
    await deps.storage.put(key, stored.bytes, stored.contentType);
  } catch (err) {
    throw storageError(err);
  }
  try {
    return await deps.db.transaction().execute(async (trx) => {
      const row = await trx
        .insertInto('media')
        .values({
          build_id: 'buildId' in owner ? owner.buildId : null,
          sponsor_id: 'sponsorId' in owner ? owner.sponsorId : null,
          kind,
          sha256: hash,
          object_key: key,
          content_type: stored.contentType,
          size_bytes: stored.bytes.length,
          width: stored.width,
          height: stored.height,
          alt_text: input.altText,
          status: kind === 'photo' || kind === 'logo' ? 'processing' : 'ready',
          created_by: input.userId,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      if (kind === 'photo' || kind === 'logo')
        await deps.queue.send(MEDIA_VARIANTS_JOB, { mediaId: row.id }, { trx: trx as unknown as Kysely<unknown> });
      return row.id;
    });
  } catch (err) {
    // The row never came to be: take the object back out, so nothing is left half-written.
    await deps.storage
      .remove(key)
      .catch((e: unknown) => deps.logger.warn({ err: e, key }, 'could not remove an object after a failed upload'));
    throw err;
  }
}

/** The variants job: WebP sizes and a placeholder colour; the row turns "ready" when they are stored. */
export async function makeMediaVariants(deps: AppDeps, mediaId: number): Promise<void> {
  const m = await deps.db.selectFrom('media').select(['id', 'object_key', 'status']).where('id', '=', mediaId).executeTakeFirst();
  if (!m || m.status === 'ready') return;
  const original = await deps.storage.get(m.object_key);
  const base = m.object_key.replace(/\/original\.[a-z0-9]+$/, '');
  const { variants, placeholder } = await makeVariants(original, (w) => `${base}/w${w}.webp`);
  for (const v of variants) await deps.storage.put(v.key, v.bytes, 'image/webp');
  const stored: Variant[] = variants.map(({ width, height, key }) => ({ width, height, key }));
  await deps.db
    .updateTable('media')
    .set({ variants: JSON.stringify(stored), placeholder, status: 'ready' })
    .where('id', '=', mediaId)
    .execute();
  // Write-ups saved while the sizes were being made point at the original: give them the sizes now.
  await rerenderWriteUpsShowing(deps.db, mediaId);
}

/** Every object key a row points at: the original and its variants. */
export function keysOf(row: { object_key: string; variants: unknown }): string[] {
  const variants = Array.isArray(row.variants) ? (row.variants as Variant[]) : [];
  return [row.object_key, ...variants.map((v) => v.key)];
}

/** Deletes a media row, then its objects (references to it are set to null by the schema). */
export async function deleteMedia(deps: AppDeps, mediaId: number): Promise<void> {
  const row = await deps.db.deleteFrom('media').where('id', '=', mediaId).returning(['object_key', 'variants']).executeTakeFirst();
  if (!row) return;
  for (const key of keysOf(row))
    await deps.storage
      .remove(key)
      .catch((err: unknown) => deps.logger.warn({ err, key }, 'media object left behind; the sweep will remove it'));
}

/**
 * The sweep: removes objects that no row points at once they are a day old, and reports rows whose
 * original object is missing. Returns what it did, for tests and the log.
 */
export async function sweepMedia(deps: AppDeps, now = Date.now()): Promise<{ removed: string[]; missing: number[] }> {
  const rows = await deps.db.selectFrom('media').select(['id', 'object_key', 'variants']).execute();
  const known = new Set(rows.flatMap(keysOf));
  const seen = new Set<string>();
  const removed: string[] = [];
  for (const prefix of ['builds/', 'sponsors/']) {
    let token: string | undefined;
    do {
      const page = await deps.storage.client.send(
        new ListObjectsV2Command({ Bucket: deps.storage.bucket, Prefix: prefix, ContinuationToken: token }),
      );
      for (const o of page.Contents ?? []) {
        if (!o.Key) continue;
        seen.add(o.Key);
        if (!known.has(o.Key) && o.LastModified && now - o.LastModified.getTime() > ORPHAN_AGE_MS) {
          await deps.storage.remove(o.Key);
          removed.push(o.Key);
        }
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }
  const missing = rows.filter((r) => !seen.has(r.object_key)).map((r) => r.id);
  if (missing.length) deps.logger.warn({ mediaIds: missing }, 'media rows whose object is missing');
  return { removed, missing };
}

export function registerMediaJobs(deps: AppDeps): void {
  deps.queue.define<{ mediaId: number }>({ name: MEDIA_VARIANTS_JOB, handler: ({ mediaId }) => makeMediaVariants(deps, mediaId) });
  deps.queue.define({
    name: MEDIA_SWEEP_JOB,
    cron: '23 4 * * *',
    retryLimit: 1,
    handler: async () => {
      const { removed, missing } = await sweepMedia(deps);
      deps.logger.info({ removed: removed.length, missing: missing.length }, 'media sweep');
    },
  });
}
