import type { Selectable } from 'kysely';
import type { ImageRef, MediaItem } from '../../src/shared/schemas/media';
import type { MediaTable } from '../db/database';
import type { Variant } from '../services/media/pipeline';

type MediaRow = Selectable<MediaTable>;

/** The same-site address of one stored object of a photo (`/files/<id>/<sha256>/<name>`): unguessable, immutable. */
export function fileUrl(row: Pick<MediaRow, 'id' | 'sha256'>, key: string): string {
  return `/files/${row.id}/${row.sha256}/${key.split('/').pop()}`;
}

function variantsOf(row: Pick<MediaRow, 'variants'>): Variant[] {
  return Array.isArray(row.variants) ? (row.variants as Variant[]) : [];
}

export function presentMedia(row: MediaRow): MediaItem {
  const variants = variantsOf(row);
  const isImage = row.kind !== 'receipt';
  const largest = variants[variants.length - 1];
  return {
    id: row.id,
    kind: row.kind,
    contentType: row.content_type,
    sizeBytes: row.size_bytes,
    width: row.width,
    height: row.height,
    altText: row.alt_text,
    status: row.status,
    src: isImage ? fileUrl(row, largest ? largest.key : row.object_key) : null,
    srcset: variants.map((v) => `${fileUrl(row, v.key)} ${v.width}w`).join(', '),
    placeholder: row.placeholder,
    createdAt: row.created_at.toISOString(),
  };
}

/** A photo for a page, or null when it is not a ready photo with its sizes. */
export function presentImage(row: MediaRow | undefined | null): ImageRef | null {
  if (!row || row.kind === 'receipt' || !row.width || !row.height) return null;
  const m = presentMedia(row);
  return {
    id: row.id,
    src: m.src!,
    srcset: m.srcset,
    width: row.width,
    height: row.height,
    alt: row.alt_text ?? '',
    placeholder: row.placeholder,
  };
}
