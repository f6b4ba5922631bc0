import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { HttpError } from '../../http/http-error';

export type MediaKind = 'photo' | 'receipt' | 'logo';

/** Largest file accepted (images and PDFs): 25 MB. */
export const MAX_UPLOAD_BYTES = 25 * 1024 * 1024;
/** Largest decoded image: 50 megapixels. A small file that decodes to more is refused before decoding. */
export const MAX_PIXELS = 50_000_000;

const IMAGE_TYPES = new Set(['image/jpeg', 'image/png', 'image/webp', 'image/avif', 'image/gif']);
const ACCEPTED: Record<MediaKind, Set<string>> = {
  photo: IMAGE_TYPES,
  logo: IMAGE_TYPES,
  receipt: new Set([...IMAGE_TYPES, 'application/pdf']),
};
/** Names that ask to be run or rendered as markup: refused whatever the bytes say. */
const DANGEROUS_NAME = /\.(s?html?|xhtml|svgz?|xml|js|mjs|cjs|php\d?|phtml|exe|dll|bat|cmd|sh|ps1|jar|hta|swf)$/i;

export interface Inspected {
  mime: string;
  ext: string;
  width: number | null;
  height: number | null;
}

/**
 * The real type of an upload, read from its bytes (file-type), never from its name or the client's
 * content type; refuses (415) what this kind does not take and (413) images over the pixel limit.
 */
export async function inspectUpload(bytes: Buffer, originalName: string, kind: MediaKind): Promise<Inspected> {
  if (DANGEROUS_NAME.test(originalName))
    throw new HttpError(415, 'unsupported_media_type', 'That kind of file cannot be uploaded', { file: ['not an image or PDF'] });
  const found = await fileTypeFromBuffer(bytes);
  if (!found || !ACCEPTED[kind].has(found.mime)) {
    const allowed = kind === 'receipt' ? 'a JPEG, PNG, WebP, AVIF or GIF image, or a PDF' : 'a JPEG, PNG, WebP, AVIF or GIF image';
    throw new HttpError(415, 'unsupported_media_type', `Upload ${allowed}`, { file: [`must be ${allowed}`] });
  }
  if (found.mime === 'application/pdf') return { mime: found.mime, ext: 'pdf', width: null, height: null };
  // Reads the header only: dimensions without decoding the pixels.
  const meta = await sharp(bytes, { limitInputPixels: false })
    .metadata()
    .catch(() => null);
  if (!meta?.width || !meta.height)
    throw new HttpError(415, 'unsupported_media_type', 'The image could not be read', { file: ['not a readable image'] });
  if (meta.width * meta.height > MAX_PIXELS)
    throw new HttpError(413, 'image_too_large', `Images may have at most ${MAX_PIXELS / 1_000_000} megapixels`, {
      file: [`${meta.width} × ${meta.height} is more than ${MAX_PIXELS / 1_000_000} megapixels`],
    });
  return { mime: found.mime, ext: found.ext, width: meta.width, height: meta.height };
}
