import type { ImageRef } from '../../shared/schemas/media';

/**
 * A stored photo on a page: every WebP size in `srcset`, the width and height so the page keeps its
 * place while it loads (no jump), and its description as alt text.
 */
export function Picture({
  image,
  sizes,
  eager = false,
  className = '',
}: {
  image: ImageRef;
  /** The `sizes` attribute: how wide the picture is shown at each screen width. */
  sizes: string;
  /** The first picture on a page loads at once; the rest when they come near. */
  eager?: boolean;
  className?: string;
}) {
  return (
    <img
      src={image.src}
      srcSet={image.srcset || undefined}
      sizes={sizes}
      width={image.width}
      height={image.height}
      alt={image.alt}
      loading={eager ? 'eager' : 'lazy'}
      decoding="async"
      className={`block h-auto w-full border border-rule bg-paper-2 ${className}`}
    />
  );
}
