import { z } from 'zod';
import { pagedList, pageQuery } from './common';

export const MEDIA_KINDS = ['photo', 'receipt', 'logo'] as const;

/** The text fields sent with an upload (multipart), beside the file itself. */
export const mediaUploadFields = z.object({
  kind: z.enum(['photo', 'receipt']).default('photo'),
  altText: z
    .string()
    .trim()
    .max(300)
    .optional()
    .transform((v) => (v ? v : null)),
});

export const mediaAltUpdate = z.object({ altText: z.string().trim().min(1, 'describe the picture for people who cannot see it').max(300) });

/** A stored file as the API shows it; photos carry their sizes once the variants job has run. */
export const mediaItem = z.object({
  id: z.number().int(),
  kind: z.enum(MEDIA_KINDS),
  contentType: z.string(),
  sizeBytes: z.number().int(),
  width: z.number().int().nullable(),
  height: z.number().int().nullable(),
  altText: z.string().nullable(),
  status: z.enum(['processing', 'ready', 'failed']),
  /** Same-site address of the picture (largest size ready, else the cleaned original); null for receipts. */
  src: z.string().nullable(),
  /** `srcset` value with every WebP width; empty while processing. */
  srcset: z.string(),
  placeholder: z.string().nullable(),
  createdAt: z.string(),
});
export type MediaItem = z.infer<typeof mediaItem>;

/** An image as pages show it: enough for `<img src srcset sizes width height alt>`. */
export const imageRef = z.object({
  id: z.number().int(),
  src: z.string(),
  srcset: z.string(),
  width: z.number().int(),
  height: z.number().int(),
  alt: z.string(),
  placeholder: z.string().nullable(),
});
export type ImageRef = z.infer<typeof imageRef>;

/** The build's photos, newest first, for choosing covers and gallery pictures. */
export const buildPhotosQuery = pageQuery.extend({ perPage: z.coerce.number().int().min(1).max(60).default(24) });
export type BuildPhotosQuery = z.infer<typeof buildPhotosQuery>;
export const buildPhotosResponse = pagedList(mediaItem);
export type BuildPhotosResponse = z.infer<typeof buildPhotosResponse>;

/** Most pictures an episode's gallery holds. */
export const GALLERY_MAX = 24;

const mediaId = z.number().int().positive().max(Number.MAX_SAFE_INTEGER);

/** An episode's cover and gallery as the build team edits them. */
export const episodePictures = z.object({ cover: mediaItem.nullable(), gallery: z.array(mediaItem) });
export type EpisodePictures = z.infer<typeof episodePictures>;
export const episodePicturesUpdate = z
  .object({
    coverMediaId: mediaId.nullable(),
    gallery: z.array(mediaId).max(GALLERY_MAX, `a gallery holds at most ${GALLERY_MAX} pictures`),
  })
  .strict()
  .superRefine((v, ctx) => {
    const seen = new Set<number>();
    v.gallery.forEach((id, i) => {
      if (seen.has(id)) ctx.addIssue({ code: 'custom', path: ['gallery', i], message: 'this picture is in the gallery already' });
      seen.add(id);
    });
  });
export type EpisodePicturesUpdate = z.infer<typeof episodePicturesUpdate>;

/** A build's cover as the owner edits it. */
export const buildCover = z.object({ cover: mediaItem.nullable() });
export type BuildCover = z.infer<typeof buildCover>;
export const buildCoverUpdate = z.object({ coverMediaId: mediaId.nullable() }).strict();
export type BuildCoverUpdate = z.infer<typeof buildCoverUpdate>;
