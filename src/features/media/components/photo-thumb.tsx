import type { MediaItem } from '../../../shared/schemas/media';

/** A small view of a stored photo; while its sizes are made, the original (or a quiet block) stands in. */
export function PhotoThumb({ media, className = 'h-20 w-28' }: { media: MediaItem; className?: string }) {
  if (!media.src) return <span aria-hidden="true" className={`${className} block shrink-0 border border-rule bg-paper-2`} />;
  return (
    <img
      src={media.src}
      srcSet={media.srcset || undefined}
      sizes="112px"
      alt=""
      width={media.width ?? 112}
      height={media.height ?? 80}
      loading="lazy"
      className={`${className} shrink-0 border border-rule bg-paper-2 object-cover`}
    />
  );
}

/** The photo's words for people who cannot see it, or a plain warning that it has none yet. */
export function photoLabel(media: MediaItem): string {
  return media.altText?.trim() ? media.altText : 'Not described yet';
}
