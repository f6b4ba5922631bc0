import { createHash } from 'node:crypto';
import pLimit from 'p-limit';
import sharp from 'sharp';
import { MAX_PIXELS, type Inspected } from './inspect';

// One libvips thread and one image at a time: four uploads together wait their
// turn instead of decoding four 12-megapixel photos side by side (memory, see `npm run bench:media`).
sharp.concurrency(1);
sharp.cache(false);
const limit = pLimit(1);

/** Widths of the WebP variants; never wider than the original (no upscaling). */
export const VARIANT_WIDTHS = [320, 960, 1920] as const;

export function sha256(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** The variant widths an image of this width gets: the standard ones below it, and its own when smaller than the largest. */
export function variantWidths(width: number): number[] {
  const out: number[] = VARIANT_WIDTHS.filter((w) => w < width);
  if (width <= VARIANT_WIDTHS[VARIANT_WIDTHS.length - 1]!) out.push(width);
  return out.length ? out : [Math.min(width, VARIANT_WIDTHS[VARIANT_WIDTHS.length - 1]!)];
}

export interface CleanImage {
  bytes: Buffer;
  contentType: string;
  ext: string;
  width: number;
  height: number;
}

/**
 * The original as stored: turned upright from its EXIF orientation, then re-encoded in its own format
 * so that no metadata survives (sharp keeps none unless asked) — GPS above all. GIFs become a still PNG.
 */
export function cleanOriginal(bytes: Buffer, inspected: Inspected): Promise<CleanImage> {
  return limit(async () => {
    const img = sharp(bytes, { limitInputPixels: MAX_PIXELS, animated: false }).rotate();
    let out: ReturnType<typeof sharp>;
    let contentType = inspected.mime;
    let ext = inspected.ext;
    switch (inspected.mime) {
      case 'image/jpeg':
        out = img.jpeg({ quality: 90, mozjpeg: true });
        break;
      case 'image/webp':
        out = img.webp({ quality: 90 });
        break;
      case 'image/avif':
        out = img.avif({ quality: 70 });
        break;
      default:
        out = img.png();
        contentType = 'image/png';
        ext = 'png';
    }
    const { data, info } = await out.toBuffer({ resolveWithObject: true });
    return { bytes: data, contentType, ext, width: info.width, height: info.height };
  });
}

export interface Variant {
  width: number;
  height: number;
  key: string;
}

/** WebP variants of a clean original, and a dominant colour to paint while they load. */
export function makeVariants(original: Buffer, keyFor: (width: number) => string) {
  return limit(async () => {
    const meta = await sharp(original, { limitInputPixels: MAX_PIXELS }).metadata();
    const width = meta.width ?? 1;
    const variants: Array<Variant & { bytes: Buffer }> = [];
    for (const w of variantWidths(width)) {
      const { data, info } = await sharp(original, { limitInputPixels: MAX_PIXELS })
        .resize({ width: w, withoutEnlargement: true })
        .webp({ quality: 80 })
        .toBuffer({ resolveWithObject: true });
      variants.push({ width: info.width, height: info.height, key: keyFor(info.width), bytes: data });
    }
    const { dominant } = await sharp(original, { limitInputPixels: MAX_PIXELS }).resize(64).stats();
    const hex = (n: number) => n.toString(16).padStart(2, '0');
    return { variants, placeholder: `#${hex(dominant.r)}${hex(dominant.g)}${hex(dominant.b)}` };
  });
}
