import { z } from 'zod';

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
